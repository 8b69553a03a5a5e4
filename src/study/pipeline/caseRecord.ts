// Pass 3 of a scenario's study: each simulated case as the study reports it: its operation record (what
// should open, what did, what it cost), its chains for stepping through, and the verdicts of every
// per-case judge.
import type { ScenarioNetwork } from "../scenarioNetwork.ts";
import { backupDevices } from "../operation/expectedIsolation.ts";
import type { SimulationOutcome } from "../operation/simulateCase.ts";
import { deenergised } from "../operation/supply.ts";
import type { CaseOperation, CaseResult, ChainLink, DeviceResponse, FaultChains, OperationStep, Verdict } from "../types.ts";
import { judgeBackup } from "../judges/backup.ts";
import type { FailureCase, JudgeContext, JudgedCase } from "../judges/judgedCase.ts";
import { judgeSelectivity } from "../judges/selectivity.ts";
import { judgeSensitivity } from "../judges/sensitivity.ts";
import { judgeSpeed } from "../judges/speed.ts";
import type { SimulatedCase } from "./simulateScenario.ts";

const round1 = (x: number): number => Math.round(x * 10) / 10;

/** Load lost with the given edges open, memoised per opened set within a scenario. */
export function loadLostMemo(net: ScenarioNetwork): (edges: readonly number[]) => number {
  const memo = new Map<string, number>();
  return (edges) => {
    const key = edges.join(",");
    let v = memo.get(key);
    if (v === undefined) memo.set(key, (v = deenergised(net, new Set(edges)).load_kW));
    return v;
  };
}

const steps = (o: SimulationOutcome): OperationStep[] => o.steps.map((s) => ({ device: s.device, t_s: s.t_s, action: s.action, element: s.element }));

function chainsOf(c: SimulatedCase, failures: FailureCase[], net: ScenarioNetwork): FaultChains {
  // a backup row's margin is over its primary (the backups of one device act in parallel, not in a chain)
  const link = (device: string, depth: number, primary: DeviceResponse | undefined): ChainLink => {
    const r = c.responses.get(device);
    const fast = r?.tClearMin_s ?? null;
    const slow = primary?.tClearMax_s ?? null;
    return {
      device,
      deviceName: r?.deviceName ?? net.devices.get(device)?.name ?? "",
      depth,
      role: depth === 0 ? "primary" : "backup",
      current_A: r?.iPhase_A ?? 0,
      tClear_s: r?.tClear_s ?? null,
      marginToNext_s: depth > 0 && fast !== null && slow !== null ? fast - slow : null,
    };
  };
  const paths = c.lp.plan.edges.map((edge, k) => {
    const devices = c.lp.plan.devices.filter((d) => net.deviceEdge.get(d) === edge);
    const backups = failures[k] ? backupDevices(c.lp.plan, failures[k].plan) : [];
    const chain = [...devices.slice(0, 1), ...backups];
    const sources = c.lp.plan.beyond[k] ?? [];
    const source = sources[0] ?? "";
    const src = net.elements.get(source);
    return {
      source,
      sourceName: src?.name ?? source,
      sourceKind: (src?.kind ?? "grid") as "grid" | "generator" | "inverter",
      elements: [net.edges[edge].element],
      links: chain.map((d, k) => link(d, k === 0 ? 0 : 1, k === 0 ? undefined : c.responses.get(chain[0]))),
    };
  });
  return { caseId: c.fc.id, paths, idealIsolation: c.lp.plan.devices };
}

export function caseRecord(ctx: JudgeContext, c: SimulatedCase, atSensitivityLimit: boolean, loadLost: (edges: readonly number[]) => number): { result: CaseResult; verdicts: Verdict[] } {
  const { net } = ctx;
  const failures: FailureCase[] = c.lp.plan.edges.map((edge, k) => ({ edge, plan: c.lp.failures[k], outcome: c.failureOutcomes[k] }));
  const judged: JudgedCase = { fc: c.fc, iFault_A: c.iFault_A, responses: c.responses, plan: c.lp.plan, outcome: c.outcome, failures, atSensitivityLimit };
  const verdicts: Verdict[] =
    c.iFault_A >= 1 && c.unsolved === undefined
      ? [...judgeSensitivity(ctx, judged), ...judgeSelectivity(ctx, judged), ...judgeBackup(ctx, judged, loadLost), ...judgeSpeed(ctx, judged, c.lp.zoneBuses)]
      : [];
  const expectedEdges = new Set(c.lp.plan.edges);
  const unwanted = [...c.outcome.tripped.keys()].filter((d) => !expectedEdges.has(net.deviceEdge.get(d) ?? -1));
  const operation: CaseOperation = {
    zoneBuses: c.lp.zoneBuses,
    ideal: c.lp.plan.devices,
    backups: c.lp.plan.edges.map((edge, k) => ({
      device: expectedAt(c, edge, net),
      backups: backupDevices(c.lp.plan, c.lp.failures[k]),
    })),
    restrained: c.lp.plan.restrained,
    outOfReach: c.lp.plan.outOfReach,
    selfCeasing: c.lp.selfCeasing,
    operations: steps(c.outcome),
    isolated_s: c.iFault_A >= 1 || c.lp.isolatedAtStart ? c.outcome.isolated_s : null,
    unwanted,
    loadLost_kW: round1(loadLost(c.outcome.openEdges)),
    idealLoadLost_kW: round1(loadLost(c.lp.plan.edges)),
    withstand: c.outcome.withstand.filter((w) => w.used >= 0.01).map((w) => ({ element: w.element, used: Math.round(w.used * 1000) / 1000, peak_A: round1(w.peak_A) })),
    failures: failures.map((f, k) => ({
      device: expectedAt(c, f.edge, net),
      backups: backupDevices(c.lp.plan, f.plan),
      operations: steps(f.outcome),
      isolated_s: f.outcome.isolated_s,
      loadLost_kW: round1(loadLost(c.failureOutcomes[k].openEdges)),
    })),
  };
  // roles for the panes: expected devices are primaries, the devices that back them up are backups
  const backupSet = new Set(operation.backups.flatMap((b) => b.backups));
  c.lp.plan.edges.forEach((edge, k) => {
    for (const d of c.lp.plan.devices) if (net.deviceEdge.get(d) === edge) setRole(c, d, "primary", c.lp.plan.beyond[k] ?? []);
  });
  for (const d of backupSet) setRole(c, d, "backup", []);
  for (const v of verdicts) if (v.kind === "sympathetic") setRole(c, v.device, "sympathetic", []);
  const result: CaseResult = {
    faultCase: c.fc,
    iFault_A: c.iFault_A,
    // the responses simulateScenario kept: devices that operate, are expected, or carry a real share of the current
    responses: [...c.responses.values()],
    chains: chainsOf(c, failures, net),
    operation,
    verdictIds: verdicts.map((v) => v.id),
  };
  if (c.unsolved !== undefined) {
    result.unsolved = true;
    result.iFault_A = 0;
    result.operation.isolated_s = null;
  }
  return { result, verdicts };
}

function setRole(c: SimulatedCase, device: string, role: DeviceResponse["role"], sources: string[]): void {
  const r = c.responses.get(device);
  if (!r || r.role === "primary") return;
  r.role = role;
  if (sources.length) r.onPathsOf = sources;
}

/** The (first) expected device at an expected edge. */
function expectedAt(c: SimulatedCase, edge: number, net: ScenarioNetwork): string {
  return c.lp.plan.devices.find((d) => net.deviceEdge.get(d) === edge) ?? "";
}
