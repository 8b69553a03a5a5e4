// The study's solver bound to src/engine. Bus faults of a large network go through the engine's sweep
// (currents at device locations only); smaller sets, line points and timeline states are solved one by
// one, which also gives the bus voltages that directional functions need. Opened element ends become
// scenario variants: an opened element is switched out, an opened end of the faulted line is left
// hanging on a dead bus of its own, so the fault stays fed from the other end.
import type { Element, Project, ProtectiveDevice, Scenario } from "../model/schema.ts";
import { isProtectiveDevice } from "../model/schema.ts";
import {
  compileNetwork,
  loadCurrents,
  runLoadFlow,
  solveFault,
  sweepDeviceCurrents,
  sweepFaults,
  type CompiledNetwork,
  type FaultResult,
  type Phasor as EnginePhasor,
} from "../engine/index.ts";
import { measurementFromSequence, type Phasor, type SequenceQuantities } from "../protection/index.ts";
import type { DeviceReading, FaultSnapshot, OpenEnd, StudySolver } from "./studySolver.ts";
import type { CurrentDirection, FaultLimit, FaultLocation, FaultType } from "./types.ts";

export interface EngineSolverOptions {
  /** Solve bus faults one by one (with voltages) up to this many locations per call; above it use the sweep. Default 150. */
  singleSolveLimit?: number;
}

const toRect = (p: EnginePhasor): Phasor => {
  const a = (p.ang_deg * Math.PI) / 180;
  return { re: p.mag * Math.cos(a), im: p.mag * Math.sin(a) };
};
const ZERO: Phasor = { re: 0, im: 0 };

/**
 * Which way the positive-sequence current flows, judged against the device bus's prefault voltage
 * (angle `vRef_deg`): a fault current lags its driving voltage by 0-90 degrees, so the characteristic is
 * centred 45 degrees behind the voltage (forward half-plane), as a 45-degree characteristic angle does.
 */
export function currentDirection(i1: Phasor, vRef_deg: number, minCurrent_A = 1e-6): CurrentDirection {
  if (Math.hypot(i1.re, i1.im) < minCurrent_A) return "none";
  const a = ((-vRef_deg + 45) * Math.PI) / 180;
  const torque = i1.re * Math.cos(a) - i1.im * Math.sin(a);
  return torque > 0 ? "forward" : torque < 0 ? "reverse" : "none";
}

interface Variant {
  project: Project;
  scenarioId: string;
}

export function engineSolver(project: Project, opts: EngineSolverOptions = {}): StudySolver {
  const singleLimit = opts.singleSolveLimit ?? 150;
  const devices = project.elements.filter(isProtectiveDevice);
  const compiled = new Map<string, { network: CompiledNetwork | null; messages: string[] }>();

  const variantOf = (scenario: Scenario, faulted: FaultLocation | null, open: OpenEnd[]): { key: string; variant: Variant } => {
    const extraOut: string[] = [];
    const hanging: OpenEnd[] = [];
    for (const o of open) {
      if (faulted?.kind === "line" && o.element === faulted.line && o.end !== "terminal") hanging.push(o);
      else extraOut.push(o.element);
    }
    const original = project.scenarios.find((s) => s.id === scenario.id);
    const same = original === scenario && extraOut.length === 0 && hanging.length === 0;
    if (same) return { key: scenario.id, variant: { project, scenarioId: scenario.id } };
    const outOfService = [...new Set([...scenario.outOfService, ...extraOut])].sort();
    const key = `${scenario.id}|${outOfService.join(",")}|${hanging.map((h) => `${h.element}.${h.end}`).join(",")}|${JSON.stringify(scenario.switchStates)}`;
    const variantId = `${scenario.id}~study-variant`;
    let elements: Element[] = project.elements;
    if (hanging.length) {
      elements = [];
      for (const e of project.elements) {
        if (e.kind !== "line" || !hanging.some((h) => h.element === e.id)) {
          elements.push(e);
          continue;
        }
        const copy = { ...e };
        for (const h of hanging.filter((x) => x.element === e.id)) {
          const busId = h.end === "from" ? e.fromBus : e.toBus;
          const bus = project.elements.find((b) => b.id === busId);
          const dead = `${e.id}~open-${h.end}`;
          elements.push({ kind: "bus", id: dead, name: dead, un_kV: bus?.kind === "bus" ? bus.un_kV : 1 });
          if (h.end === "from") copy.fromBus = dead;
          else copy.toBus = dead;
        }
        elements.push(copy);
      }
    }
    const variantScenario: Scenario = { ...scenario, id: variantId, outOfService };
    return { key, variant: { project: { ...project, elements, scenarios: [...project.scenarios, variantScenario] }, scenarioId: variantId } };
  };

  const compile = (key: string, variant: Variant, limit: FaultLimit) => {
    const k = `${key}#${limit}`;
    let c = compiled.get(k);
    if (!c) {
      const r = compileNetwork(variant.project, { scenario: variant.scenarioId, limit });
      c = r.ok
        ? { network: r.network, messages: r.network.messages.filter((m) => m.level !== "info").map((m) => m.text) }
        : { network: null, messages: r.errors.map((m) => m.text) };
      compiled.set(k, c);
    }
    return c;
  };

  const shiftOf = (net: CompiledNetwork, bus: string): number => {
    const n = net.busNode[bus];
    return n === undefined ? 0 : (net.nodes[n]?.shift_deg ?? 0);
  };

  const faultBus = (loc: FaultLocation, variantProject: Project): string => {
    if (loc.kind === "bus") return loc.bus;
    const line = variantProject.elements.find((e) => e.id === loc.line);
    return line?.kind === "line" ? (loc.pct <= 50 ? line.fromBus : line.toBus) : "";
  };

  const snapshotOfFault = (net: CompiledNetwork, r: FaultResult, refShift: number): FaultSnapshot => {
    const ends = new Map<string, (typeof r.branchEnds)[number]>();
    for (const e of r.branchEnds) ends.set(`${e.element}|${e.end}`, e);
    for (const e of r.shunts) ends.set(`${e.element}|${e.end}`, e);
    const volts = new Map(r.buses.map((b) => [b.bus, b] as const));
    const readings: Record<string, DeviceReading> = {};
    for (const d of devices) {
      const end = ends.get(`${d.at.element}|${d.at.end}`);
      if (!end) continue;
      const v = volts.get(end.bus);
      const seq: SequenceQuantities = {
        i0_A: toRect(end.seq_A[0]),
        i1_A: toRect(end.seq_A[1]),
        i2_A: toRect(end.seq_A[2]),
        v0_pu: v ? toRect(v.seq_pu[0]) : ZERO,
        v1_pu: v ? toRect(v.seq_pu[1]) : ZERO,
        v2_pu: v ? toRect(v.seq_pu[2]) : ZERO,
      };
      const m = measurementFromSequence(seq);
      m.phase_A = [end.phase_A[0].mag, end.phase_A[1].mag, end.phase_A[2].mag];
      readings[d.id] = { m, direction: currentDirection(seq.i1_A, shiftOf(net, end.bus) - refShift) };
    }
    return { iFault_A: r.maxPhase_kA * 1000, readings, messages: r.messages.filter((m) => m.level !== "info").map((m) => m.text) };
  };

  const solveSingle = (net: CompiledNetwork, variantProject: Project, loc: FaultLocation, type: FaultType, extra: string[]): FaultSnapshot => {
    let r: FaultResult;
    try {
      r = solveFault(net, loc, type);
    } catch (err) {
      // Some engines refuse a fault exactly at a line end; move it a hair inside the line.
      if (loc.kind === "line" && (loc.pct === 0 || loc.pct === 100)) {
        r = solveFault(net, { ...loc, pct: loc.pct === 0 ? 0.01 : 99.99 }, type);
      } else {
        return { iFault_A: 0, readings: {}, messages: [...extra, err instanceof Error ? err.message : String(err)] };
      }
    }
    const snap = snapshotOfFault(net, r, shiftOf(net, faultBus(loc, variantProject)));
    snap.messages.push(...extra);
    return snap;
  };

  const solveMany = (scenario: Scenario, locations: FaultLocation[], type: FaultType, limit: FaultLimit): FaultSnapshot[] => {
    const { key, variant } = variantOf(scenario, null, []);
    const c = compile(key, variant, limit);
    if (!c.network) return locations.map(() => ({ iFault_A: 0, readings: {}, messages: c.messages }));
    const net = c.network;
    const buses = locations.filter((l): l is { kind: "bus"; bus: string } => l.kind === "bus").map((l) => l.bus);
    const out: FaultSnapshot[] = new Array(locations.length);
    if (buses.length > singleLimit) {
      const locs = devices.map((d) => ({ element: d.at.element, end: d.at.end }));
      const sweep = sweepFaults(net, { types: [type], buses, devices: locs });
      const bIndex = new Map(sweep.busIds.map((b, i) => [b, i] as const));
      const dIndex = new Map(sweep.devices.map((d, i) => [`${d.element}|${d.end}`, i] as const));
      const msgs = sweep.messages.filter((m) => m.level !== "info").map((m) => m.text);
      locations.forEach((loc, k) => {
        if (loc.kind !== "bus") return;
        const b = bIndex.get(loc.bus);
        if (b === undefined) {
          out[k] = { iFault_A: 0, readings: {}, messages: [] };
          return;
        }
        const readings: Record<string, DeviceReading> = {};
        const refShift = shiftOf(net, loc.bus);
        for (const d of devices) {
          const di = dIndex.get(`${d.at.element}|${d.at.end}`);
          if (di === undefined) continue;
          const cur = sweepDeviceCurrents(sweep, di, b, 0);
          const bus = sweep.devices[di].bus;
          const vRef = shiftOf(net, bus) - refShift;
          const a = (vRef * Math.PI) / 180;
          // no voltages in a sweep: the prefault voltage stands in for V1 (a memory-polarised relay's view)
          const seq: SequenceQuantities = {
            i0_A: cur.seq_A[0],
            i1_A: cur.seq_A[1],
            i2_A: cur.seq_A[2],
            v0_pu: ZERO,
            v1_pu: { re: Math.cos(a), im: Math.sin(a) },
            v2_pu: ZERO,
          };
          const m = measurementFromSequence(seq);
          m.phase_A = [cur.phase_A[0].mag, cur.phase_A[1].mag, cur.phase_A[2].mag];
          if (m.phase_A[0] + m.phase_A[1] + m.phase_A[2] <= 0) continue;
          readings[d.id] = { m, direction: currentDirection(seq.i1_A, vRef) };
        }
        out[k] = { iFault_A: sweep.maxPhase_kA[b] * 1000, readings, messages: k === 0 ? [...c.messages, ...msgs] : [] };
      });
    }
    locations.forEach((loc, k) => {
      if (!out[k]) out[k] = solveSingle(net, variant.project, loc, type, k === 0 ? c.messages : []);
    });
    return out;
  };

  const solveOne = (scenario: Scenario, location: FaultLocation, type: FaultType, limit: FaultLimit, open: OpenEnd[]): FaultSnapshot => {
    const { key, variant } = variantOf(scenario, location, open);
    const c = compile(key, variant, limit);
    if (!c.network) return { iFault_A: 0, readings: {}, messages: c.messages };
    return solveSingle(c.network, variant.project, location, type, []);
  };

  const loadCurrentsOf = (scenario: Scenario): Record<string, number> | null => {
    try {
      const { variant } = variantOf(scenario, null, []);
      const lf = runLoadFlow(variant.project, { scenario: variant.scenarioId });
      if (!lf.converged) return null;
      const at = new Map(loadCurrents(lf).map((l) => [`${l.element}|${l.end}`, Math.abs(l.i_A)] as const));
      const out: Record<string, number> = {};
      for (const d of devices as ProtectiveDevice[]) {
        const i = at.get(`${d.at.element}|${d.at.end}`);
        if (i !== undefined) out[d.id] = i;
      }
      return out;
    } catch {
      return null;
    }
  };

  return { solveMany, solveOne, loadCurrents: loadCurrentsOf };
}
