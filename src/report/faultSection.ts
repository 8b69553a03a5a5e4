// The fault tables: per scenario, I"k per bus and fault type for the maximum and minimum calculation,
// with the peak current ip and X/R (three-phase basis).
import type { Project } from "../model/schema.ts";
import { escapeHtml } from "./escapeHtml.ts";
import type { FaultTable } from "./faultTable.ts";
import { formatNumber } from "./formatNumber.ts";
import { htmlTable } from "./htmlTable.ts";

export function faultSection(project: Project, table: FaultTable): string {
  const parts: string[] = [];
  for (const scenario of project.scenarios) {
    const rows = table.rows.filter((r) => r.scenario === scenario.id);
    const out = scenario.outOfService.length ? ` Out of service: ${scenario.outOfService.join(", ")}.` : "";
    parts.push(`<h3 id="faults-${escapeHtml(scenario.id)}">${escapeHtml(scenario.name)} <span class="id">(${escapeHtml(scenario.id)})</span></h3>`);
    parts.push(`<p class="note">${escapeHtml((scenario.description ?? "") + out)}</p>`);
    if (!rows.length) {
      parts.push(`<p class="note">No fault results for this scenario (see the open items).</p>`);
      continue;
    }
    parts.push(
      htmlTable(
        ["Bus", "Name", "Un (kV)", "Limit", 'I"k 3ph (kA)', 'I"k LL (kA)', 'I"k LG (kA)', 'I"k LLG (kA)', "ip (kA)", "X/R"],
        rows.map((r) => [
          escapeHtml(r.bus),
          escapeHtml(r.busName),
          formatNumber(r.un_kV, r.un_kV < 1 ? 3 : 1),
          r.limit,
          formatNumber(r.ikss_kA["3ph"], 3),
          formatNumber(r.ikss_kA.LL, 3),
          formatNumber(r.ikss_kA.LG, 3),
          formatNumber(r.ikss_kA.LLG, 3),
          formatNumber(r.ip_kA, 3),
          formatNumber(r.xr, 2),
        ]),
        {
          className: "data faults",
          columnClasses: ["", "", "num", "", "num", "num", "num", "num", "num", "num"],
          rowAttributes: (i) => `data-scenario="${escapeHtml(rows[i].scenario)}" data-bus="${escapeHtml(rows[i].bus)}" data-limit="${rows[i].limit}"`,
        },
      ),
    );
  }
  return `<section id="faults" class="break">
<h2>3 Fault currents</h2>
<p>Initial symmetrical short-circuit current I"k at every bus: three-phase (symmetrical), line-to-line (line current), line-to-earth and line-to-line-to-earth (earth current 3I0). Peak current ip and X/R are for the three-phase fault. Buses joined by a closed switch share one result.</p>
${parts.join("\n")}
</section>`;
}
