// Assumptions: the calculation method and edition, the voltage factors used, the inverter models, the engine's
// conventions where the standard leaves a choice, the study settings and the coordination criteria, all read from
// the project.
import type { Project } from "../model/schema.ts";
import { engineConventions, voltageFactor } from "../engine/index.ts";
import { escapeHtml } from "./escapeHtml.ts";
import { formatNumber } from "./formatNumber.ts";
import { htmlTable } from "./htmlTable.ts";

export function assumptionsSection(project: Project): string {
  const s = project.study;
  const c = project.criteria;
  const classic = s.method === "classic";
  const method = classic
    ? `Classic method: every source behind its impedance at a prefault voltage of ${formatNumber(s.prefault_pu, 3)} pu; no IEC 60909 voltage factor or impedance corrections.`
    : "IEC 60909-0:2016: equivalent voltage source c·Un/√3 at the fault, with the correction factors KT (network transformers) and KG (generators) of that edition.";
  const levels = [...new Set(project.elements.filter((e) => e.kind === "bus").map((b) => b.un_kV))].sort((a, b) => a - b);
  const cRows = levels.map((u) => [
    `${formatNumber(u, u < 1 ? 3 : 1)} kV`,
    classic ? formatNumber(s.prefault_pu, 3) : formatNumber(voltageFactor(u, "max", s.lvTolerance_pct), 2),
    classic ? formatNumber(s.prefault_pu, 3) : formatNumber(voltageFactor(u, "min", s.lvTolerance_pct), 2),
  ]);
  const used = s.inverterModel === "refined" ? "Islet's refined voltage-dependent model" : "IEC 60909 full-size converter superposition";
  const settings: [string, string][] = [
    ["Frequency", `${project.meta.frequency_Hz} Hz`],
    ["Per-unit base", `${formatNumber(project.meta.baseMVA, 1)} MVA`],
    ["LV voltage tolerance", `+${s.lvTolerance_pct} % (selects cmax ${s.lvTolerance_pct === 6 ? "1.05" : "1.10"} at LV)`],
    ["Minimum time delay for Ib", `${formatNumber(s.breakingTime_s, 2)} s`],
    ["Fault duration for Ith", `${formatNumber(s.thermalTime_s, 2)} s`],
    ["Conductor end temperature (minimum currents)", `${formatNumber(s.conductorEndTemp_C, 0)} °C`],
    ["Fault impedance", `${formatNumber(s.faultR_ohm, 3)} + j${formatNumber(s.faultX_ohm, 3)} Ω`],
  ];
  const criteria: [string, string][] = [
    ["Coordination time interval (CTI)", `${formatNumber(c.cti_s, 2)} s`],
    ...c.pairCti.map((p): [string, string] => [`CTI for ${p.primary} backed up by ${p.backup}`, `${formatNumber(p.cti_s, 2)} s`]),
    ["Primary-zone margin (end-of-zone fault current / pickup)", `≥ ${formatNumber(c.primaryMargin, 2)}`],
    ["Backup-zone margin", `≥ ${formatNumber(c.backupMargin, 2)}`],
    ["Load margin (pickup / maximum load current)", `≥ ${formatNumber(c.loadMargin, 2)}`],
    ["Isolation time limit where a zone's buses set none", c.clearingLimit_s === undefined ? "none (zones are judged against equipment withstand only)" : `${formatNumber(c.clearingLimit_s, 2)} s`],
    ["Clearing timeline horizon", `${formatNumber(c.horizon_s, 1)} s`],
    ["Fault points along lines", c.linePoints_pct.map((p) => `${p} %`).join(", ") || "none"],
  ];
  const kv = (rows: [string, string][]) => htmlTable(["Item", "Value"], rows.map(([a, b]) => [escapeHtml(a), escapeHtml(b)]), { className: "kv" });
  return `<section id="assumptions" class="break">
<h2>1 Assumptions</h2>
<h3>Short-circuit method</h3>
<p>${escapeHtml(method)} Maximum currents use cmax and all sources in service in the scenario; minimum currents use cmin and the minimum grid short-circuit power.</p>
${htmlTable(["Nominal voltage", classic ? "Prefault voltage, max (pu)" : "cmax", classic ? "Prefault voltage, min (pu)" : "cmin"], cRows, { className: "narrow", columnClasses: ["", "num", "num"] })}
<h3>Inverter-based sources</h3>
<p>Two models are computed for every fault. The IEC 60909 full-size converter superposition treats each converter as a positive-sequence current source at its fault-current limit. Islet's refined voltage-dependent model iterates each converter's reactive current on its terminal voltage (k-factor, current limit, and a voltage-source model for grid-forming units). The protection checks use the <strong>${escapeHtml(used)}</strong>.</p>
<h3>Conventions where the standard leaves a choice</h3>
${engineConventions(s.method).map((x) => `<p class="convention"><strong>${escapeHtml(x.topic)}.</strong> ${escapeHtml(x.text)}</p>`).join("\n")}
<h3>Study settings</h3>
${kv(settings)}
<h3>Coordination criteria</h3>
${kv(criteria)}
<p class="note">Time-current plots show phase elements with their tolerance bands, clearing times including breaker and mechanism times. Currents on each plot are referred to the voltage of the path's primary device.</p>
</section>`;
}
