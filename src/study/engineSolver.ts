// The study's solver bound to src/engine. Lines are split at the study's fault points (splitLines.ts) so
// that faults along lines are bus faults of the split network and one all-bus sweep per scenario, limit
// and fault type covers every case. Where directional functions need the fault voltages, bus faults are
// solved one by one instead (the sweep keeps currents only). Opened element ends (clearing timeline) and
// switched-out infeeds (blinding) become scenario variants.
import type { Project, ProtectiveDevice, Scenario } from "../model/schema.ts";
import { isProtectiveDevice } from "../model/schema.ts";
import {
  compileNetwork,
  loadCurrents,
  runLoadFlow,
  createReopenContext,
  solveFault,
  solveReopened,
  sweepDeviceCurrentsInto,
  sweepReopened,
  type ReopenContext,
  sweepFaults,
  type CompiledNetwork,
  type FaultResult,
  type Phasor as EnginePhasor,
  type SweepResult,
} from "../engine/index.ts";
import { measurementFromSequence, type Measurement, type Phasor, type SequenceQuantities } from "../protection/index.ts";
import { splitLines } from "./splitLines.ts";
import type { DeviceReading, FaultSnapshot, OpenEnd, StudySolver } from "./studySolver.ts";
import { FAULT_TYPES, type CurrentDirection, type FaultLimit, type FaultLocation, type FaultType } from "./types.ts";

export interface EngineSolverOptions {
  /**
   * Solve faults one by one (with bus voltages) up to this many locations per call; above it use the sweep.
   * Default: 400 when a relay has a directional function (those need the fault voltages), else 0.
   */
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
  return directionOf(i1.re, i1.im, vRef_deg, minCurrent_A);
}

/** currentDirection of I1 = re + j im. */
function directionOf(re: number, im: number, vRef_deg: number, minCurrent_A = 1e-6): CurrentDirection {
  if (Math.hypot(re, im) < minCurrent_A) return "none";
  const a = ((-vRef_deg + 45) * Math.PI) / 180;
  const torque = re * Math.cos(a) - im * Math.sin(a);
  return torque > 0 ? "forward" : torque < 0 ? "reverse" : "none";
}

/**
 * Relays with a function that reads the sequence quantities: directional (67/67N) or voltage-restrained (51V)
 * (Measurement.sequence). Other devices' sweep measurements are built without them.
 */
function readsSequence(d: ProtectiveDevice): boolean {
  return d.kind === "relay" && d.functions.some((f) => f.direction !== "non-directional" || f.ansi === "51V" || f.restraint !== undefined);
}

const busOf = (loc: FaultLocation, project: Project): string => {
  if (loc.kind === "bus") return loc.bus;
  const line = project.elements.find((e) => e.id === loc.line);
  return line?.kind === "line" ? (loc.pct <= 50 ? line.fromBus : line.toBus) : "";
};

/** Cache sizes: compiled networks, whole or partial sweeps, re-solve contexts (each most recently used first). */
const MAX_COMPILED = 4;
const MAX_SWEEPS = 2;
const MAX_REOPEN = 2;
/** Memory for the Z columns one re-solve context keeps. */
const REOPEN_COLUMN_BYTES = 64 * 1024 * 1024;

export function engineSolver(project: Project, opts: EngineSolverOptions = {}): StudySolver {
  const split = splitLines(project, project.criteria.linePoints_pct);
  const base = split.project;
  const devices = project.elements.filter(isProtectiveDevice);
  const directional = devices.some((d) => d.kind === "relay" && d.functions.some((f) => f.enabled && f.direction !== "non-directional"));
  const singleLimit = opts.singleSolveLimit ?? (directional ? 400 : 0);
  /** Per device (in `devices` order): 1 when its sweep measurements carry the sequence quantities. */
  const withSequence = Uint8Array.from(devices, (d) => (readsSequence(d) ? 1 : 0));
  /** Device id -> its location key in the split project. */
  const locKey = new Map(devices.map((d) => [d.id, `${split.endElement(d.at.element, d.at.end)}|${d.at.end}`] as const));
  const compiled = new Map<string, { network: CompiledNetwork | null; messages: string[] }>();
  /**
   * Keeps a cache to its `max` most recently used entries: a study moves through its scenarios and limits in
   * order, and a large network's sweep holds hundreds of megabytes, so old ones must not pile up.
   */
  const touch = <V>(cache: Map<string, V>, key: string, value: V, max: number): V => {
    cache.delete(key);
    cache.set(key, value);
    while (cache.size > max) cache.delete(cache.keys().next().value!);
    return value;
  };
  let sweepBroken = false;
  /** Requests (scenario or variant, limit, buses) whose sweep messages were passed on. */
  const sweepsReported = new Set<string>();
  // A study asks for the same location objects once per limit and fault type: locate each once, so that its
  // point-bus id is one string (hashed once) rather than a new one per request.
  const located = new WeakMap<FaultLocation, FaultLocation>();
  const locate = (l: FaultLocation): FaultLocation => {
    let at = located.get(l);
    if (!at) located.set(l, (at = split.locate(l)));
    return at;
  };

  /**
   * What a compiled network depends on in a scenario of the split project: the elements switched out and the
   * switch states (compileNetwork reads nothing else of it). Scenarios and variants with equal content share
   * their compiled networks and sweeps: a blinding variant (an infeed switched out) is often another scenario.
   */
  const contentOf = (s: Scenario): string => `${[...new Set(s.outOfService)].sort().join(",")}|${JSON.stringify(s.switchStates)}`;
  const scenarioContents = new Set(base.scenarios.map(contentOf));

  /** The split project and scenario id for `scenario` with `open` element ends opened. */
  const variantOf = (scenario: Scenario, open: OpenEnd[]): { key: string; content: string; project: Project; scenarioId: string } => {
    const original = project.scenarios.find((s) => s.id === scenario.id);
    if (original === scenario && open.length === 0) {
      const translated = base.scenarios.find((s) => s.id === scenario.id)!;
      return { key: scenario.id, content: contentOf(translated), project: base, scenarioId: scenario.id };
    }
    const translated = split.scenario(scenario);
    const outOfService = [...new Set([...translated.outOfService, ...open.map((o) => split.endElement(o.element, o.end))])].sort();
    const key = `${scenario.id}|${outOfService.join(",")}|${JSON.stringify(scenario.switchStates)}`;
    const variantId = `${scenario.id}~study-variant`;
    const variant: Scenario = { ...translated, id: variantId, outOfService };
    return { key, content: contentOf(variant), project: { ...base, scenarios: [...base.scenarios, variant] }, scenarioId: variantId };
  };

  const compile = (v: { content: string; project: Project; scenarioId: string }, limit: FaultLimit) => {
    const k = `${v.content}#${limit}`;
    let c = compiled.get(k);
    if (c) touch(compiled, k, c, MAX_COMPILED);
    if (!c) {
      const r = compileNetwork(v.project, { scenario: v.scenarioId, limit });
      c = r.ok
        ? { network: r.network, messages: r.network.messages.filter((m) => m.level !== "info").map((m) => m.text) }
        : { network: null, messages: r.errors.map((m) => m.text) };
      touch(compiled, k, c, MAX_COMPILED);
    }
    return c;
  };

  const shiftOf = (net: CompiledNetwork, bus: string): number => {
    const n = Object.hasOwn(net.busNode, bus) ? net.busNode[bus] : undefined;
    return n === undefined ? 0 : (net.nodes[n]?.shift_deg ?? 0);
  };

  // Below a milliampere a device "sees" only rounding residue of the solve: far below any pickup, so it
  // is treated as carrying no current (it still appears in a case when it sits on a source path).
  const NO_CURRENT_A = 1e-3;
  const sweepScratch = new Float64Array(9);
  /** Devices (by id) a snapshot is restricted to; null: every device. */
  type Wanted = ReadonlySet<string> | null;
  const snapshotOfFault = (net: CompiledNetwork, r: FaultResult, refShift: number, wanted: Wanted): FaultSnapshot => {
    const ends = new Map<string, (typeof r.branchEnds)[number]>();
    for (const e of r.branchEnds) ends.set(`${e.element}|${e.end}`, e);
    for (const e of r.shunts) ends.set(`${e.element}|${e.end}`, e);
    const volts = new Map(r.buses.map((b) => [b.bus, b] as const));
    const readings: Record<string, DeviceReading> = Object.create(null); // keyed by ids: no inherited keys
    for (const d of devices) {
      if (wanted && !wanted.has(d.id)) continue;
      const end = ends.get(locKey.get(d.id)!);
      if (!end || end.phase_A[0].mag + end.phase_A[1].mag + end.phase_A[2].mag < NO_CURRENT_A) continue;
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

  const solveSingle = (net: CompiledNetwork, variantProject: Project, loc: FaultLocation, type: FaultType, wanted: Wanted = null): FaultSnapshot => {
    try {
      const r = solveFault(net, loc, type, { detail: "devices" });
      return snapshotOfFault(net, r, shiftOf(net, busOf(loc, variantProject)), wanted);
    } catch (err) {
      const reason = err instanceof Error ? err.message : String(err);
      return { iFault_A: 0, readings: Object.create(null) as Record<string, DeviceReading>, messages: [reason], unsolved: reason };
    }
  };

  const fromSweep = (net: CompiledNetwork, sweep: SweepResult, bus: string, type: FaultType, wanted: Wanted): FaultSnapshot => {
    const b = sweepBusIndex.get(sweep)!.get(bus);
    const t = sweep.types.indexOf(type);
    if (b === undefined || t < 0) return { iFault_A: 0, readings: Object.create(null) as Record<string, DeviceReading>, messages: [] };
    const readings: Record<string, DeviceReading> = Object.create(null); // keyed by ids: no inherited keys
    const refShift = shiftOf(net, bus);
    const { index, shift_deg } = sweepDevicesOf(net, sweep);
    for (let k = 0; k < devices.length; k++) {
      const di = index[k];
      if (di < 0) continue;
      const d = devices[k];
      if (wanted && !wanted.has(d.id)) continue;
      const cur = sweepScratch;
      sweepDeviceCurrentsInto(sweep, di, b, t, cur);
      if (cur[6] + cur[7] + cur[8] < NO_CURRENT_A) continue;
      const vRef = shift_deg[k] - refShift;
      // the sweep's phase magnitudes, and |3 I0| and |I2| as measurementFromSequence computes them
      const phase_A: [number, number, number] = [cur[6], cur[7], cur[8]];
      const residual_A = 3 * Math.hypot(cur[0], cur[1]);
      const negative_A = Math.hypot(cur[4], cur[5]);
      let m: Measurement;
      if (withSequence[k] === 1) {
        const a = (vRef * Math.PI) / 180;
        // no voltages in a sweep: the prefault voltage stands in for V1 (a memory-polarised relay's view)
        const seq: SequenceQuantities = {
          i0_A: { re: cur[0], im: cur[1] },
          i1_A: { re: cur[2], im: cur[3] },
          i2_A: { re: cur[4], im: cur[5] },
          v0_pu: ZERO,
          v1_pu: { re: Math.cos(a), im: Math.sin(a) },
          v2_pu: ZERO,
        };
        m = { phase_A, residual_A, negative_A, sequence: seq };
      } else m = { phase_A, residual_A, negative_A };
      readings[d.id] = { m, direction: directionOf(cur[2], cur[3], vRef) };
    }
    const iFault_A = sweep.maxPhase_kA[b * sweep.types.length + t] * 1000;
    if (!Number.isFinite(iFault_A)) return { iFault_A: 0, readings: Object.create(null) as Record<string, DeviceReading>, messages: [], unsolved: `bus ${bus}: the engine gave no finite fault current` };
    return { iFault_A, readings, messages: [] };
  };
  const sweepDeviceIndex = new WeakMap<SweepResult, Map<string, number>>();
  /** Per sweep, in `devices` order: the sweep's index of each device's location (-1: not swept) and its bus's shift. */
  const sweepDevices = new WeakMap<SweepResult, { index: Int32Array; shift_deg: Float64Array }>();
  const sweepDevicesOf = (net: CompiledNetwork, sweep: SweepResult): { index: Int32Array; shift_deg: Float64Array } => {
    let known = sweepDevices.get(sweep);
    if (!known) {
      const dIndex = sweepDeviceIndex.get(sweep)!;
      const index = new Int32Array(devices.length).fill(-1);
      const shift_deg = new Float64Array(devices.length);
      devices.forEach((d, k) => {
        const di = dIndex.get(locKey.get(d.id)!);
        if (di === undefined) return;
        index[k] = di;
        shift_deg[k] = shiftOf(net, sweep.devices[di].bus);
      });
      known = { index, shift_deg };
      sweepDevices.set(sweep, known);
    }
    return known;
  };
  const sweepBusIndex = new WeakMap<SweepResult, Map<string, number>>();
  /** One sweep of every energised bus and every fault type per network variant and limit. */
  const sweeps = new Map<string, SweepResult | null>();
  const sweepOf = (key: string, net: CompiledNetwork, variant: Project, scenarioId: string, buses?: string[], only?: ReadonlySet<string>): SweepResult | null => {
    if (sweeps.has(key)) return touch(sweeps, key, sweeps.get(key)!, MAX_SWEEPS);
    let sweep: SweepResult | null = null;
    if (!sweepBroken) {
      try {
        const out = new Set(variant.scenarios.find((s) => s.id === scenarioId)?.outOfService ?? []);
        const locs = devices.filter((d) => (!only || only.has(d.id)) && !out.has(d.at.element) && !out.has(locKey.get(d.id)!.split("|")[0])).map((d) => {
          const [element, end] = locKey.get(d.id)!.split("|");
          return { element, end: end as OpenEnd["end"] };
        });
        sweep = sweepFaults(net, buses ? { types: [...FAULT_TYPES], devices: locs, buses } : { types: [...FAULT_TYPES], devices: locs });
        sweepDeviceIndex.set(sweep, new Map(sweep.devices.map((d, i) => [`${d.element}|${d.end}`, i] as const)));
        sweepBusIndex.set(sweep, new Map(sweep.busIds.map((b, i) => [b, i] as const)));
      } catch {
        // an engine without a working sweep: faults are solved one by one
        sweepBroken = true;
      }
    }
    touch(sweeps, key, sweep, MAX_SWEEPS);
    return sweep;
  };

  const solveEach = (
    scenario: Scenario,
    locations: FaultLocation[],
    type: FaultType,
    limit: FaultLimit,
    wanted?: readonly string[],
    open: OpenEnd[] = [],
  ): ((i: number) => FaultSnapshot) => {
    const v = variantOf(scenario, open);
    const c = compile(v, limit);
    if (!c.network) return (k) => ({ iFault_A: 0, readings: Object.create(null) as Record<string, DeviceReading>, messages: k === 0 ? c.messages : [], unsolved: c.messages.join("; ") || "the network could not be built" });
    const net = c.network;
    const where = locations.map(locate);
    const buses = [...new Set(where.filter((l) => l.kind === "bus").map((l) => (l as { bus: string }).bus))];
    // the scenario itself, or a variant that is another scenario's network: every bus (shared by content);
    // any other variant: only the buses asked for (each bus's answer does not depend on the others swept)
    const isBase = v.project === base;
    const whole = isBase || scenarioContents.has(v.content);
    const only = wanted ? new Set(wanted) : null;
    // a variant swept for a few buses follows only the devices asked for (the sweep's work grows with them);
    // a whole network's sweep is shared, so it follows every device
    const sweptOnly = whole ? undefined : (only ?? undefined);
    const onlyKey = sweptOnly ? `#${[...sweptOnly].sort().join(",")}` : "";
    const requestKey = isBase ? `${v.key}#${limit}` : `${v.key}#${limit}#${[...buses].sort().join(",")}${onlyKey}`;
    const sweepKey = whole ? `${v.content}#${limit}` : `${v.content}#${limit}#${[...buses].sort().join(",")}${onlyKey}`;
    const sweep = buses.length > singleLimit ? sweepOf(sweepKey, net, v.project, v.scenarioId, whole ? undefined : buses, sweptOnly) : null;
    const first = sweep && !sweepsReported.has(requestKey);
    if (sweep) sweepsReported.add(requestKey);
    return (k) => {
      const loc = where[k];
      const out = sweep && loc.kind === "bus" ? fromSweep(net, sweep, loc.bus, type, only) : solveSingle(net, v.project, loc, type, only);
      if (k === 0) out.messages.push(...c.messages, ...(first ? sweep.messages.filter((m) => m.level !== "info").map((m) => m.text) : []));
      return out;
    };
  };

  const solveMany = (scenario: Scenario, locations: FaultLocation[], type: FaultType, limit: FaultLimit, wanted?: readonly string[]): FaultSnapshot[] => {
    const at = solveEach(scenario, locations, type, limit, wanted);
    return locations.map((_, k) => at(k));
  };

  const solveOne = (scenario: Scenario, location: FaultLocation, type: FaultType, limit: FaultLimit, open: OpenEnd[]): FaultSnapshot => {
    if (open.length > 0 && reopenOf(scenario, limit)) return solveOpenedEach(scenario, open, [location], [type], limit)(0, type);
    const v = variantOf(scenario, open);
    const c = compile(v, limit);
    if (!c.network) return { iFault_A: 0, readings: Object.create(null) as Record<string, DeviceReading>, messages: c.messages, unsolved: c.messages.join("; ") || "the network could not be built" };
    return solveSingle(c.network, v.project, split.locate(location), type);
  };

  // The load flow runs on the project as drawn: splitting lines changes nothing in it, and very short
  // segments only make its iteration harder.
  const loadCurrentsOf = (scenario: Scenario): Record<string, number> | null => {
    try {
      const original = project.scenarios.find((s) => s.id === scenario.id) === scenario;
      const lfProject = original ? project : { ...project, scenarios: [...project.scenarios, { ...scenario, id: `${scenario.id}~study-variant` }] };
      const lf = runLoadFlow(lfProject, { scenario: original ? scenario.id : `${scenario.id}~study-variant` });
      if (!lf.converged) return null;
      const at = new Map(loadCurrents(lf).map((l) => [`${l.element}|${l.end}`, Math.abs(l.i_A)] as const));
      const out: Record<string, number> = Object.create(null); // keyed by ids: no inherited keys
      for (const d of devices) {
        const i = at.get(`${d.at.element}|${d.at.end}`);
        if (i !== undefined) out[d.id] = i;
      }
      return out;
    } catch {
      return null;
    }
  };

  // Re-solves with device ends opened: a low-rank (Woodbury) update of the scenario's own factorization per opened
  // set (src/engine/reopen), not a new network; one context per scenario network and limit.
  const reopenContexts = new Map<string, ReopenContext | null>();
  const reopenOf = (scenario: Scenario, limit: FaultLimit): { ctx: ReopenContext; net: CompiledNetwork; project: Project; scenarioId: string } | null => {
    const v = variantOf(scenario, []);
    const c = compile(v, limit);
    if (!c.network) return null;
    const key = `${v.content}#${limit}`;
    let ctx = reopenContexts.get(key);
    if (ctx !== undefined) touch(reopenContexts, key, ctx, MAX_REOPEN);
    if (ctx === undefined) {
      try {
        ctx = createReopenContext(v.project, { scenario: v.scenarioId, limit }, c.network, { maxColumns: Math.max(64, Math.floor(REOPEN_COLUMN_BYTES / (16 * Math.max(1, c.network.nodes.length)))) });
      } catch {
        ctx = null;
      }
      touch(reopenContexts, key, ctx, MAX_REOPEN);
    }
    return ctx ? { ctx, net: c.network, project: v.project, scenarioId: v.scenarioId } : null;
  };
  const solveOpenedEach = (scenario: Scenario, open: OpenEnd[], locations: FaultLocation[], types: readonly FaultType[], limit: FaultLimit): ((i: number, type: FaultType) => FaultSnapshot) => {
    const r = open.length > 0 ? reopenOf(scenario, limit) : null;
    if (!r) {
      const byType = new Map(types.map((t) => [t, solveEach(scenario, locations, t, limit, undefined, open)] as const));
      return (k, t) => (byType.get(t) ?? solveEach(scenario, locations, t, limit, undefined, open))(k);
    }
    const ends = open.map((o) => ({ element: split.endElement(o.element, o.end), end: o.end }));
    const where = locations.map(locate);
    const buses = [...new Set(where.filter((l) => l.kind === "bus").map((l) => (l as { bus: string }).bus))];
    const single = (k: number, type: FaultType): FaultSnapshot => {
      try {
        const res = solveReopened(r.ctx, ends, where[k], type, { detail: "devices" });
        return snapshotOfFault(r.net, res, shiftOf(r.net, busOf(where[k], r.project)), null);
      } catch (err) {
        const reason = err instanceof Error ? err.message : String(err);
        return { iFault_A: 0, readings: {}, messages: [reason], unsolved: reason };
      }
    };
    // with directional relays a few faults are solved one by one, for their bus voltages (as the first state is)
    if (buses.length <= singleLimit || buses.length < where.length) return single;
    let sweep: SweepResult;
    try {
      const out = new Set(r.project.scenarios.find((x) => x.id === r.scenarioId)?.outOfService ?? []);
      const locs = devices.filter((d) => !out.has(d.at.element) && !out.has(locKey.get(d.id)!.split("|")[0])).map((d) => {
        const [element, end] = locKey.get(d.id)!.split("|");
        return { element, end: end as OpenEnd["end"] };
      });
      sweep = sweepReopened(r.ctx, ends, { buses, types: [...types], devices: locs });
    } catch {
      return single;
    }
    sweepDeviceIndex.set(sweep, new Map(sweep.devices.map((d, i) => [`${d.element}|${d.end}`, i] as const)));
    sweepBusIndex.set(sweep, new Map(sweep.busIds.map((b, i) => [b, i] as const)));
    return (k, type) => {
      const loc = where[k];
      return loc.kind === "bus" && sweep.types.includes(type) ? fromSweep(r.net, sweep, loc.bus, type, null) : single(k, type);
    };
  };

  const duties = new Map<string, { ikss_kA: number; ib_kA: number; ip_kA: number } | null>();
  const busDuty = (scenario: Scenario, bus: string) => {
    const key = `${scenario.id}\u0000${bus}`;
    if (duties.has(key)) return duties.get(key)!;
    let duty: { ikss_kA: number; ib_kA: number; ip_kA: number } | null = null;
    const c = compile(variantOf(scenario, []), "max");
    if (c.network)
      try {
        duty = { ikss_kA: 0, ib_kA: 0, ip_kA: 0 };
        for (const type of FAULT_TYPES) {
          const r = solveFault(c.network, { kind: "bus", bus }, type);
          if (![r.maxPhase_kA, r.ib_kA, r.ip_kA].every(Number.isFinite)) throw new Error("not finite");
          duty.ikss_kA = Math.max(duty.ikss_kA, r.maxPhase_kA);
          duty.ib_kA = Math.max(duty.ib_kA, r.ib_kA);
          duty.ip_kA = Math.max(duty.ip_kA, r.ip_kA);
        }
      } catch {
        duty = null;
      }
    duties.set(key, duty);
    return duty;
  };

  return { solveMany, solveEach, solveOne, solveOpenedEach, busDuty, loadCurrents: loadCurrentsOf };
}
