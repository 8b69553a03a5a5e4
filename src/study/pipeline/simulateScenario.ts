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
  /** Fault types simulated together: an opened set is solved once for all of them. */
  types: readonly FaultType[];
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

/** Share of the largest device current below which a device that does not operate is not kept. */
const KEEP_SHARE = 0.01;

/**
 * Drops the first-state answers of devices that neither operate nor carry a real share of the fault current (the
 * simulation has what it needs of them by now): on a large network they are most of a case's memory.
 */
function pruneResponses(responses: Map<string, DeviceResponse>, expected: readonly string[]): void {
  let peak = 0;
  for (const r of responses.values()) if (r.iPhase_A > peak) peak = r.iPhase_A;
  for (const [id, r] of responses) if (r.tOperate_s === null && !r.pickedUp && r.iPhase_A < KEEP_SHARE * peak && !expected.includes(id)) responses.delete(id);
}

/**
 * Every case of one limit in one scenario, for each of the fault types, simulated to its end. Cases come
 * by fault type, then location; `SimulatedCase.index` is the location's index.
 */
export async function simulateScenario(input: SimulateInput): Promise<SimulatedCase[]> {
  const { project, sp, types, limit, solver, model, withstand } = input;
  const { net, scenario, locations } = sp;
  const horizon_s = project.criteria.horizon_s;
  const L = locations.length;
  const cases: SimulatedCase[] = [];
  /** Simulations waiting for a network state: opened-set key -> the set and its simulations (by case slot). */
  let pending = new Map<string, { open: OpenEnd[]; sims: { sim: CaseSimulation; slot: number }[] }>();
  const wait = (open: OpenEnd[] | null, sim: CaseSimulation, slot: number) => {
    if (!open) return;
    const key = openSetKey(open);
    let g = pending.get(key);
    if (!g) pending.set(key, (g = { open, sims: [] }));
    g.sims.push({ sim, slot });
  };
  const sims: { normal: CaseSimulation; failures: CaseSimulation[] }[] = [];
  for (const [t, type] of types.entries()) {
    const plans = sp.plans.get(type)!;
    const snapAt =
      L === 0
        ? () => EMPTY
        : solver.solveEach
          ? solver.solveEach(scenario, locations, type, limit)
          : (
              (snaps) => (i: number) =>
                snaps[i]
            )(solver.solveMany(scenario, locations, type, limit));
    for (let i = 0; i < L; i++) {
      const slot = t * L + i;
      if (input.isCancelled?.()) throw new StudyCancelled();
      const loc = locations[i];
      const fc: FaultCase = {
        id: caseId(scenario.id, loc, type, limit),
        scenario: scenario.id,
        location: loc,
        faultType: type,
        limit,
        label: caseLabel(scenario, loc, type, limit, input.elements),
      };
      const snap = snapAt(i);
      const lp = plans[i];
      const responses = new Map<string, DeviceResponse>();
      for (const id in snap.readings) if (net.deviceEdge.has(id)) responses.set(id, deviceResponse(net.devices.get(id)!, snap.readings[id], model));
      for (const id of lp.plan.devices) if (!responses.has(id)) responses.set(id, deviceResponse(net.devices.get(id)!, undefined, model));
      const simulation = (outOfReach: readonly string[], stuck?: ReadonlySet<number>) =>
        new CaseSimulation({ net, isolation: sp.isolation, faultZone: lp.faultZone, isolatedAtStart: lp.isolatedAtStart, model, horizon_s, outOfReach, stuck, withstand });
      const normal = simulation(lp.plan.outOfReach);
      const failures = lp.plan.edges.map((edge, k) => simulation(lp.failures[k].outOfReach, new Set([edge])));
      // a fault that draws no current (an earth fault on an isolated-neutral section) is left to other protection;
      // a case the engine could not solve is not simulated at all
      if (snap.iFault_A >= 1 && snap.unsolved === undefined) {
        const first = firstState(net, snap, responses, withstand);
        wait(normal.advance(first), normal, slot);
        for (const f of failures) wait(f.advance(first), f, slot);
      }
      pruneResponses(responses, lp.plan.devices);
      sims.push({ normal, failures });
      cases.push({
        index: i,
        fc,
        iFault_A: snap.iFault_A,
        responses,
        lp,
        outcome: normal.outcome(),
        failureOutcomes: [],
        messages: snap.messages,
        ...(snap.unsolved !== undefined ? { unsolved: snap.unsolved } : {}),
      });
      await input.onCase?.();
    }
  }
  // later states, one opened set at a time, for every location that reached it
  while (pending.size > 0) {
    const round = pending;
    pending = new Map();
    for (const { open, sims: members } of round.values()) {
      if (input.isCancelled?.()) throw new StudyCancelled();
      // the locations and fault types this opened set is needed for, solved in one go
      const at = new Map<number, number>();
      const locs: FaultLocation[] = [];
      const wanted = new Set<FaultType>();
      for (const m of members) {
        const i = m.slot % L;
        wanted.add(types[Math.floor(m.slot / L)]);
        if (!at.has(i)) {
          at.set(i, locs.length);
          locs.push(locations[i]);
        }
      }
      const typeList = types.filter((x) => wanted.has(x));
      const solve = solver.solveOpenedEach ? solver.solveOpenedEach(scenario, open, locs, typeList, limit) : (j: number, type: FaultType) => solver.solveOne(scenario, locs[j], type, limit, open);
      const snaps = new Map<number, FaultSnapshot>();
      for (const m of members) {
        const j = at.get(m.slot % L)!;
        const type = types[Math.floor(m.slot / L)];
        const key = j * types.length + types.indexOf(type);
        let s = snaps.get(key);
        if (!s) snaps.set(key, (s = solve(j, type)));
        if (s.unsolved !== undefined) {
          // a later state the engine could not solve: the case says so rather than go on with no current
          cases[m.slot].unsolved ??= s.unsolved;
          for (const msg of s.messages) if (!cases[m.slot].messages.includes(msg)) cases[m.slot].messages.push(msg);
          continue;
        }
        wait(m.sim.advance(s), m.sim, m.slot);
      }
      await input.yieldNow?.();
    }
  }
  for (const [slot, c] of cases.entries()) {
    const s = sims[slot];
    c.outcome = s.normal.outcome();
    c.failureOutcomes = s.failures.map((f) => f.outcome());
  }
  return cases;
}
