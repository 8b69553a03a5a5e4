// The settings table in the report: pickups in primary and CT secondary amperes, multipliers, delays, CT ratios.
import { escapeHtml } from "./escapeHtml.ts";
import { formatNumber, formatSignificant } from "./formatNumber.ts";
import { htmlTable } from "./htmlTable.ts";
import type { SettingsRow } from "./settingsTable.ts";
import { FUSE_FAMILY_NOTE } from "../protection/index.ts";

const ELEMENT_TITLE: Record<string, string> = { "long-time": "Long time", "short-time": "Short time", instantaneous: "Instantaneous", "ground-fault": "Ground fault", fuse: "Fuse" };

export function settingsSection(rows: readonly SettingsRow[]): string {
  const hasParametricFuse = rows.some((r) => r.deviceKind === "fuse" && r.curve.includes("illustrative"));
  return `<section id="settings" class="break wide-page">
<h2>4 Device settings</h2>
<p>Relay functions carry their IEEE C37.2 device number and the curve by its standard name; pickups are given in primary amperes and in CT secondary amperes. LV trip units list their regions (long time, short time, instantaneous, ground fault); fuses their rated current and family.</p>
${htmlTable(
  ["Device", "Location", "Function / region", "IEEE C37.2", "Curve", "Pickup (primary A)", "Pickup (secondary A)", "TMS / TD", "Delay (s)", "CT ratio", "Notes"],
  rows.map((r) => [
    `<strong>${escapeHtml(r.device)}</strong>${r.deviceName ? `<br><span class="small">${escapeHtml(r.deviceName)}</span>` : ""}`,
    escapeHtml(r.location),
    escapeHtml(ELEMENT_TITLE[r.element] ?? r.element) + (r.enabled ? "" : ' <span class="off">(disabled)</span>'),
    escapeHtml(r.ieee || "–"),
    escapeHtml(r.curve),
    formatSignificant(r.pickupPrimary_A, 4),
    r.pickupSecondary_A === null ? "–" : formatNumber(r.pickupSecondary_A, 3),
    r.multiplier === null ? "–" : formatNumber(r.multiplier, 3),
    r.delay_s === null ? "–" : formatNumber(r.delay_s, 3),
    escapeHtml(r.ctRatio || "–"),
    escapeHtml(r.notes + (r.tMin_s !== null ? `; min time ${r.tMin_s} s` : "")),
  ]),
  {
    className: "data settings",
    columnClasses: ["", "", "", "", "", "num", "num", "num", "num", "", "small"],
    rowAttributes: (i) => `data-device="${escapeHtml(rows[i].device)}" data-element="${escapeHtml(rows[i].element)}"`,
  },
)}
${hasParametricFuse ? `<p class="note">${escapeHtml(FUSE_FAMILY_NOTE)}</p>` : ""}
</section>`;
}
