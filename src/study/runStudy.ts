// The whole protection study: fault cases in every scenario, device responses, chains, verdicts
// (sensitivity, selectivity, speed, blinding, sympathetic tripping), clearing timelines and the matrix.
// Pure and deterministic; progress, cancellation and yielding to the host are passed in.
import type { Project, ProtectiveDevice, Scenario } from "../model/schema.ts";
import { chainPlan, chainsFromPlan, type ChainPlan } from "./chains.ts";
import type { DeviceModel } from "./deviceModel.ts";
import { deviceResponse } from "./deviceResponse.ts";
import { deviceSides } from "./deviceSides.ts";
import { caseId, caseLabel, faultLocations } from "./faultCases.ts";
import { studyMatrix } from "./matrix.ts";
import { scenarioNetwork, type ScenarioNetwork } from "./scenarioNetwork.ts";
import { findSourcePaths, sourceTrees, type SourcePath } from "./sourcePaths.ts";
import type { FaultSnapshot, StudySolver } from "./studySolver.ts";
import { clearingTimeline } from "./timeline.ts";
import {
  FAULT_TYPES,
  STUDY_CAUTION,
  type CaseResult,
  type ClearingTimeline,
  type DeviceResponse,
  type FaultCase,
  type FaultLimit,
  type FaultLocation,
  type FaultType,
  type StudyOptions,
  type StudyResult,
  type Verdict,
  type VerdictStatus,
} from "./types.ts";
import { blindingPairs, blindingVerdict, infeedsByBus, type BlindingPair, type ChainRoles } from "./verdicts/blinding.ts";
import { loadVerdicts, sensitivityVerdicts, ZoneMinimum } from "./verdicts/sensitivity.ts";
import { selectivityVerdicts } from "./verdicts/selectivity.ts";
import { speedVerdicts } from "./verdicts/speed.ts";
import { sympatheticVerdicts } from "./verdicts/sympathetic.ts";
import { verdictIdsDistinct } from "./verdictIds.ts";
import { memoWithstand, withstand_s, type WithstandFn } from "./withstand.ts";

export interface StudyDeps {
  solver: StudySolver;
  model: DeviceModel;
}

export interface StudyHooks {
  onProgress?: (done: number, total: number, phase: "cases" | "verdicts" | "timelines") => void;
  /** Checked between cases; true stops the study with StudyCancelled. */
  isCancelled?: () => boolean;
  /** Lets the host breathe between batches of cases (a worker reads its messages here). */
  yieldNow?: () => Promise<void>;
}

export class StudyCancelled extends Error {
  constructor() {
    super("study cancelled");
    this.name = "StudyCancelled";
  }
}

/** Everything the study keeps of one case while the scenario is being worked through. */
interface CaseWork {
  result: CaseResult;
  responses: Map<string, DeviceResponse>;
}

/** One case: device responses, chains, roles and the verdicts that need only this case. */
export function analyseCase(
  project: Project,
  net: ScenarioNetwork,
  sides: ReturnType<typeof deviceSides>,
  fc: FaultCase,
  paths: SourcePath[],
  snapshot: Pick<FaultSnapshot, "iFault_A" | "readings">,
  model: DeviceModel,
  withstand: WithstandFn = withstand_s,
): { work: CaseWork; verdicts: Verdict[] } {
  return analysePlannedCase(project, net, fc, chainPlan(net, paths, sides), snapshot, model, withstand);
}

/** analyseCase with the location's chains already planned (a study analyses eight or more cases per location). */
function analysePlannedCase(
  project: Project,
  net: ScenarioNetwork,
  fc: FaultCase,
  plan: ChainPlan,
  snapshot: Pick<FaultSnapshot, "iFault_A" | "readings">,
  model: DeviceModel,
  withstand: WithstandFn,
): { work: CaseWork; verdicts: Verdict[] } {
  // responses of the devices that see current, and of every device on a source path (zero when it sees none)
  const responses = new Map<string, DeviceResponse>();
  for (const id in snapshot.readings) if (net.deviceEdge.has(id)) responses.set(id, deviceResponse(net.devices.get(id)!, snapshot.readings[id], model));
  for (const id of plan.pathDevices) if (!responses.has(id)) responses.set(id, deviceResponse(net.devices.get(id)!, undefined, model));
  const chains = chainsFromPlan(fc.id, plan, responses);
  // every path device has a response, so the plan's roles and paths are this case's (arrays shared by the location's cases)
  for (const [id, m] of plan.members) {
    const r = responses.get(id)!;
    r.role = m.role;
    r.onPathsOf = m.onPathsOf;
  }
  // Devices on no source path carry only motor infeed, which decays within a few cycles (IEC 60909 treats
  // it as initial current only); they are not judged for sympathetic tripping. // common practice
  for (const d of plan.sympatheticCandidates) {
    const r = responses.get(d)!;
    if (r.role === "none" && r.direction !== "forward") r.role = "sympathetic";
  }
  const verdicts = [
    ...selectivityVerdicts(fc, chains, responses, net.devices, project.criteria),
    ...speedVerdicts(fc, chains, responses, net.elements, project.criteria, (source) => isGridFollowing(net, source), withstand),
    ...sympatheticVerdicts(fc, chains, plan.sympatheticCandidates, responses, net.devices, model, project.criteria),
  ];
  const result: CaseResult = {
    faultCase: fc,
    iFault_A: snapshot.iFault_A,
    responses: [...responses.values()],
    chains,
    verdictIds: verdicts.map((v) => v.id),
  };
  return { work: { result, responses }, verdicts };
}

/** A plan's chains as links with roles (the first device of a chain is its primary). */
function chainRoles(plan: ChainPlan): ChainRoles {
  return { paths: plan.paths.map((p) => ({ links: p.devices.map((device, depth) => ({ device, role: depth === 0 ? ("primary" as const) : ("backup" as const) })) })) };
}

/** Grid-following inverters cease to energise on their own protection (IEEE 1547-2018 clause 8.1, from memory). */
export function isGridFollowing(net: ScenarioNetwork, source: string): boolean {
  const e = net.elements.get(source);
  return e?.kind === "inverter" && e.control === "grid-following";
}

/** Every location's snapshot, one at a time when the solver can (see StudySolver.solveEach). */
function solveAll(solver: StudySolver, scenario: Scenario, locations: FaultLocation[], type: FaultType, limit: FaultLimit, devices?: readonly string[]): (i: number) => FaultSnapshot {
  if (locations.length === 0) return () => ({ iFault_A: 0, readings: {}, messages: [] });
  if (solver.solveEach) return solver.solveEach(scenario, locations, type, limit, devices);
  const snaps = solver.solveMany(scenario, locations, type, limit, devices);
  return (i) => snaps[i];
}

/**
 * What the study keeps of a case once it is analysed (the response lookup only where blinding needs it), and
 * the statuses of the verdicts listed in its verdictIds (the matrix cell's counts).
 */
interface KeptCase {
  result: CaseResult;
  counts: Record<VerdictStatus, number>;
}

function pickTimelineCase(works: KeptCase[]): KeptCase | null {
  let best: KeptCase | null = null;
  let bestScore = -1;
  for (const w of works) {
    const score = w.counts.fail * 1000 + w.counts.warn;
    if (score > bestScore) {
      best = w;
      bestScore = score;
    }
  }
  return best;
}

export async function runStudy(project: Project, deps: StudyDeps, options: StudyOptions = {}, hooks: StudyHooks = {}): Promise<StudyResult> {
  const { solver, model } = deps;
  const warnings: string[] = [];
  const cases: CaseResult[] = [];
  const verdictList: Verdict[] = [];
  const timelines: ClearingTimeline[] = [];
  const scenarios = project.scenarios.filter((s) => !options.scenarios || options.scenarios.includes(s.id));
  if (options.scenarios)
    for (const id of options.scenarios) if (!project.scenarios.some((s) => s.id === id)) warnings.push(`Scenario ${id}: not found in the project`);
  const types: FaultType[] = options.faultTypes ?? [...FAULT_TYPES];
  const limitsOf = (s: Scenario) => s.limits.filter((l) => !options.limits || options.limits.includes(l));
  // Repeated verdict ids (possible only in a project that fails verdictIdsDistinct) keep their first verdict.
  const verdictById = verdictIdsDistinct(project, scenarios, types, limitsOf) ? null : new Map<string, Verdict>();
  const addVerdicts = (list: Verdict[]) => {
    for (const v of list) {
      if (verdictById) {
        if (verdictById.has(v.id)) continue;
        verdictById.set(v.id, v);
      }
      verdictList.push(v);
    }
  };
  /** Counts a verdict listed in a case (by the status of the verdict kept under its id). */
  const count = (w: KeptCase, v: Verdict) => {
    w.counts[verdictById ? verdictById.get(v.id)!.status : v.status]++;
  };
  const caseCounts: Record<VerdictStatus, number>[] = [];
  // total for progress: locations x types x limits over scenarios
  const plan = scenarios.map((s) => {
    const locations = faultLocations(project, s, options);
    const limits = limitsOf(s);
    return { scenario: s, locations, limits };
  });
  const total = plan.reduce((n, p) => n + p.locations.length * p.limits.length * types.length, 0);
  let done = 0;
  const elements = new Map(project.elements.map((e) => [e.id, e] as const));
  const withstand = memoWithstand();

  for (const { scenario, locations, limits } of plan) {
    const net = scenarioNetwork(project, scenario);
    for (const d of net.idleDevices) {
      const dev = net.devices.get(d);
      if (dev && !scenario.outOfService.includes(d) && !scenario.outOfService.includes(dev.at.element) && elements.get(dev.at.element) === undefined)
        warnings.push(`${d}: located at ${dev.at.element} (${dev.at.end}), which is not in the project`);
    }
    const sides = deviceSides(net);
    const infeeds = infeedsByBus(net);
    // chains and blinding pairs per location index (the same for every limit and fault type); the source
    // paths themselves are not kept
    const trees = sourceTrees(net);
    const plans: ChainPlan[] = [];
    const pairsAt: BlindingPair[][] = [];
    for (const loc of locations) {
      const paths = findSourcePaths(net, loc, trees);
      const plan = chainPlan(net, paths, sides);
      plans.push(plan);
      pairsAt.push(blindingPairs(net, paths, chainRoles(plan), infeeds));
    }
    const sensLimit: FaultLimit = limits.includes("min") ? "min" : "max";
    const zone = new ZoneMinimum(net.devices, model);
    const works: KeptCase[] = [];
    const blinding: { work: CaseWork; kept: KeptCase; pairs: BlindingPair[]; locIndex: number; type: FaultType }[] = [];
    /** The cases whose observations the zone minimum holds (sensitivity verdicts are listed there). */
    const observed = new Map<FaultCase, KeptCase>();

    for (const limit of limits) {
      for (const type of types) {
        const snapAt = solveAll(solver, scenario, locations, type, limit);
        for (let i = 0; i < locations.length; i++) {
          if (hooks.isCancelled?.()) throw new StudyCancelled();
          const loc = locations[i];
          const fc: FaultCase = {
            id: caseId(scenario.id, loc, type, limit),
            scenario: scenario.id,
            location: loc,
            faultType: type,
            limit,
            label: caseLabel(scenario, loc, type, limit, elements),
          };
          const snap = snapAt(i);
          for (const m of snap.messages) if (!warnings.includes(m)) warnings.push(m);
          const { work, verdicts } = analysePlannedCase(project, net, fc, plans[i], snap, model, withstand);
          addVerdicts(verdicts);
          // keep only the result: the per-case response lookup would otherwise live as long as the study
          const kept: KeptCase = { result: work.result, counts: { pass: 0, warn: 0, fail: 0 } };
          for (const v of verdicts) count(kept, v);
          works.push(kept);
          cases.push(work.result);
          caseCounts.push(kept.counts);
          // a fault that draws no current (an earth fault on an isolated-neutral section) is left to
          // other protection (neutral displacement); it says nothing about overcurrent sensitivity
          if (limit === sensLimit && snap.iFault_A >= 1) {
            // a grid-following inverter's path is opened by the inverter's own protection, not by overcurrent devices
            for (const p of work.result.chains.paths) {
              if (isGridFollowing(net, p.source)) continue;
              for (let k = 0; k < p.links.length && k < 2; k++) {
                const l = p.links[k];
                zone.add({ device: l.device, role: l.role, response: work.responses.get(l.device)!, faultCase: fc });
                observed.set(fc, kept);
              }
            }
            const pairs = pairsAt[i];
            if (pairs.length) blinding.push({ work, kept, pairs, locIndex: i, type });
          }
          done++;
          if (done % 64 === 0) {
            hooks.onProgress?.(done, total, "cases");
            await hooks.yieldNow?.();
          }
        }
      }
    }
    hooks.onProgress?.(done, total, "verdicts");

    // blinding: re-solve the affected locations with each infeed switched out (one location set per infeed,
    // so that the solver can answer every fault type from one sweep)
    const byInfeed = new Map<string, { work: CaseWork; kept: KeptCase; pair: BlindingPair; locIndex: number; type: FaultType }[]>();
    for (const b of blinding)
      for (const pair of b.pairs) {
        const list = byInfeed.get(pair.infeed) ?? [];
        list.push({ work: b.work, kept: b.kept, pair, locIndex: b.locIndex, type: b.type });
        byInfeed.set(pair.infeed, list);
      }
    for (const [infeed, items] of byInfeed) {
      if (hooks.isCancelled?.()) throw new StudyCancelled();
      const variant: Scenario = { ...scenario, outOfService: [...scenario.outOfService, infeed] };
      const locIdx = [...new Set(items.map((x) => x.locIndex))].sort((a, b) => a - b);
      const locs: FaultLocation[] = locIdx.map((k) => locations[k]);
      const position = new Map(locIdx.map((k, j) => [k, j] as const));
      const wanted = [...new Set(items.map((x) => x.pair.device))];
      for (const type of types) {
        const ofType = items.filter((x) => x.type === type);
        if (ofType.length === 0) continue;
        // only the locations and devices of this type's pairs are read (in location order)
        const at = solveAll(solver, variant, locs, type, sensLimit, wanted);
        const snaps = new Map<number, FaultSnapshot>();
        const snapOf = (j: number): FaultSnapshot => {
          let s = snaps.get(j);
          if (!s) snaps.set(j, (s = at(j)));
          return s;
        };
        for (const j of [...new Set(ofType.map((x) => position.get(x.locIndex)!))].sort((a, b) => a - b)) snapOf(j);
        for (const item of ofType) {
          const device = net.devices.get(item.pair.device) as ProtectiveDevice;
          const without = deviceResponse(device, snapOf(position.get(item.locIndex)!).readings[device.id], model);
          const v = blindingVerdict(item.work.result.faultCase, item.pair, item.work.responses.get(device.id)!, without, device, model, project.criteria);
          addVerdicts([v]);
          item.work.result.verdictIds.push(v.id);
          count(item.kept, v);
        }
      }
      await hooks.yieldNow?.();
    }

    // sensitivity against the end of each zone, then against load
    const observations = zone.observations();
    const sens = sensitivityVerdicts(scenario, observations, net.devices, model, project.criteria);
    addVerdicts(sens);
    // (where case ids can repeat, the case listed under an id is the last one with it)
    const workById = verdictById
      ? new Map(works.map((w) => [w.result.faultCase.id, w] as const))
      : new Map(observations.map((o) => [o.faultCase.id, observed.get(o.faultCase)!] as const));
    for (const v of sens) {
      const w = v.caseId ? workById.get(v.caseId) : undefined;
      if (!w) continue;
      w.result.verdictIds.push(v.id);
      count(w, v);
    }
    const load = solver.loadCurrents(scenario);
    if (load) addVerdicts(loadVerdicts(scenario, load, net.devices, model, project.criteria));
    else warnings.push(`Scenario ${scenario.id} "${scenario.name}": no load flow, pickups were not checked against load current`);

    // clearing timelines: the worst case of the scenario, plus the ones asked for
    const wanted = new Set(options.timelineCases ?? []);
    const chosen = works.filter((w) => wanted.has(w.result.faultCase.id));
    const worst = pickTimelineCase(works.filter((w) => w.result.faultCase.limit === sensLimit));
    if (worst && !chosen.includes(worst)) chosen.unshift(worst);
    for (const w of chosen) {
      if (hooks.isCancelled?.()) throw new StudyCancelled();
      timelines.push(clearingTimeline({ project, net, faultCase: w.result.faultCase, solver, model, idealDevices: w.result.chains.idealIsolation }));
      hooks.onProgress?.(done, total, "timelines");
      await hooks.yieldNow?.();
    }
  }
  hooks.onProgress?.(total, total, "verdicts");
  return {
    project: project.meta.name,
    cases,
    verdicts: verdictList,
    matrix: studyMatrix(scenarios, cases, verdictList, elements, { caseCounts }),
    timelines,
    warnings,
    caution: STUDY_CAUTION,
  };
}
