// A clearing timeline a person reads: one case simulated again state by state with the currents of every
// step kept (the study's own pass keeps only the steps). Same simulation, same result.
import type { Project } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import { deviceResponse } from "../deviceResponse.ts";
import { CaseSimulation, firstState } from "../operation/simulateCase.ts";
import { deenergised } from "../operation/supply.ts";
import type { StudySolver } from "../studySolver.ts";
import type { CaseResult, ClearingTimeline, DeviceResponse, TimelineEvent } from "../types.ts";
import { fmtS } from "../verdicts/format.ts";
import type { WithstandFn } from "../withstand.ts";
import type { ScenarioPlan } from "./scenarioPlan.ts";

export function replayTimeline(args: {
  project: Project;
  sp: ScenarioPlan;
  index: number;
  result: CaseResult;
  solver: StudySolver;
  model: DeviceModel;
  withstand: WithstandFn;
}): ClearingTimeline {
  const { project, sp, index, result, solver, model } = args;
  const fc = result.faultCase;
  const lp = sp.plans.get(fc.faultType)![index];
  const horizon_s = project.criteria.horizon_s;
  const sim = new CaseSimulation({ net: sp.net, isolation: sp.isolation, faultZone: lp.faultZone, isolatedAtStart: lp.isolatedAtStart, model, horizon_s, outOfReach: lp.plan.outOfReach, withstand: args.withstand, recordCurrents: true });
  let snap = solver.solveOne(sp.scenario, fc.location, fc.faultType, fc.limit, []);
  const responses = new Map<string, DeviceResponse>();
  for (const id in snap.readings) if (sp.net.deviceEdge.has(id)) responses.set(id, deviceResponse(sp.net.devices.get(id)!, snap.readings[id], model));
  if (snap.iFault_A >= 1)
    for (let open = sim.advance(firstState(sp.net, snap, responses, args.withstand)); open; open = sim.advance(snap)) snap = solver.solveOne(sp.scenario, fc.location, fc.faultType, fc.limit, open);
  const outcome = sim.outcome();
  const final = deenergised(sp.net, new Set(outcome.openEdges));
  const ideal = deenergised(sp.net, new Set(lp.plan.edges));
  const events: TimelineEvent[] = outcome.steps
    .filter((s) => s.action !== "stuck")
    .map((s) => ({
      t_s: s.t_s,
      device: s.device,
      deviceName: sp.net.devices.get(s.device)?.name ?? "",
      action: s.action as TimelineEvent["action"],
      element: s.element,
      currents: s.currents ?? [],
    }));
  const opened = events.filter((e) => e.action === "open" || e.action === "clear").map((e) => e.device);
  const unwanted = result.operation.unwanted;
  let summary: string;
  if (outcome.isolated_s !== null) {
    summary = `isolated at ${fmtS(outcome.isolated_s)} by ${opened.join(", ") || "no device (no energising source connected)"}; ${final.load_kW.toFixed(0)} kW lost (expected isolation ${ideal.load_kW.toFixed(0)} kW)`;
    if (unwanted.length) summary += `; unwanted: ${unwanted.join(", ")}`;
    if (lp.plan.outOfReach.length) summary += `; still fed by ${lp.plan.outOfReach.join(", ")}, which no device of the project can disconnect`;
  } else if (opened.length === 0) summary = `not isolated: nothing operates within ${fmtS(horizon_s)}`;
  else summary = `not isolated within ${fmtS(horizon_s)}: only ${opened.join(", ")} opened`;
  return {
    caseId: fc.id,
    events,
    isolated: outcome.isolated_s !== null,
    clearedAt_s: outcome.isolated_s,
    horizon_s,
    deenergisedBuses: final.buses,
    loadLost_kW: Math.round(final.load_kW * 10) / 10,
    ideal: { devices: lp.plan.devices, deenergisedBuses: ideal.buses, loadLost_kW: Math.round(ideal.load_kW * 10) / 10 },
    summary,
  };
}

/**
 * The cases that matter for a reader, chosen from the simulated results: unwanted operations, no isolation,
 * and the slowest isolation in each zone; at most `most` per scenario, the most severe first.
 */
export function casesThatMatter(results: readonly CaseResult[], most = 6): number[] {
  const score = (c: CaseResult): number => {
    const o = c.operation;
    if (c.iFault_A < 1) return -1;
    if (o.isolated_s === null) return 3e6;
    if (o.unwanted.length) return 2e6 + o.loadLost_kW;
    return o.isolated_s;
  };
  const slowestPerZone = new Map<string, number>();
  results.forEach((c, i) => {
    if (c.operation.isolated_s === null || c.operation.unwanted.length) return;
    const zone = c.operation.zoneBuses.join(",");
    const best = slowestPerZone.get(zone);
    if (best === undefined || score(results[best]) < score(c)) slowestPerZone.set(zone, i);
  });
  const picked = new Set<number>(slowestPerZone.values());
  results.forEach((c, i) => {
    if (c.operation.isolated_s === null || c.operation.unwanted.length) picked.add(i);
  });
  return [...picked].filter((i) => score(results[i]) >= 0).sort((a, b) => score(results[b]) - score(results[a]) || a - b).slice(0, most);
}
