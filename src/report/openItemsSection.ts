// Open items: what a reviewer must resolve or accept. Notes and warnings first (validation, study, the fuse
// let-through note), then every failed and warned verdict, grouped by check and device with its references.
import type { Project } from "../model/schema.ts";
import { FUSE_LET_THROUGH_NOTE } from "../protection/index.ts";
import type { StudyResult, Verdict, VerdictStatus } from "../study/types.ts";
import { escapeHtml } from "./escapeHtml.ts";
import { htmlTable } from "./htmlTable.ts";

export interface OpenNotes {
  validationWarnings: readonly string[];
  studyWarnings: readonly string[];
  faultMessages: readonly string[];
  plotProblems: readonly string[];
}

export function openItemsSection(project: Project, study: StudyResult, refs: ReadonlyMap<string, string>, notes: OpenNotes): string {
  const fuses = project.elements.filter((e) => e.kind === "fuse").map((e) => e.id);
  const items: [string, string][] = [
    ...notes.validationWarnings.map((w): [string, string] => ["Validation", w]),
    ...notes.studyWarnings.map((w): [string, string] => ["Study", w]),
    ...notes.faultMessages.map((w): [string, string] => ["Fault currents", w]),
    ...notes.plotProblems.map((w): [string, string] => ["Plots", w]),
    ["Scope", `${FUSE_LET_THROUGH_NOTE}${fuses.length ? ` Fuses in this project: ${fuses.join(", ")}.` : ""}`],
  ];
  const groups = new Map<string, { status: VerdictStatus; kind: string; device: string; other: string | null; list: Verdict[] }>();
  for (const v of study.verdicts) {
    if (v.status === "pass") continue;
    const key = `${v.status}|${v.kind}|${v.device}|${v.other ?? ""}`;
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { status: v.status, kind: v.kind, device: v.device, other: v.other, list: [] }));
    g.list.push(v);
  }
  const rows = [...groups.values()].sort((a, b) => (a.status === b.status ? 0 : a.status === "fail" ? -1 : 1));
  const verdictTable = rows.length
    ? htmlTable(
        ["Status", "Check", "Device", "Count", "Example", "Verdicts"],
        rows.map((g) => [
          `<span class="badge ${g.status}">${g.status}</span>`,
          g.kind,
          escapeHtml(g.device + (g.other ? ` / ${g.other}` : "")),
          String(g.list.length),
          escapeHtml(g.list[0].explanation),
          g.list.map((v) => `<a href="#v-${refs.get(v.id)}">${refs.get(v.id)}</a>`).join(" "),
        ]),
        { className: "data open", columnClasses: ["", "", "", "num", "", "refs"], rowAttributes: (i) => `class="${rows[i].status}"` },
      )
    : '<p class="note">No failed or warned verdicts.</p>';
  return `<section id="open-items" class="break wide-page">
<h2>8 Open items</h2>
<h3>Notes and warnings</h3>
${htmlTable(["Source", "Item"], items.map(([a, b]) => [escapeHtml(a), escapeHtml(b)]), { className: "data notes" })}
<h3>Failed and warned verdicts</h3>
<p>Every failed and warned verdict, grouped by check and device; the references lead to the verdict tables.</p>
${verdictTable}
</section>`;
}
