// Pass 2 of a scenario's study: the simulated operation of every case of one limit and fault type, and
// of each case with each expected breaker stuck. Every case starts from the all-bus sweep's snapshot; the
// cases that go on past an opening are grouped by what has opened, so that each opened set is solved
// once for all the locations that need it.
import type { Project } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import { deviceResponse } from "../deviceResponse.ts";
import { caseId, caseLabel } from "../faultCases.ts";
import { openSetKey } from "../keys.ts";
import { CaseSimulation, firstState, type SimulationOutcome } from "../operation/simulateCase.ts";
import type { FaultSnapshot, OpenEnd, StudySolver } from "../studySolver.ts";
import type { DeviceResponse, FaultCase, FaultLimit, FaultLocation, FaultType } from "../types.ts";
import type { WithstandFn } from "../withstand.ts";
import type { LocationPlan, ScenarioPlan } from "./scenarioPlan.ts";

export interface SimulatedCase {
  index: number;
  fc: FaultCase;
  iFault_A: number;
  responses: Map<string, DeviceResponse>;
  lp: LocationPlan;
  outcome: SimulationOutcome;
  failureOutcomes: SimulationOutcome[];
  messages: string[];
  /** Why the engine could not solve a state of this case (its first, or one after an opening); absent when solved. */
  unsolved?: string;
}

export interface SimulateInput {
  project: Project;
  sp: ScenarioPlan;
  type: FaultType;
  limit: FaultLimit;
  solver: StudySolver;
  model: DeviceModel;
  withstand: WithstandFn;
  elements: ReadonlyMap<string, import("../../model/schema.ts").Element>;
  isCancelled?: () => boolean;
  yieldNow?: () => Promise<void>;
  /** Called after each case's first state is worked through (for progress). */
  onCase?: () => void | Promise<void>;
}

export class StudyCancelled extends Error {
  constructor() {
    super("study cancelled");
    this.name = "StudyCancelled";
  }
}

const EMPTY: FaultSnapshot = { iFault_A: 0, readings: {}, messages: [] };

/** Every case of one limit and fault type in one scenario, simulated to its end. */
export async function simulateScenario(input: SimulateInput): Promise<SimulatedCase[]> {
  const { project, sp, type, limit, solver, model, withstand } = input;
  const { net, scenario, locations } = sp;
  const plans = sp.plans.get(type)!;
  const horizon_s = project.criteria.horizon_s;
  const snapAt =
    locations.length === 0
      ? () => EMPTY
      : solver.solveEach
        ? solver.solveEach(scenario, locations, type, limit)
        : ((snaps) => (i: number) => snaps[i])(solver.solveMany(scenario, locations, type, limit));
  const cases: SimulatedCase[] = [];
  /** Simulations waiting for a network state: opened-set key -> the set and its simulations. */
  let pending = new Map<string, { open: OpenEnd[]; sims: { sim: CaseSimulation; index: number }[] }>();
  const wait = (open: OpenEnd[] | null, sim: CaseSimulation, index: number) => {
    if (!open) return;
    const key = openSetKey(open);
    let g = pending.get(key);
    if (!g) pending.set(key, (g = { open, sims: [] }));
    g.sims.push({ sim, index });
  };
  const sims: { normal: CaseSimulation; failures: CaseSimulation[] }[] = [];
  for (let i = 0; i < locations.length; i++) {
    if (input.isCancelled?.()) throw new StudyCancelled();
    const loc = locations[i];
    const fc: FaultCase = { id: caseId(scenario.id, loc, type, limit), scenario: scenario.id, location: loc, faultType: type, limit, label: caseLabel(scenario, loc, type, limit, input.elements) };
    const snap = snapAt(i);
    const lp = plans[i];
    const responses = new Map<string, DeviceResponse>();
    for (const id in snap.readings) if (net.deviceEdge.has(id)) responses.set(id, deviceResponse(net.devices.get(id)!, snap.readings[id], model));
    for (const id of lp.plan.devices) if (!responses.has(id)) responses.set(id, deviceResponse(net.devices.get(id)!, undefined, model));
    const normal = new CaseSimulation({ net, isolation: sp.isolation, faultZone: lp.faultZone, isolatedAtStart: lp.isolatedAtStart, model, horizon_s, outOfReach: lp.plan.outOfReach, withstand });
    const failures = lp.plan.edges.map((edge, k) => new CaseSimulation({ net, isolation: sp.isolation, faultZone: lp.faultZone, isolatedAtStart: lp.isolatedAtStart, model, horizon_s, outOfReach: lp.failures[k].outOfReach, stuck: new Set([edge]), withstand }));
    // a fault that draws no current (an earth fault on an isolated-neutral section) is left to other protection;
    // a case the engine could not solve is not simulated at all
    if (snap.iFault_A >= 1 && snap.unsolved === undefined) {
      const first = firstState(net, snap, responses, withstand);
      wait(normal.advance(first), normal, i);
      for (const f of failures) wait(f.advance(first), f, i);
    }
    sims.push({ normal, failures });
    cases.push({ index: i, fc, iFault_A: snap.iFault_A, responses, lp, outcome: normal.outcome(), failureOutcomes: [], messages: snap.messages, ...(snap.unsolved !== undefined ? { unsolved: snap.unsolved } : {}) });
    await input.onCase?.();
  }
  // later states, one opened set at a time, for every location that reached it
  while (pending.size > 0) {
    const round = pending;
    pending = new Map();
    for (const { open, sims: members } of round.values()) {
      if (input.isCancelled?.()) throw new StudyCancelled();
      const at = new Map<number, number>();
      const locs: FaultLocation[] = [];
      for (const m of members)
        if (!at.has(m.index)) {
          at.set(m.index, locs.length);
          locs.push(locations[m.index]);
        }
      const solve = solver.solveOpenedEach
        ? solver.solveOpenedEach(scenario, open, locs, type, limit)
        : (j: number) => solver.solveOne(scenario, locs[j], type, limit, open);
      const snaps = new Map<number, FaultSnapshot>();
      for (const m of members) {
        const j = at.get(m.index)!;
        let s = snaps.get(j);
        if (!s) snaps.set(j, (s = solve(j)));
        if (s.unsolved !== undefined) {
          // a later state the engine could not solve: the case says so rather than go on with no current
          cases[m.index].unsolved ??= s.unsolved;
          for (const msg of s.messages) if (!cases[m.index].messages.includes(msg)) cases[m.index].messages.push(msg);
          continue;
        }
        wait(m.sim.advance(s), m.sim, m.index);
      }
      await input.yieldNow?.();
    }
  }
  for (const c of cases) {
    const s = sims[c.index];
    c.outcome = s.normal.outcome();
    c.failureOutcomes = s.failures.map((f) => f.outcome());
  }
  return cases;
}
