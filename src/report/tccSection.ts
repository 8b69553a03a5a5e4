// The time-current plots of every protection path, inline as SVG.
import { escapeHtml } from "./escapeHtml.ts";
import type { ReportPlot } from "./reportTypes.ts";
import type { ProtectionPath } from "./protectionPaths.ts";

export interface PlotEntry {
  plot: ReportPlot;
  path: ProtectionPath;
  scenarioNames: string[];
  problems: string[];
}

export function tccSection(entries: readonly PlotEntry[]): string {
  const figures = entries.map(
    (e) => `<figure class="plot" id="${escapeHtml(e.plot.name)}">
${e.plot.svg}
<figcaption>${escapeHtml(e.plot.title)}. Scenarios: ${escapeHtml(e.scenarioNames.join("; "))}.${e.problems.length ? ` Not drawn: ${escapeHtml(e.problems.join("; "))}.` : ""}</figcaption>
</figure>`,
  );
  return `<section id="tcc" class="break">
<h2>6 Time-current plots</h2>
<p>One plot per protection path (the devices met from a fault outward to a source, primary first) on phase current, and a second on residual current 3I0 where a device of the path has an earth-fault element; a device without one is drawn with the phase elements that clear the earth fault. Earth-fault plots keep the devices at the primary device's voltage, since residual current does not refer across a transformer by its voltage ratio. Each device is drawn with its nominal clearing curve and its tolerance band (fast edge to slow edge; fuses from melting to total clearing). Dashed lines are equipment withstand curves, dotted lines motor starting, crosses transformer inrush; red dashed verticals mark the largest and smallest fault current the primary device carries as primary.</p>
${figures.length ? figures.join("\n") : '<p class="note">The study found no protection path (no device between a fault and a source).</p>'}
</section>`;
}
