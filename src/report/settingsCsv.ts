// settings.csv: one row per relay function, LV trip-unit region and fuse; units in the header names.
import { csvTable } from "./csvTable.ts";
import type { SettingsRow } from "./settingsTable.ts";

export const SETTINGS_CSV_HEADER = [
  "device_id",
  "device_name",
  "device_kind",
  "location",
  "element",
  "ieee_c37_2",
  "curve",
  "pickup_primary_A",
  "pickup_secondary_A",
  "multiplier",
  "delay_s",
  "t_min_s",
  "ct_ratio",
  "enabled",
  "notes",
] as const;

const r6 = (x: number | null) => (x === null ? null : Number(x.toFixed(6)));

export function settingsCsv(rows: readonly SettingsRow[]): string {
  return csvTable(
    SETTINGS_CSV_HEADER,
    rows.map((r) => [
      r.device,
      r.deviceName,
      r.deviceKind,
      r.location,
      r.element,
      r.ieee,
      r.curve,
      r6(r.pickupPrimary_A),
      r6(r.pickupSecondary_A),
      r6(r.multiplier),
      r6(r.delay_s),
      r6(r.tMin_s),
      r.ctRatio,
      r.enabled ? "yes" : "no",
      r.notes,
    ]),
  );
}
