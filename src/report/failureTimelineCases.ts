// Which failed cases get a clearing timeline in the report beyond the study's own: per scenario, the bus
// faults with the most failed verdicts (a few per scenario keep the report readable).
import type { StudyResult } from "../study/types.ts";

export interface TimelineRequest {
  caseId: string;
  scenario: string;
  bus: string;
  faultType: StudyResult["cases"][number]["faultCase"]["faultType"];
  limit: StudyResult["cases"][number]["faultCase"]["limit"];
}

export function failureTimelineCases(study: StudyResult, perScenario = 3): TimelineRequest[] {
  const have = new Set(study.timelines.map((t) => t.caseId));
  const fails = new Map<string, number>();
  for (const v of study.verdicts) if (v.status === "fail" && v.caseId) fails.set(v.caseId, (fails.get(v.caseId) ?? 0) + 1);
  const byScenario = new Map<string, { req: TimelineRequest; fails: number; order: number }[]>();
  study.cases.forEach((c, order) => {
    const f = fails.get(c.faultCase.id) ?? 0;
    const loc = c.faultCase.location;
    if (f === 0 || loc.kind !== "bus" || have.has(c.faultCase.id)) return;
    const list = byScenario.get(c.faultCase.scenario) ?? [];
    list.push({ req: { caseId: c.faultCase.id, scenario: c.faultCase.scenario, bus: loc.bus, faultType: c.faultCase.faultType, limit: c.faultCase.limit }, fails: f, order });
    byScenario.set(c.faultCase.scenario, list);
  });
  const out: TimelineRequest[] = [];
  for (const list of byScenario.values()) {
    list.sort((a, b) => b.fails - a.fails || a.order - b.order);
    out.push(...list.slice(0, perScenario).map((x) => x.req));
  }
  return out;
}
