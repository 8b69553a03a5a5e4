// The clearing timelines of the cases that matter, chosen by the study from its simulated results (no isolation,
// unwanted operations, the slowest isolation of each zone), and of failed cases asked for beside them: what
// operates, in which order, what is lost against the expected isolation.
import type { Project } from "../model/schema.ts";
import type { CaseResult, ClearingTimeline, StudyResult } from "../study/types.ts";
import { escapeHtml } from "./escapeHtml.ts";
import { formatNumber } from "./formatNumber.ts";
import { htmlTable } from "./htmlTable.ts";

export function failedTimelines(study: StudyResult, extra: readonly ClearingTimeline[] = []): ClearingTimeline[] {
  const failed = new Set(study.verdicts.filter((v) => v.status === "fail" && v.caseId).map((v) => v.caseId!));
  const out: ClearingTimeline[] = [];
  const seen = new Set<string>();
  // the study's own timelines are the cases that matter; extra ones are shown where the case failed
  for (const t of study.timelines)
    if (!seen.has(t.caseId)) {
      seen.add(t.caseId);
      out.push(t);
    }
  for (const t of extra)
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
De-energised: ${escapeHtml(t.deenergisedBuses.join(", ") || "none")} (${formatNumber(t.loadLost_kW, 0)} kW lost); expected isolation by ${escapeHtml(t.ideal.devices.join(", ") || "–")}: ${escapeHtml(t.ideal.deenergisedBuses.join(", ") || "none")} (${formatNumber(t.ideal.loadLost_kW, 0)} kW).</p>
${events}
</div>`;
  });
  void project;
  return `<section id="timelines" class="break">
<h2>7 Clearing timelines of the cases that matter</h2>
<p>Every case is simulated: the fault is re-solved after each device opens, so later devices see the redistributed currents. Shown here are the cases the simulation singles out: no isolation, devices operating outside the expected isolation, and the slowest isolation of each zone.</p>
${blocks.length ? blocks.join("\n") : '<p class="note">No case needed a timeline: every fault was isolated by its expected devices.</p>'}
</section>`;
}
