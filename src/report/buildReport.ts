// The study report: one self-contained printable HTML document (all CSS and SVG inline, no external
// requests), the fault and settings tables as CSV, and every plot as SVG. Pure: the same input gives
// byte-identical output.
import { escapeHtml } from "./escapeHtml.ts";
import { assumptionsSection } from "./assumptionsSection.ts";
import { coverSection } from "./coverSection.ts";
import { faultSection } from "./faultSection.ts";
import { faultsCsv } from "./faultsCsv.ts";
import { oneLineSvg } from "./oneLineSvg.ts";
import { openItemsSection } from "./openItemsSection.ts";
import { groundPlotWanted, pathPlot } from "./pathPlot.ts";
import { protectionPaths } from "./protectionPaths.ts";
import { REPORT_CAUTION } from "./reportCaution.ts";
import { reportCss } from "./reportCss.ts";
import type { ReportInput, ReportOutput, ReportPlot } from "./reportTypes.ts";
import { settingsCsv } from "./settingsCsv.ts";
import { settingsSection } from "./settingsSection.ts";
import { settingsTable } from "./settingsTable.ts";
import { tccPlotSvg } from "./tccPlotSvg.ts";
import { tccSection, type PlotEntry } from "./tccSection.ts";
import { failedTimelines, timelineSection } from "./timelineSection.ts";
import { verdictRefs } from "./verdictRefs.ts";
import { verdictSection } from "./verdictSection.ts";
import { verdictsCsv } from "./verdictsCsv.ts";

const CONTENTS: [string, string][] = [
  ["assumptions", "Assumptions"],
  ["oneline", "One-line diagram"],
  ["faults", "Fault currents"],
  ["settings", "Device settings"],
  ["verdicts", "Coordination verdicts"],
  ["tcc", "Time-current plots"],
  ["timelines", "Clearing timelines of the cases that matter"],
  ["open-items", "Open items"],
];

export function buildReport(input: ReportInput): ReportOutput {
  const { project, study, faults, meta } = input;
  const settings = settingsTable(project);
  const refs = verdictRefs(study.verdicts);
  const scenarioName = new Map(project.scenarios.map((s) => [s.id, s.name] as const));

  const oneLine: ReportPlot = { name: "oneline", title: `One-line diagram of ${project.meta.name}`, svg: oneLineSvg(project) };
  const entries: PlotEntry[] = protectionPaths(study.cases).flatMap((path, k) => {
    const name = `path-${String(k + 1).padStart(2, "0")}`;
    // an earth-fault plot where a device at the primary's voltage has an element on residual current
    const quantities: ("phase" | "ground")[] = groundPlotWanted(project, path) ? ["phase", "ground"] : ["phase"];
    return quantities.map((q) => {
      const { input: plotInput, problems } = pathPlot(project, path, k + 1, q);
      return {
        plot: { name: q === "phase" ? name : `${name}-earth`, title: plotInput.title, svg: tccPlotSvg(plotInput) },
        path,
        scenarioNames: path.scenarios.map((s) => scenarioName.get(s) ?? s),
        problems,
      };
    });
  });
  const timelines = failedTimelines(study, input.extraTimelines);

  const body = [
    coverSection(input),
    `<nav class="contents"><h2>Contents</h2><ol>${CONTENTS.map(([id, t]) => `<li><a href="#${id}">${escapeHtml(t)}</a></li>`).join("")}</ol></nav>`,
    assumptionsSection(project),
    `<section id="oneline" class="break oneline-page wide-page"><h2>2 One-line diagram</h2><figure class="plot">${oneLine.svg}<figcaption>${escapeHtml(oneLine.title)}: buses as bars (teal above 1 kV, brown at low voltage), transformers as two circles, lines and cables as impedance boxes, protective devices beside the element they look into (relays with their IEEE C37.2 numbers, LV breakers as crossed squares, fuses as boxes with a line).</figcaption></figure></section>`,
    faultSection(project, faults),
    settingsSection(settings),
    verdictSection(project, study, refs, { listPasses: input.listPasses }),
    tccSection(entries),
    timelineSection(project, study, timelines),
    openItemsSection(project, study, refs, {
      validationWarnings: input.validationWarnings,
      studyWarnings: study.warnings,
      faultMessages: faults.messages,
      plotProblems: entries.flatMap((e) => e.problems.map((p) => `${e.plot.title}: ${p}`)),
    }),
  ];
  const title = `${project.meta.name}: protection study report`;
  const html = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="Islet ${escapeHtml(meta.version)}">
<title>${escapeHtml(title)}</title>
<style>${reportCss(input.pageSize ?? "A4", `${project.meta.name} · Islet protection study`, meta.date)}</style>
</head>
<body>
${body.join("\n")}
<footer class="screen-caution" role="note">${escapeHtml(REPORT_CAUTION)}</footer>
</body>
</html>
`;
  return {
    html,
    faultsCsv: faultsCsv(faults),
    settingsCsv: settingsCsv(settings),
    verdictsCsv: verdictsCsv(study.verdicts, refs),
    plots: [oneLine, ...entries.map((e) => e.plot)],
  };
}
