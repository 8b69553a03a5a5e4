// Simulated operation of one fault case. At each network state every device's travel towards operation
// accumulates as the integral of dt / t(I) (each element resets below pickup by its own law, see
// protection/accumulate.ts); the first device to complete trips, its breaker opens after its breaker time
// (unless that breaker is the one assumed stuck), and the network is solved again, until the fault is
// separated from every energising source that a device can separate it from, or the horizon passes.
//
// The simulation is resumable: advance() takes the snapshot of the current state and returns either the
// element ends open in the next state (the caller solves them, typically many cases at once) or null when
// the case is finished. Equipment withstand is integrated over the states as a used fraction, sum dt / t(I),
// which for a cable is exactly its adiabatic I^2 t (IEC 60364-4-43, 434.5.2).
import type { ProtectiveDevice } from "../../model/schema.ts";
import { initialTravel, type Measurement, type TravelState } from "../../protection/index.ts";
import type { DeviceModel } from "../deviceModel.ts";
import type { ScenarioNetwork } from "../scenarioNetwork.ts";
import type { DeviceReading, FaultSnapshot, OpenEnd } from "../studySolver.ts";
import type { DeviceResponse } from "../types.ts";
import type { WithstandFn } from "../withstand.ts";
import { liveFeeding, type IsolationContext } from "./expectedIsolation.ts";

export type OperationAction = "trip" | "open" | "melt" | "clear" | "stuck";

/** One step of what the protection did: a device trips (fuse: melts), its breaker opens (fuse: clears), or fails to. */
export interface OperationStep {
  device: string;
  t_s: number;
  action: OperationAction;
  /** The element the device looks into (opened at the device's end), for open, clear and stuck. */
  element: string | null;
  /** Device currents (primary A) in the state the step happens in; only when the simulation records them. */
  currents?: { device: string; i_A: number }[];
}

/** How much of an element's withstand a fault used before it was interrupted. */
export interface WithstandUse {
  element: string;
  end: "from" | "to" | "terminal";
  /** Sum of dt / t_withstand(I) over the states: 1 means the withstand was reached. */
  used: number;
  /** Largest current through it, A. */
  peak_A: number;
}

export interface SimulationOutcome {
  steps: OperationStep[];
  /** Time at which the fault was separated from every energising source a device can reach; null: not within the horizon. */
  isolated_s: number | null;
  /** Edges open at the end. */
  openEdges: number[];
  /** Devices that tripped, with their trip time. */
  tripped: Map<string, number>;
  /** Elements whose withstand use is known, the largest use first. */
  withstand: WithstandUse[];
  /** Network states solved after the first. */
  resolves: number;
}

export interface SimulationInput {
  net: ScenarioNetwork;
  /** The scenario's zone graph and the zone the fault lies in (isolation is decided on zones). */
  isolation: IsolationContext;
  faultZone: number;
  /** Whether the fault is already separated from every energising source it can be (no source connected). */
  isolatedAtStart: boolean;
  model: DeviceModel;
  horizon_s: number;
  /** Energising sources no device can separate from the fault (their feed is the utility's to clear). */
  outOfReach: readonly string[];
  /** Edges whose breakers fail to open (the stuck-breaker case); empty for the normal case. */
  stuck?: ReadonlySet<number>;
  withstand: WithstandFn;
  /** Keep each step's device currents (for a timeline a person reads). */
  recordCurrents?: boolean;
}

/**
 * The first network state of a case, worked out once and shared by the case's simulations (the normal one
 * and each stuck-breaker variant run alike until the first opening): from rest at constant current every
 * element travels linearly, so the devices operate in the order of their nominal times, and each element's
 * withstand is used at a constant rate.
 */
export interface FirstState {
  snap: FaultSnapshot;
  /** Devices that operate at these currents, by nominal trip time (s from fault inception). */
  order: { id: string; trip_s: number; clearing_s: number }[];
  /** Withstand use per second of each device edge at these currents. */
  rates: { edge: number; element: string; end: "from" | "to" | "terminal"; rate: number; i_A: number }[];
}

/** Per element a device measures: the largest current over its device edges not in `open` (a faulted cable's two halves differ). */
function elementCurrents(net: ScenarioNetwork, snap: FaultSnapshot, open: ReadonlySet<number>): Map<string, { edge: number; i_A: number }> {
  const out = new Map<string, { edge: number; i_A: number }>();
  for (const id in snap.readings) {
    const edge = net.deviceEdge.get(id);
    if (edge === undefined || open.has(edge)) continue;
    const i = phaseMax(snap.readings[id]);
    if (!(i > 0)) continue;
    const element = net.edges[edge].element;
    const known = out.get(element);
    if (!known || i > known.i_A) out.set(element, { edge, i_A: i });
  }
  return out;
}

export function firstState(net: ScenarioNetwork, snap: FaultSnapshot, responses: ReadonlyMap<string, DeviceResponse>, withstand: WithstandFn): FirstState {
  const order: FirstState["order"] = [];
  for (const [id, r] of responses) if (r.tOperate_s !== null && net.deviceEdge.has(id)) order.push({ id, trip_s: r.tOperate_s, clearing_s: r.tClear_s ?? r.tOperate_s });
  order.sort((a, b) => a.trip_s - b.trip_s);
  const rates: FirstState["rates"] = [];
  for (const [element, { edge, i_A }] of elementCurrents(net, snap, new Set())) {
    const e = net.edges[edge];
    const t = withstand(net.elements.get(element), e.end, i_A);
    if (Number.isFinite(t) && t > 0) rates.push({ edge, element, end: e.end, rate: 1 / t, i_A });
  }
  return { snap, order, rates };
}

const NO_CURRENT: Measurement = { phase_A: [0, 0, 0], residual_A: 0, negative_A: 0 };
const EPS = 1e-9;

/** Device currents of a state above 1 % of its largest, rounded to 0.1 A. */
function stateCurrents(snap: FaultSnapshot): { device: string; i_A: number }[] {
  const list = Object.entries(snap.readings).map(([device, r]) => ({ device, i_A: phaseMax(r) }));
  const peak = list.reduce((m, x) => Math.max(m, x.i_A), 0);
  return list.filter((x) => x.i_A > 0.01 * peak).map((x) => ({ device: x.device, i_A: Math.round(x.i_A * 10) / 10 }));
}

const phaseMax = (r: DeviceReading | undefined): number => (r ? Math.max(r.m.phase_A[0], r.m.phase_A[1], r.m.phase_A[2]) : 0);

export class CaseSimulation {
  private t = 0;
  private readonly open = new Set<number>();
  private readonly openEnds: OpenEnd[] = [];
  private readonly travel = new Map<string, TravelState>();
  private readonly tripped = new Map<string, number>();
  private pending: { device: string; at_s: number }[] = [];
  private readonly steps: OperationStep[] = [];
  private isolatedAt: number | null = null;
  private finished = false;
  private resolves = 0;

  /** Withstand use per element (a series element carries one current, in per unit, at both ends). */
  private readonly use = new Map<string, WithstandUse>();
  private readonly stuck: ReadonlySet<number>;

  constructor(private readonly input: SimulationInput) {
    this.stuck = input.stuck ?? new Set();
    if (input.isolatedAtStart) {
      this.isolatedAt = 0;
      this.finished = true;
    }
  }

  get done(): boolean {
    return this.finished;
  }

  private isIsolated(): boolean {
    const { isolation, faultZone, outOfReach } = this.input;
    return liveFeeding(isolation, faultZone, this.open).every((s) => outOfReach.includes(s));
  }

  private measured(snap: FaultSnapshot, id: string): Measurement {
    const edge = this.input.net.deviceEdge.get(id);
    if (edge === undefined || this.open.has(edge)) return NO_CURRENT;
    return snap.readings[id]?.m ?? NO_CURRENT;
  }

  private step(s: OperationStep, snap: FaultSnapshot): void {
    if (this.input.recordCurrents) s.currents = stateCurrents(snap);
    this.steps.push(s);
  }

  /** Every device's travel after this.t seconds at the first state's currents (from rest). */
  private leaveFirstState(snap: FaultSnapshot): void {
    const { net, model } = this.input;
    for (const id in snap.readings) {
      if (this.tripped.has(id)) continue;
      const device = net.devices.get(id);
      if (!device || !net.deviceEdge.has(id)) continue;
      this.travel.set(id, model.accumulate(initialTravel(), device, this.measured(snap, id), this.t));
    }
  }

  private useRates(first: FirstState, dt: number): void {
    if (!(dt > 0)) return;
    for (const r of first.rates) {
      if (this.open.has(r.edge)) continue;
      let u = this.use.get(r.element);
      if (!u) this.use.set(r.element, (u = { element: r.element, end: r.end, used: 0, peak_A: 0 }));
      u.used += dt * r.rate;
      if (r.i_A > u.peak_A) u.peak_A = r.i_A;
    }
  }

  /** Opens the breakers due by this.t; true when one opened. */
  private openDue(snap: FaultSnapshot): boolean {
    const { net } = this.input;
    let opened = false;
    const still: { device: string; at_s: number }[] = [];
    for (const p of this.pending) {
      if (p.at_s > this.t + EPS) {
        still.push(p);
        continue;
      }
      const device = net.devices.get(p.device)!;
      const edge = net.deviceEdge.get(p.device)!;
      if (this.open.has(edge)) continue;
      if (this.stuck.has(edge)) {
        this.step({ device: p.device, t_s: this.t, action: "stuck", element: device.at.element }, snap);
        continue;
      }
      this.open.add(edge);
      this.openEnds.push({ element: device.at.element, end: device.at.end });
      opened = true;
      this.step({ device: p.device, t_s: this.t, action: device.kind === "fuse" ? "clear" : "open", element: device.at.element }, snap);
    }
    this.pending = still;
    return opened;
  }

  /** The first state, from its shared plan: devices trip in the order of their nominal times. */
  private runFirstState(first: FirstState): OpenEnd[] | null {
    const { net, horizon_s } = this.input;
    let k = 0;
    for (;;) {
      while (k < first.order.length && this.tripped.has(first.order[k].id)) k++;
      const nextTrip = k < first.order.length ? first.order[k].trip_s : Infinity;
      const nextOpen = this.pending.reduce((m, p) => Math.min(m, p.at_s), Infinity);
      const tNext = Math.min(nextTrip, nextOpen);
      if (!(tNext <= horizon_s)) {
        this.useRates(first, horizon_s - this.t);
        this.finished = true;
        return null;
      }
      this.useRates(first, tNext - this.t);
      for (; k < first.order.length && first.order[k].trip_s <= tNext + EPS; k++) {
        const o = first.order[k];
        if (this.tripped.has(o.id)) continue;
        this.tripped.set(o.id, tNext);
        this.step({ device: o.id, t_s: tNext, action: net.devices.get(o.id)!.kind === "fuse" ? "melt" : "trip", element: null }, first.snap);
        this.pending.push({ device: o.id, at_s: tNext + Math.max(0, o.clearing_s - o.trip_s) });
      }
      this.t = tNext;
      if (!this.openDue(first.snap)) continue;
      if (this.isIsolated()) {
        this.isolatedAt = this.t;
        this.finished = true;
        return null;
      }
      this.leaveFirstState(first.snap);
      return [...this.openEnds];
    }
  }

  /** Adds dt at this state's currents to the withstand use of every element a device measures. */
  private useWithstand(snap: FaultSnapshot, dt: number): void {
    if (!(dt > 0)) return;
    const { net, withstand } = this.input;
    for (const [element, { edge, i_A }] of elementCurrents(net, snap, this.open)) {
      const e = net.edges[edge];
      const t = withstand(net.elements.get(element), e.end, i_A);
      if (!Number.isFinite(t)) continue;
      let u = this.use.get(element);
      if (!u) this.use.set(element, (u = { element, end: e.end, used: 0, peak_A: 0 }));
      u.used += dt / t;
      if (i_A > u.peak_A) u.peak_A = i_A;
    }
  }

  /**
   * Advances through the state `snap` describes, or, at the start, through the case's shared first state.
   * Returns the element ends open in the next state, or null when the case is finished.
   */
  advance(snap: FaultSnapshot | FirstState): OpenEnd[] | null {
    if (this.finished) return null;
    if ("order" in snap) return this.runFirstState(snap);
    this.resolves++;
    const { net, model, horizon_s } = this.input;
    for (let guard = 0; guard < 4 * net.devices.size + 8; guard++) {
      // time still needed by every device that has not tripped, at this state's currents
      const left = new Map<string, { trip_s: number; clearing_s: number }>();
      let nextTrip = Infinity;
      const candidates = new Set<string>(Object.keys(snap.readings));
      for (const id of this.travel.keys()) candidates.add(id);
      for (const id of candidates) {
        if (this.tripped.has(id)) continue;
        const device = net.devices.get(id) as ProtectiveDevice | undefined;
        if (!device || !net.deviceEdge.has(id)) continue;
        const res = model.timeToOperate(this.travel.get(id) ?? initialTravel(), device, this.measured(snap, id));
        if (!Number.isFinite(res.trip_s)) continue;
        left.set(id, res);
        nextTrip = Math.min(nextTrip, this.t + Math.max(0, res.trip_s));
      }
      const nextOpen = this.pending.reduce((m, p) => Math.min(m, p.at_s), Infinity);
      const tNext = Math.min(nextTrip, nextOpen);
      if (!(tNext <= horizon_s)) {
        this.useWithstand(snap, horizon_s - this.t);
        this.finished = true;
        return null;
      }
      const dt = tNext - this.t;
      this.useWithstand(snap, dt);
      for (const id of candidates) {
        if (this.tripped.has(id)) continue;
        const device = net.devices.get(id);
        if (!device || !net.deviceEdge.has(id)) continue;
        this.travel.set(id, model.accumulate(this.travel.get(id) ?? initialTravel(), device, this.measured(snap, id), dt));
      }
      for (const [id, res] of left) {
        if (!(this.travel.get(id)?.operated || this.t + res.trip_s <= tNext + EPS)) continue;
        const device = net.devices.get(id)!;
        this.tripped.set(id, tNext);
        this.travel.delete(id);
        this.step({ device: id, t_s: tNext, action: device.kind === "fuse" ? "melt" : "trip", element: null }, snap);
        this.pending.push({ device: id, at_s: tNext + Math.max(0, res.clearing_s - res.trip_s) });
      }
      this.t = tNext;
      if (!this.openDue(snap)) continue;
      if (this.isIsolated()) {
        this.isolatedAt = this.t;
        this.finished = true;
        return null;
      }
      return [...this.openEnds];
    }
    this.finished = true;
    return null;
  }

  outcome(): SimulationOutcome {
    return {
      steps: this.steps,
      isolated_s: this.isolatedAt,
      openEdges: [...this.open].sort((a, b) => a - b),
      tripped: this.tripped,
      withstand: [...this.use.values()].sort((a, b) => b.used - a.used),
      resolves: this.resolves,
    };
  }
}
