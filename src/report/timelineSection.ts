// The clearing timelines of failed cases: what operates, in which order, what is lost against the ideal isolation.
import type { Project } from "../model/schema.ts";
import type { CaseResult, ClearingTimeline, StudyResult } from "../study/types.ts";
import { escapeHtml } from "./escapeHtml.ts";
import { formatNumber } from "./formatNumber.ts";
import { htmlTable } from "./htmlTable.ts";

export function failedTimelines(study: StudyResult, extra: readonly ClearingTimeline[] = []): ClearingTimeline[] {
  const failed = new Set(study.verdicts.filter((v) => v.status === "fail" && v.caseId).map((v) => v.caseId!));
  const out: ClearingTimeline[] = [];
  const seen = new Set<string>();
  for (const t of [...study.timelines, ...extra])
    if (failed.has(t.caseId) && !seen.has(t.caseId)) {
      seen.add(t.caseId);
      out.push(t);
    }
  return out;
}

export function timelineSection(project: Project, study: StudyResult, timelines: readonly ClearingTimeline[]): string {
  const caseById = new Map<string, CaseResult>(study.cases.map((c) => [c.faultCase.id, c] as const));
  const blocks = timelines.map((t) => {
    const c = caseById.get(t.caseId);
    const label = c?.faultCase.label ?? t.caseId;
    const fails = study.verdicts.filter((v) => v.caseId === t.caseId && v.status === "fail").length;
    const events = t.events.length
      ? htmlTable(
          ["t (s)", "Device", "Action", "Element opened"],
          t.events.map((e) => [formatNumber(e.t_s, 3), escapeHtml(`${e.device}${e.deviceName ? ` (${e.deviceName})` : ""}`), e.action, escapeHtml(e.element ?? "–")]),
          { className: "data timeline", columnClasses: ["num", "", "", ""] },
        )
      : `<p class="note">No device operates within ${formatNumber(t.horizon_s, 1)} s.</p>`;
    return `<div class="timeline-block">
<h3>${escapeHtml(label)}</h3>
<p><strong>${escapeHtml(t.summary)}</strong>. ${fails} failed verdict${fails === 1 ? "" : "s"} in this case.
De-energised: ${escapeHtml(t.deenergisedBuses.join(", ") || "none")} (${formatNumber(t.loadLost_kW, 0)} kW lost); ideal isolation by ${escapeHtml(t.ideal.devices.join(", ") || "–")}: ${escapeHtml(t.ideal.deenergisedBuses.join(", ") || "none")} (${formatNumber(t.ideal.loadLost_kW, 0)} kW).</p>
${events}
</div>`;
  });
  void project;
  return `<section id="timelines" class="break">
<h2>7 Clearing timelines of failed cases</h2>
<p>Sequential clearing simulation: the fault is re-solved after each device opens, so later devices see the redistributed currents.</p>
${blocks.length ? blocks.join("\n") : '<p class="note">No failed case has a clearing timeline.</p>'}
</section>`;
}
