// The cover: project, date, Islet version, file and its SHA-256, the study at a glance and the caution.
import { escapeHtml } from "./escapeHtml.ts";
import { REPORT_CAUTION } from "./reportCaution.ts";
import type { ReportInput } from "./reportTypes.ts";

export function coverSection(input: ReportInput): string {
  const { project, study, meta } = input;
  const count = (s: string) => study.verdicts.filter((v) => v.status === s).length;
  const facts: [string, string][] = [
    ["Project", project.meta.name],
    ["Author", project.meta.author || "–"],
    ["Report date", meta.date],
    ["Islet version", meta.version],
    ["Project file", meta.fileName],
    ["File SHA-256", meta.fileSha256],
    ["Scenarios", String(project.scenarios.length)],
    ["Fault cases", String(study.cases.length)],
    ["Verdicts", `${count("fail")} fail, ${count("warn")} warn, ${count("pass")} pass`],
  ];
  return `<section class="cover" id="cover">
<p class="kicker">Islet protection study</p>
<h1>${escapeHtml(project.meta.name)}</h1>
${project.meta.description ? `<p class="lede">${escapeHtml(project.meta.description)}</p>` : ""}
<dl class="facts">
${facts.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd${k === "File SHA-256" ? ' class="hash"' : ""}>${escapeHtml(v)}</dd>`).join("\n")}
</dl>
<p class="caution cover-caution" role="note"><strong>Caution.</strong> ${escapeHtml(REPORT_CAUTION)}</p>
</section>`;
}
