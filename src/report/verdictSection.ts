// The coordination verdicts, grouped by status with failures first: totals by kind, then every verdict with
// its numbers and its one-line explanation.
import type { Project } from "../model/schema.ts";
import { VERDICT_KINDS, type StudyResult, type Verdict, type VerdictStatus } from "../study/types.ts";
import { escapeHtml } from "./escapeHtml.ts";
import { formatSignificant } from "./formatNumber.ts";
import { htmlTable } from "./htmlTable.ts";

const GROUPS: { status: VerdictStatus; title: string }[] = [
  { status: "fail", title: "Failed" },
  { status: "warn", title: "Warnings" },
  { status: "pass", title: "Passed" },
];

function numbers(v: Verdict): string {
  return Object.entries(v.numbers)
    .map(([k, x]) => `${escapeHtml(k)}&nbsp;${formatSignificant(x, 4)}`)
    .join(", ");
}

/** `Name (id)` of an element, or its id where it has no name. */
function nameAndId(project: Project, id: string | null): string {
  if (id === null) return "";
  const name = project.elements.find((e) => e.id === id)?.name;
  return name ? `${name} (${id})` : id;
}

/** The device column: the device, and the other of a pair (its primary, or the infeed), by name. */
function deviceCell(project: Project, v: Verdict): string {
  return escapeHtml(nameAndId(project, v.device) + (v.other ? ` / ${nameAndId(project, v.other)}` : ""));
}

/** Passed verdicts by check and device: how many, and one of them as an example. */
function passSummary(project: Project, list: readonly Verdict[], refs: ReadonlyMap<string, string>): string {
  const groups = new Map<string, Verdict[]>();
  for (const v of list) {
    const key = `${v.kind}|${v.device}|${v.other ?? ""}`;
    groups.set(key, [...(groups.get(key) ?? []), v]);
  }
  const rows = [...groups.values()];
  return htmlTable(
    ["Check", "Device", "Count", "Example", "Refs"],
    rows.map((g) => [g[0].kind, deviceCell(project, g[0]), String(g.length), escapeHtml(g[0].explanation), `${refs.get(g[0].id)}…${refs.get(g[g.length - 1].id)}`]),
    { className: "data verdicts pass-summary", columnClasses: ["", "", "num", "", "small"] },
  );
}

export interface VerdictSectionOptions {
  /** List every passed verdict in full (default: a summary by check and device; verdicts.csv has them all). */
  listPasses?: boolean;
}

export function verdictSection(project: Project, study: StudyResult, refs: ReadonlyMap<string, string>, options: VerdictSectionOptions = {}): string {
  const totals = htmlTable(
    ["Check", "Fail", "Warn", "Pass"],
    VERDICT_KINDS.map((k) => [k, String(study.matrix.totals[k].fail), String(study.matrix.totals[k].warn), String(study.matrix.totals[k].pass)]),
    { className: "narrow totals", columnClasses: ["", "num", "num", "num"] },
  );
  const byScenario = htmlTable(
    ["Scenario", "Fail", "Warn", "Pass"],
    project.scenarios.map((s) => {
      const vs = study.verdicts.filter((v) => v.scenario === s.id);
      const c = (st: VerdictStatus) => String(vs.filter((v) => v.status === st).length);
      return [escapeHtml(s.name), c("fail"), c("warn"), c("pass")];
    }),
    { className: "narrow totals", columnClasses: ["", "num", "num", "num"] },
  );
  const groups = GROUPS.map(({ status, title }) => {
    const list = study.verdicts.filter((v) => v.status === status);
    if (!list.length) return `<h3 id="verdicts-${status}">${title} (0)</h3><p class="note">None.</p>`;
    if (status === "pass" && !options.listPasses)
      return `<h3 id="verdicts-${status}" class="status-${status}">${title} (${list.length})</h3>\n<p class="note">Summarised by check and device; every passed verdict with its numbers is in verdicts.csv.</p>\n${passSummary(project, list, refs)}`;
    const table = htmlTable(
      ["Ref", "Check", "Device", "Explanation (case and scenario at the end)", "Numbers"],
      list.map((v) => [
        `<a id="v-${refs.get(v.id)}"></a>${refs.get(v.id)}`,
        v.kind,
        deviceCell(project, v),
        escapeHtml(v.explanation),
        numbers(v),
      ]),
      {
        className: `data verdicts ${status}`,
        columnClasses: ["ref", "", "", "", "small"],
        rowAttributes: (i) => `class="${status}" data-verdict="${escapeHtml(list[i].id)}"`,
      },
    );
    return `<h3 id="verdicts-${status}" class="status-${status}">${title} (${list.length})</h3>\n${table}`;
  });
  return `<section id="verdicts" class="break wide-page">
<h2>5 Coordination verdicts</h2>
<p>Every check of the study: sensitivity (fault current over pickup at the end of each zone and pickup over load), selectivity (primary before backup by the CTI across tolerance bands), speed (primary clearing within the bus's limit), blinding (reach lost when an infeed is in service) and sympathetic tripping (a healthy feeder's device operating before the fault clears).</p>
<div class="twocol">${totals}${byScenario}</div>
${groups.join("\n")}
</section>`;
}
