// The settings table: one row per relay function, per LV trip-unit region and per fuse, with pickups in
// primary amperes (and CT secondary amperes for relays), time multipliers, delays and CT ratios.
import { isProtectiveDevice, type Element, type LvBreaker, type Project, type ProtectiveDevice, type Relay } from "../model/schema.ts";
import { CURVE_TITLES, FUSE_FAMILY_TITLES, toSecondary_A } from "../protection/index.ts";
import { deviceBus } from "../model/deviceBus.ts";

export interface SettingsRow {
  device: string;
  deviceName: string;
  deviceKind: ProtectiveDevice["kind"];
  /** Where the device sits, e.g. `C-INC from end, bus MV-POC`. */
  location: string;
  /** Relay function id, LV trip-unit region or "fuse". */
  element: string;
  /** IEEE C37.2 device number (relay functions only). */
  ieee: string;
  /** Curve by its standard name, LV region characteristic or fuse family. */
  curve: string;
  pickupPrimary_A: number | null;
  pickupSecondary_A: number | null;
  /** IEC TMS or IEEE time dial (inverse curves only). */
  multiplier: number | null;
  delay_s: number | null;
  tMin_s: number | null;
  ctRatio: string;
  enabled: boolean;
  notes: string;
}

const KIND_ORDER: Record<ProtectiveDevice["kind"], number> = { relay: 0, fuse: 1, lvbreaker: 2 };

function location(d: ProtectiveDevice, byId: ReadonlyMap<string, Element>): string {
  const bus = deviceBus(d, byId);
  const end = d.at.end === "terminal" ? "terminals" : `${d.at.end} end`;
  return `${d.at.element} ${end}${bus ? `, bus ${bus}` : ""}`;
}

function relayRows(r: Relay, where: string): SettingsRow[] {
  const ct = `${r.ctPrimary_A}/${r.ctSecondary_A}`;
  return r.functions.map((f) => {
    const inverse = f.curve !== "definite-time";
    const notes = [
      f.quantity === "phase" ? "phase current" : f.quantity === "residual" ? "residual 3I0" : "negative sequence I2",
      f.direction !== "non-directional" ? `${f.direction}, RCA ${f.rca_deg}°` : "",
      f.restraint ? `voltage restraint: full above ${f.restraint.vFull_pu} pu, x${f.restraint.kMin} at 0 V` : "",
      f.tMax_s !== undefined ? `max ${f.tMax_s} s` : "",
      inverse && f.reset === "ieee" ? "IEEE reset" : "",
      `breaker ${r.breakerTime_s} s`,
    ].filter(Boolean);
    return {
      device: r.id,
      deviceName: r.name ?? "",
      deviceKind: r.kind,
      location: where,
      element: f.id,
      ieee: f.ansi,
      curve: CURVE_TITLES[f.curve],
      pickupPrimary_A: f.pickup_A,
      pickupSecondary_A: toSecondary_A(r, f.pickup_A),
      multiplier: inverse ? f.multiplier : null,
      delay_s: inverse ? null : f.delay_s,
      tMin_s: f.tMin_s > 0 ? f.tMin_s : null,
      ctRatio: ct,
      enabled: f.enabled,
      notes: notes.join("; "),
    };
  });
}

function lvRows(b: LvBreaker, where: string): SettingsRow[] {
  const ir_A = b.longTime.ir_x * b.in_A;
  const base = { device: b.id, deviceName: b.name ?? "", deviceKind: b.kind, location: where, ieee: "", pickupSecondary_A: null, multiplier: null, tMin_s: null, ctRatio: "", enabled: true } as const;
  const rows: SettingsRow[] = [
    {
      ...base,
      element: "long-time",
      curve: "I²t long-time band",
      pickupPrimary_A: ir_A,
      delay_s: b.longTime.tr_s,
      notes: `Ir ${b.longTime.ir_x} x In ${b.in_A} A; tr ${b.longTime.tr_s} s at ${b.longTime.ref_x} x Ir; mechanism ${b.clearing_s} s`,
    },
  ];
  if (b.shortTime)
    rows.push({
      ...base,
      element: "short-time",
      curve: b.shortTime.i2t ? "Definite time with I²t ramp" : "Definite time",
      pickupPrimary_A: b.shortTime.isd_x * ir_A,
      delay_s: b.shortTime.tsd_s,
      notes: `Isd ${b.shortTime.isd_x} x Ir`,
    });
  if (b.instantaneous)
    rows.push({ ...base, element: "instantaneous", curve: "Instantaneous", pickupPrimary_A: b.instantaneous.ii_x * b.in_A, delay_s: null, notes: `Ii ${b.instantaneous.ii_x} x In` });
  if (b.groundFault)
    rows.push({
      ...base,
      element: "ground-fault",
      curve: b.groundFault.i2t ? "Definite time with I²t ramp" : "Definite time",
      pickupPrimary_A: b.groundFault.ig_A,
      delay_s: b.groundFault.tg_s,
      notes: "residual current",
    });
  return rows;
}

export function settingsTable(project: Project): SettingsRow[] {
  const byId = new Map(project.elements.map((e) => [e.id, e] as const));
  const devices = project.elements.filter(isProtectiveDevice).sort((a, b) => KIND_ORDER[a.kind] - KIND_ORDER[b.kind] || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const rows: SettingsRow[] = [];
  for (const d of devices) {
    const where = location(d, byId);
    if (d.kind === "relay") rows.push(...relayRows(d, where));
    else if (d.kind === "lvbreaker") rows.push(...lvRows(d, where));
    else
      rows.push({
        device: d.id,
        deviceName: d.name ?? "",
        deviceKind: d.kind,
        location: where,
        element: "fuse",
        ieee: "",
        curve: d.curve.kind === "parametric" ? FUSE_FAMILY_TITLES[d.curve.family] : `Tabulated melting/clearing points (${d.curve.melt.length}/${d.curve.clear.length})`,
        pickupPrimary_A: d.rating_A,
        pickupSecondary_A: null,
        multiplier: null,
        delay_s: null,
        tMin_s: null,
        ctRatio: "",
        enabled: true,
        notes: `rated current ${d.rating_A} A`,
      });
  }
  return rows;
}
