// Clearing timeline: a sequential simulation of one fault. At each state the network is solved, every
// device's travel towards operation accumulates as the integral of dt / t(I) (below pickup each element resets
// by its own law: instantly, by the IEEE C37.112 reset characteristic, or not at all for a fuse; see
// protection/accumulate.ts), the first device to complete trips, its breaker opens after its breaker time (the element it
// looks into is disconnected at that end) and the network is solved again, until every source path into
// the fault is open or nothing operates within the horizon.
import type { Project } from "../model/schema.ts";
import type { DeviceModel } from "./deviceModel.ts";
import { initialTravel, type Measurement, type OperatingResult, type TravelState } from "../protection/index.ts";
import { elementNode, reachable, type ScenarioNetwork } from "./scenarioNetwork.ts";
import { faultNode } from "./sourcePaths.ts";
import type { FaultSnapshot, OpenEnd, StudySolver } from "./studySolver.ts";
import type { ClearingTimeline, FaultCase, TimelineEvent } from "./types.ts";
import { fmtS } from "./verdicts/format.ts";

/** Sources able to hold a voltage up on their own: grids, generators and grid-forming inverters. */
export function energisingSources(net: ScenarioNetwork): string[] {
  return net.sources.filter((s) => {
    const e = net.elements.get(s);
    return e?.kind === "grid" || e?.kind === "generator" || (e?.kind === "inverter" && e.control === "grid-forming");
  });
}

/** Buses left without an energising source when `cut` edges are open, and the load on them (kW). */
export function deenergised(net: ScenarioNetwork, cut: ReadonlySet<number>): { buses: string[]; load_kW: number } {
  const live = new Set<string>();
  for (const s of energisingSources(net)) for (const n of reachable(net, elementNode(s), cut)) live.add(n);
  const buses: string[] = [];
  for (const node of net.adjacency.keys()) if (node.startsWith("b:") && !live.has(node)) buses.push(node.slice(2));
  const dead = new Set(buses);
  let load_kW = 0;
  for (const e of net.elements.values()) {
    if (net.scenario.outOfService.includes(e.id) || !net.adjacency.has(elementNode(e.id))) continue;
    if (e.kind === "load" && dead.has(e.bus)) load_kW += Math.max(0, e.p_kW);
    if (e.kind === "motor" && dead.has(e.bus)) load_kW += e.pr_kW;
  }
  return { buses, load_kW };
}

/** Sources connected to the fault with `cut` open. */
export function sourcesFeeding(net: ScenarioNetwork, fc: FaultCase, cut: ReadonlySet<number>): string[] {
  const seen = reachable(net, faultNode(fc.location), cut);
  return net.sources.filter((s) => seen.has(elementNode(s)));
}

/**
 * Sources that no device of the project can separate from the fault (no device on any route between
 * them, e.g. the utility feeding a fault at the point of connection): their clearing is someone else's.
 */
export function unreachableSources(net: ScenarioNetwork, fc: FaultCase): string[] {
  const allDeviceEdges = new Set(net.deviceEdge.values());
  return sourcesFeeding(net, fc, allDeviceEdges);
}

/** True when every source that a device of the project can separate from the fault is separated. */
export function faultIsolated(net: ScenarioNetwork, fc: FaultCase, cut: ReadonlySet<number>, outOfReach: readonly string[] = []): boolean {
  return sourcesFeeding(net, fc, cut).every((s) => outOfReach.includes(s));
}

export interface TimelineInput {
  project: Project;
  net: ScenarioNetwork;
  faultCase: FaultCase;
  solver: StudySolver;
  model: DeviceModel;
  /** Devices of the ideal isolation (first device on every source path). */
  idealDevices: string[];
}

const NO_CURRENT: Measurement = { phase_A: [0, 0, 0], residual_A: 0, negative_A: 0 };

export function clearingTimeline(input: TimelineInput): ClearingTimeline {
  const { project, net, faultCase: fc, solver, model } = input;
  const horizon = project.criteria.horizon_s;
  const events: TimelineEvent[] = [];
  const open: OpenEnd[] = [];
  const openEdges = new Set<number>();
  const travel = new Map<string, TravelState>();
  const tripped = new Set<string>();
  const pending: { device: string; at_s: number }[] = [];
  let t = 0;
  let snap: FaultSnapshot | null = null;
  const outOfReach = unreachableSources(net, fc);
  let isolated = faultIsolated(net, fc, openEdges, outOfReach);
  let clearedAt: number | null = isolated ? 0 : null;
  const currents = (s: FaultSnapshot) => {
    const list = Object.entries(s.readings).map(([device, r]) => ({ device, i_A: Math.max(r.m.phase_A[0], r.m.phase_A[1], r.m.phase_A[2]) }));
    const peak = list.reduce((m, x) => Math.max(m, x.i_A), 0);
    return list.filter((x) => x.i_A > 0.01 * peak).map((x) => ({ device: x.device, i_A: Math.round(x.i_A * 10) / 10 }));
  };
  const eps = 1e-9;
  const guard = 2 * net.devices.size + 4;
  for (let iter = 0; iter < guard && !isolated; iter++) {
    if (!snap) snap = solver.solveOne(net.scenario, fc.location, fc.faultType, fc.limit, open);
    const state = snap;
    const measured = (id: string): Measurement => {
      const edge = net.deviceEdge.get(id);
      if (edge === undefined || openEdges.has(edge)) return NO_CURRENT;
      return state.readings[id]?.m ?? NO_CURRENT;
    };
    // time still needed by every device that has not tripped, at this state's currents
    const left = new Map<string, OperatingResult>();
    let nextTrip = Infinity;
    for (const [id, device] of net.devices) {
      if (tripped.has(id) || !net.deviceEdge.has(id)) continue;
      const res = model.timeToOperate(travel.get(id) ?? initialTravel(), device, measured(id));
      if (!Number.isFinite(res.trip_s)) continue;
      left.set(id, res);
      nextTrip = Math.min(nextTrip, t + res.trip_s);
    }
    const nextOpen = pending.reduce((m, p) => Math.min(m, p.at_s), Infinity);
    const tNext = Math.min(nextTrip, nextOpen);
    if (!(tNext <= horizon)) break;
    const dt = tNext - t;
    for (const [id, device] of net.devices) {
      if (tripped.has(id) || !net.deviceEdge.has(id)) continue;
      const before = travel.get(id) ?? initialTravel();
      const after = model.accumulate(before, device, measured(id), dt);
      travel.set(id, after);
      const res = left.get(id);
      if (after.operated || (res && t + res.trip_s <= tNext + eps)) {
        tripped.add(id);
        events.push({ t_s: tNext, device: id, deviceName: device.name ?? "", action: device.kind === "fuse" ? "melt" : "trip", element: null, currents: currents(state) });
        pending.push({ device: id, at_s: tNext + Math.max(0, (res?.clearing_s ?? 0) - (res?.trip_s ?? 0)) });
      }
    }
    t = tNext;
    let opened = false;
    for (let k = pending.length - 1; k >= 0; k--) {
      if (pending[k].at_s > t + eps) continue;
      const id = pending[k].device;
      pending.splice(k, 1);
      const device = net.devices.get(id)!;
      const edge = net.deviceEdge.get(id)!;
      if (openEdges.has(edge)) continue;
      openEdges.add(edge);
      open.push({ element: device.at.element, end: device.at.end });
      opened = true;
      events.push({ t_s: t, device: id, deviceName: device.name ?? "", action: device.kind === "fuse" ? "clear" : "open", element: device.at.element, currents: currents(state) });
    }
    if (opened) {
      snap = null;
      isolated = faultIsolated(net, fc, openEdges, outOfReach);
      if (isolated) clearedAt = t;
    }
  }
  events.sort((a, b) => a.t_s - b.t_s);
  const final = deenergised(net, openEdges);
  const idealCut = new Set(input.idealDevices.map((d) => net.deviceEdge.get(d)).filter((i): i is number => i !== undefined));
  const ideal = deenergised(net, idealCut);
  const opened = events.filter((e) => e.action === "open" || e.action === "clear").map((e) => e.device);
  let summary: string;
  if (isolated && clearedAt !== null) {
    const extra = opened.filter((d) => !input.idealDevices.includes(d));
    summary = `isolated at ${fmtS(clearedAt)} by ${opened.join(", ") || "no device (no source connected)"}; ${final.load_kW.toFixed(0)} kW lost (ideal ${ideal.load_kW.toFixed(0)} kW)${extra.length ? `; beyond the ideal isolation: ${extra.join(", ")}` : ""}`;
    if (outOfReach.length) summary += `; still fed by ${outOfReach.join(", ")}, which no device of the project can disconnect`;
  } else if (opened.length === 0) {
    summary = `not isolated: nothing operates within ${fmtS(horizon)}`;
  } else {
    summary = `not isolated within ${fmtS(horizon)}: only ${opened.join(", ")} opened`;
  }
  return {
    caseId: fc.id,
    events,
    isolated,
    clearedAt_s: clearedAt,
    horizon_s: horizon,
    deenergisedBuses: final.buses,
    loadLost_kW: Math.round(final.load_kW * 10) / 10,
    ideal: { devices: input.idealDevices, deenergisedBuses: ideal.buses, loadLost_kW: Math.round(ideal.load_kW * 10) / 10 },
    summary,
  };
}
