// All-bus fault sweep. Per sequence: one factorisation, Takahashi's sparse inverse subset for every bus's
// driving-point impedance (and the branch-pair entries the radial peak factor needs), one solve per device location
// (reciprocity: the device current for a fault at every bus is c_d^T Z[:, k] = (Z c_d)[k]) and one per inverter
// unit. Each fault then costs a few complex operations; device currents are kept in linear form (see types.ts):
//   I_d,s(b, t) = -X_s[k_b, d] * If_s(b, t) + sum_j injMap[d, j, s] * inj_s(b, t, j),   X_s = Z_s C_s
// Buses where a sequence network floats (islands of current sources only) or inside a power station unit are solved
// one by one (overrides).
import type { CompiledNetwork, EngineMessage, FaultType, SweepOptions, SweepResult } from "../types.ts";
import { FAULT_TYPES, TRANSFER_BLOCK } from "../types.ts";
import type { Cx } from "../network/model.ts";
import { sequenceSystem, type SequenceSystem } from "../network/sequenceSystem.ts";
import { compactUnits, loadFaultColumns, responseFromAffine, unitBlock, unitColumns } from "./compactFault.ts";
import { FaultAffine, faultMagnitudesOf } from "./faultAffine.ts";
import { FaultCoupledResponse } from "../inverter/unitResponse.ts";
import { InjectionWork, iterateInjections } from "../inverter/refinedIteration.ts";
import { solveLdltBlock } from "../sparse/ldlt.ts";
import { inverseSubset, type InverseSubset } from "../sparse/takahashi.ts";
import { deviceCombination, type Combination } from "./deviceCombination.ts";
import { negativeAlpha, negativeCorrection, type NegativeCorrection } from "./negativeFromPositive.ts";
import { voltageFactor, peakFactor } from "../iec60909/factors.ts";
import { isRadialIsland, peakCurrent_kA } from "./peakCurrent.ts";
import { SourceShare, iecFloatingOf } from "./sourceShare.ts";
import { solveFault, type EngineInternal } from "./solveFault.ts";
import type { ComplexVec } from "./solveLinearFault.ts";

const SQRT3 = Math.sqrt(3);

/** Synchronous sweep; `options.onProgress` returning false stops it (the result then says "cancelled"). */
export function sweepFaults(network: CompiledNetwork, options: SweepOptions = {}): SweepResult {
  const steps = sweepSteps(network, options);
  let r = steps.next();
  while (!r.done) r = steps.next(options.onProgress ? options.onProgress(r.value) !== false : true);
  return r.value;
}

/**
 * The same sweep, giving the event loop a turn between chunks (`yieldNow`, e.g. a zero timeout in a worker) so that
 * a cancel or a newer request can arrive and make `onProgress` return false.
 */
export async function sweepFaultsAsync(network: CompiledNetwork, options: SweepOptions, yieldNow: () => Promise<void>): Promise<SweepResult> {
  const steps = sweepSteps(network, options);
  let r = steps.next();
  while (!r.done) {
    await yieldNow();
    r = steps.next(options.onProgress ? options.onProgress(r.value) !== false : true);
  }
  return r.value;
}

/** The sweep as steps: yields the fraction done every chunk of buses and receives whether to go on. */
function* sweepSteps(network: CompiledNetwork, options: SweepOptions): Generator<number, SweepResult, boolean> {
  const plan = planSweep(network, options);
  const arrays = allocateSweep(plan, (n) => new Float64Array(n));
  sweepTransfers(plan, arrays, counter());
  const part = yield* sweepBusSteps(network, plan, arrays, counter());
  if (part.cancelled) part.messages.push({ level: "info", code: "cancelled", text: "Sweep cancelled before it finished" });
  else options.onProgress?.(1);
  return assembleSweep(network, plan, arrays, [part]);
}

/**
 * Everything the parts of one sweep agree on, worked out from the network and the options alone (so that every
 * thread taking part derives the same plan): buses, fault types, device locations, sequence systems, the transfer
 * layout and the sizes of the result's arrays.
 */
export interface SweepPlan {
  busIds: string[];
  busNodes: number[];
  types: FaultType[];
  locs: { element: string; end: "from" | "to" | "terminal" }[];
  devices: SweepResult["devices"];
  combos: (Combination | null)[];
  base_A: Float64Array;
  shift_deg: Float64Array;
  used: "iec" | "refined";
  sysVariant: "iec" | "refined";
  /** Node of each inverter unit. */
  unitNodes: number[];
  sys: [SequenceSystem, SequenceSystem, SequenceSystem];
  tk: InverseSubset[];
  /** Warnings about buses and device locations out of service. */
  messages: EngineMessage[];
  layout: TransferLayout;
  /** The negative sequence from the positive one (see negativeFromPositive.ts), or null: solved as well. */
  negative: NegativeCorrection | null;
  /** W of the negative correction in the layout's rows (the result keeps it). */
  negativeW: Float64Array;
  /** Device blocks of the transfer (BLOCK locations each). */
  blocks: number;
  /** Length of every array of the result that a part writes (see SweepArrays). */
  sizes: Record<keyof SweepArrays, number>;
}

/** The result's arrays that the parts fill: transfer and injMap by device block, the rest by bus. */
export interface SweepArrays {
  transfer: Float64Array;
  injMap: Float64Array;
  /** alpha of the negative correction per slot (see negativeFromPositive.ts), [(slot * k + h) * 2 + re/im]. */
  negativeAlpha: Float64Array;
  ikss_kA: Float64Array;
  maxPhase_kA: Float64Array;
  ip_kA: Float64Array;
  xr: Float64Array;
  faultSeq_pu: Float64Array;
  inj_pu: Float64Array;
  busShift_deg: Float64Array;
}

/** What a part found besides its arrays. */
export interface SweepPartOutcome {
  messages: EngineMessage[];
  overrides: SweepResult["deviceData"]["overrides"];
  cancelled: boolean;
}

export function planSweep(network: CompiledNetwork, options: SweepOptions = {}): SweepPlan {
  const { model, cache } = network.internal as EngineInternal;
  const opts = network.options;
  const types: FaultType[] = options.types ? [...options.types] : [...FAULT_TYPES];
  const T = types.length;
  const messages: EngineMessage[] = [];
  const busIds = options.buses ? [...options.buses] : model.nodes.flatMap((nd) => nd.buses);
  const B = busIds.length;
  const used = model.inverters.length > 0 ? (options.inverterModel ?? opts.inverterModel) : "iec";
  const hasGfm = model.shunts.some((s) => s.refinedOnly);
  const sysVariant = used === "refined" && hasGfm ? "refined" : "iec";
  const sys = [0, 1, 2].map((s) => sequenceSystem(model, cache, s as 0 | 1 | 2, sysVariant)) as [SequenceSystem, SequenceSystem, SequenceSystem];
  // A network with opened ends (src/engine/reopen) carries a low-rank update the sparse inverse cannot see.
  if (sys.some((s) => s.update)) throw new Error("sweepFaults: this network has opened ends; sweep it with sweepReopened");
  // Per factor, kept with the network: every sweep of it (and every thread's plan) reads the same subsets.
  const tk: InverseSubset[] = sys.map((s) => {
    let t = cache.inverses.get(s.factor);
    if (!t) {
      t = inverseSubset(s.factor);
      cache.inverses.set(s.factor, t);
    }
    return t;
  });

  const locs = options.devices ? [...options.devices] : [...model.devices];
  const D = locs.length;
  const J = model.inverters.length;
  const devices: SweepResult["devices"] = [];
  const base_A = new Float64Array(D);
  const shift_deg = new Float64Array(D);
  const busNodes = busIds.map((id) => model.busNode.get(id) ?? -1);
  busIds.forEach((id, b) => {
    if (busNodes[b] < 0) messages.push({ level: "warning", code: "not-in-service", text: `Bus ${id}: not in service in this scenario (or unknown); its faults are zero` });
  });
  const combos: (Combination | null)[] = [];
  for (let d = 0; d < D; d++) {
    const loc = locs[d];
    const combo = deviceCombination(model, used === "refined" ? "refined" : "iec", loc.element, loc.end);
    combos.push(combo);
    if (!combo) {
      devices.push({ element: loc.element, end: loc.end, bus: "" });
      messages.push({ level: "warning", code: "device-location", text: `Device location ${loc.element} (${loc.end}): element not in service in this scenario; its currents are zero`, element: loc.element });
      continue;
    }
    devices.push({ element: loc.element, end: loc.end, bus: combo.bus });
    const nd = model.nodes[combo.node];
    base_A[d] = (opts.baseMVA * 1000) / (SQRT3 * nd.un_kV);
    shift_deg[d] = nd.shift_deg;
  }
  const layout = transferLayout(model.nodes.length, sys[1].factor.ordering.inv, combos, busNodes);
  const blocks = Math.ceil(layout.bySlot.length / BLOCK);
  const negative = negativeCorrection(sys[1].factor, sys[2].factor, combos);
  const k = negative?.rank ?? 0;
  // W of the negative correction in the layout's rows: the factor's order in place, the swept buses' rows otherwise.
  let negativeW = negative?.w ?? new Float64Array(0);
  if (negative && !layout.inPlace) {
    negativeW = new Float64Array(layout.transferRows * k * 2);
    for (let r = 0; r < layout.transferRows; r++) {
      const from = layout.solveRow[r];
      if (from < 0) continue;
      for (let q = 0; q < 2 * k; q++) negativeW[r * 2 * k + q] = negative.w[from * 2 * k + q];
    }
  }
  const sizes: Record<keyof SweepArrays, number> = {
    // Blocks keep room for all three sequences; with the negative correction the third is never written (no memory
    // is touched for it).
    transfer: blocks * 6 * layout.transferRows * BLOCK,
    injMap: D * J * 6,
    negativeAlpha: negative ? layout.bySlot.length * k * 2 : 0,
    ikss_kA: B * T,
    maxPhase_kA: B * T,
    ip_kA: B,
    xr: B,
    faultSeq_pu: B * T * 6,
    inj_pu: B * T * J * 6,
    busShift_deg: B,
  };
  return { busIds, busNodes, types, locs, devices, combos, base_A, shift_deg, used, sysVariant, unitNodes: model.inverters.map((u) => u.node), sys, tk, messages, layout, negative, negativeW, blocks, sizes };
}

/** The arrays of a plan, each made by `make` (plain or shared memory), all zero. */
export function allocateSweep(plan: SweepPlan, make: (length: number) => Float64Array): SweepArrays {
  const z = plan.sizes;
  return {
    transfer: make(z.transfer),
    injMap: make(z.injMap),
    negativeAlpha: make(z.negativeAlpha),
    ikss_kA: make(z.ikss_kA),
    maxPhase_kA: make(z.maxPhase_kA),
    ip_kA: make(z.ip_kA),
    xr: make(z.xr),
    faultSeq_pu: make(z.faultSeq_pu),
    inj_pu: make(z.inj_pu),
    busShift_deg: make(z.busShift_deg),
  };
}

/** The result from the plan, its filled arrays and the outcomes of every part. */
export function assembleSweep(network: CompiledNetwork, plan: SweepPlan, a: SweepArrays, parts: SweepPartOutcome[]): SweepResult {
  const { model } = network.internal as EngineInternal;
  const overrides = parts.flatMap((p) => p.overrides).sort((x, y) => x.b - y.b || x.t - y.t);
  const messages = [...plan.messages, ...parts.flatMap((p) => p.messages)];
  const { transferRows, transferBusRow, transferSlot } = plan.layout;
  return {
    scenario: network.scenario,
    options: { ...network.options, inverterModel: plan.used },
    busIds: plan.busIds,
    types: plan.types,
    ikss_kA: a.ikss_kA,
    maxPhase_kA: a.maxPhase_kA,
    ip_kA: a.ip_kA,
    xr: a.xr,
    devices: plan.devices,
    deviceData: {
      base_A: plan.base_A,
      transfer: a.transfer,
      transferRows,
      transferBusRow,
      transferSlot,
      negative: plan.negative ? { rank: plan.negative.rank, w: plan.negativeW, alpha: a.negativeAlpha } : null,
      faultSeq_pu: a.faultSeq_pu,
      injMap: a.injMap,
      inj_pu: a.inj_pu,
      nInj: model.inverters.length,
      shift_deg: plan.shift_deg,
      busShift_deg: a.busShift_deg,
      overrides,
    },
    messages,
  };
}

/** Hands out work items 0, 1, 2, ... one at a time; threads sharing a sweep share one (see SweepPool in src/cli). */
export type Claim = () => number;

/** A claim for one thread alone. */
export function counter(): Claim {
  let next = 0;
  return () => next++;
}

/** Runs of buses a claim hands out at a time (see sweepBuses). */
export const SWEEP_CHUNK = 64;

/**
 * The faults of the runs of SWEEP_CHUNK buses that `claim` hands this thread (run c: buses c * SWEEP_CHUNK up to the
 * next run), synchronously, until it hands out a run past the last bus.
 */
export function sweepBuses(network: CompiledNetwork, plan: SweepPlan, arrays: SweepArrays, claim: Claim): SweepPartOutcome {
  const steps = sweepBusSteps(network, plan, arrays, claim);
  let r = steps.next();
  while (!r.done) r = steps.next(true);
  return r.value;
}

/** The faults of the claimed runs of buses, as steps that yield the fraction done and receive whether to go on. */
function* sweepBusSteps(network: CompiledNetwork, plan: SweepPlan, arrays: SweepArrays, claim: Claim): Generator<number, SweepPartOutcome, boolean> {
  const { model, cache } = network.internal as EngineInternal;
  const opts = network.options;
  const { busIds, busNodes, types, locs, devices, used, sysVariant, sys, tk } = plan;
  const { ikss_kA, maxPhase_kA, ip_kA, xr: xrOut, faultSeq_pu, inj_pu, busShift_deg } = arrays;
  const T = types.length;
  const B = busIds.length;
  const J = model.inverters.length;
  const messages: EngineMessage[] = [];
  // Columns of Z at the inverter nodes (positive and negative sequence).
  const colU = unitColumns(model, cache, sysVariant);
  const overrides: SweepResult["deviceData"]["overrides"] = [];
  const radial = new Map<number, boolean>();
  const islandUnits = new Map<number, IslandUnits>();
  // Branches and shunts meeting at each node (the radial peak factor looks at them for every faulted bus), built once
  // per network.
  let atNode = cache.atNode;
  if (!atNode) {
    const lists: { branches: number[]; shunts: number[] }[] = model.nodes.map(() => ({ branches: [], shunts: [] }));
    model.branches.forEach((br, i) => {
      lists[br.from].branches.push(i);
      if (br.to !== br.from) lists[br.to].branches.push(i);
    });
    model.shunts.forEach((sh, i) => lists[sh.node].shunts.push(i));
    atNode = cache.atNode = lists;
  }
  // Per-fault scratch: the fault map, its sequence currents and their magnitudes.
  const fw = { aff: new FaultAffine(), seq: new Float64Array(6), mags: { ikss: 0, maxPhase: 0 }, zf: { re: 0, im: 0 }, z0: { re: 0, im: 0 }, z1: { re: 0, im: 0 }, z2: { re: 0, im: 0 }, zS: { re: 0, im: 0 } };
  let iecFloating: ((node: number) => boolean) | undefined;
  const progressEvery = Math.max(1, Math.floor(B / 50));
  let cancelled = false;
  let done = 0;
  runs: for (let run = claim(); run * SWEEP_CHUNK < B; run = claim())
    for (let b = run * SWEEP_CHUNK, end = Math.min(B, b + SWEEP_CHUNK); b < end; b++, done++) {
      if (done > 0 && done % progressEvery === 0 && !(yield done / B)) {
        cancelled = true;
        break runs;
      }
      const k = busNodes[b];
      if (k < 0) continue;
      const node = model.nodes[k];
      busShift_deg[b] = node.shift_deg;
      if (!model.islandLive[node.island]) continue;
      const un = node.un_kV;
      const iBase_kA = opts.baseMVA / (SQRT3 * un);
      // Islands of current sources only, and nodes inside a power station unit (their own corrections, see
      // locateFault), are solved one fault at a time.
      if (sys[1].floating[sys[1].comp[k]] || sys[2].floating[sys[2].comp[k]] || model.inUnit?.has(k)) {
        overrideBus(network, busIds[b], b, types, locs, devices, { ikss_kA, maxPhase_kA, ip_kA, xr: xrOut, overrides }, used);
        continue;
      }
      const iec = opts.method === "iec60909";
      const c = iec ? voltageFactor(un, opts.limit, opts.lvTolerance_pct) : opts.prefault_pu;
      const zBase = (un * un) / opts.baseMVA;
      // Per-bus values in reused records (the sweep allocates nothing per fault).
      const { zf, z0, z1, z2 } = fw;
      zf.re = opts.faultR_ohm / zBase;
      zf.im = opts.faultX_ohm / zBase;
      z0.re = tk[0].re[k];
      z0.im = tk[0].im[k];
      z1.re = tk[1].re[k];
      z1.im = tk[1].im[k];
      z2.re = tk[2].re[k];
      z2.im = tk[2].im[k];
      const zeroFloats = sys[0].floating[sys[0].comp[k]];
      let isl = islandUnits.get(node.island);
      if (!isl) {
        isl = islandWork(model, node.island, colU);
        islandUnits.set(node.island, isl);
      }
      const { unitIdx, iecInj, noInj, work, response } = isl;
      const Jl = unitIdx.length;
      isl.vpre.fill(c);
      // Z_s[u_j, k] (reciprocity): for the refined response, and for the open-circuit voltages the injections make
      // at the fault.
      loadFaultColumns(response, colU, unitIdx, k);
      let ik3 = -1;
      // IEC 60909 converter currents depend on the faulted bus only (arg I_j = -arg Z_kj): once for all fault types.
      if (Jl > 0 && used === "iec") {
        for (let l = 0; l < Jl; l++) {
          const u = model.inverters[unitIdx[l]];
          const ang = -Math.atan2(response.z1i[l], response.z1r[l]);
          iecInj.re[l] = u.iMax_pu * u.ir_pu * Math.cos(ang);
          iecInj.im[l] = u.iMax_pu * u.ir_pu * Math.sin(ang);
        }
      }
      const { aff, seq, mags } = fw;
      for (let t = 0; t < T; t++) {
        const type = types[t];
        aff.load(type, zeroFloats ? null : z0, z1, z2, zf);
        let inj1: ComplexVec = noInj;
        let inj2: ComplexVec = noInj;
        if (Jl > 0 && used === "iec") inj1 = iecInj;
        else if (Jl > 0) {
          // Iterate on the closed-form response at the unit nodes; then only the fault currents are needed.
          const report = iterateInjections(isl.units, responseFromAffine(response, aff, c, isl.g), isl.vpre, work);
          // Per-unit injections (grid-forming: the limiting correction; the shunt part is in the transfer).
          inj1 = isl.x1;
          inj2 = isl.x2;
          if (!report.converged) messages.push({ level: "warning", code: "inverter-not-converged", text: `${type} fault at bus ${busIds[b]}: the refined inverter iteration did not converge` });
        }
        // Open-circuit voltages at the fault with the injections: E1 = c + sum Z1[k, u] x1_u, E2 = sum Z2[k, u] x2_u.
        let e1r = c;
        let e1i = 0;
        let e2r = 0;
        let e2i = 0;
        for (let l = 0; l < Jl; l++) {
          const ar = response.z1r[l];
          const ai = response.z1i[l];
          const br = response.z2r[l];
          const bi = response.z2i[l];
          e1r += ar * inj1.re[l] - ai * inj1.im[l];
          e1i += ar * inj1.im[l] + ai * inj1.re[l];
          e2r += br * inj2.re[l] - bi * inj2.im[l];
          e2i += br * inj2.im[l] + bi * inj2.re[l];
        }
        aff.apply(e1r, e1i, e2r, e2i, seq);
        faultMagnitudesOf(type, seq, mags);
        ikss_kA[b * T + t] = mags.ikss * iBase_kA;
        maxPhase_kA[b * T + t] = mags.maxPhase * iBase_kA;
        if (type === "3ph") ik3 = mags.ikss * iBase_kA;
        faultSeq_pu.set(seq, (b * T + t) * 6);
        for (let l = 0; l < Jl; l++) {
          const o = ((b * T + t) * J + unitIdx[l]) * 6;
          inj_pu[o + 2] = inj1.re[l];
          inj_pu[o + 3] = inj1.im[l];
          inj_pu[o + 4] = inj2.re[l];
          inj_pu[o + 5] = inj2.im[l];
        }
      }
      // A sweep without the three-phase fault has only the sources' bolted I"k for ip (converters not counted).
      if (ik3 < 0) ik3 = (c / Math.hypot(z1.re, z1.im)) * iBase_kA;
      // The voltage sources' share of the three-phase I"k (every converter removed), which alone carries kappa.
      let zS: Cx | null = z1;
      if (Jl > 0 && sysVariant === "refined") {
        isl.share ??= new SourceShare(model, node.island, unitIdx, colU, (iecFloating ??= iecFloatingOf(model)));
        zS = isl.share.drivingPoint(z1, response.z1r, response.z1i, fw.zS);
      }
      const ik3S = zS ? (c / Math.hypot(zS.re + zf.re, zS.im + zf.im)) * iBase_kA : 0;
      let isRadial = radial.get(node.island);
      if (isRadial === undefined) {
        isRadial = isRadialIsland(model, node.island);
        radial.set(node.island, isRadial);
      }
      ip_kA[b] = peakCurrent_kA(sweepKappa(model, atNode[k], tk[1], k, z1, c, un, isRadial), ik3, ik3S);
      xrOut[b] = z1.re > 0 ? z1.im / z1.re : 1e9;
    }
  return { messages, overrides, cancelled };
}

/** Per island: its units and the workspace their iteration reuses for every bus and fault type. */
interface IslandUnits {
  unitIdx: number[];
  units: ReturnType<typeof compactUnits>;
  block: ReturnType<typeof unitBlock>;
  response: FaultCoupledResponse;
  work: InjectionWork;
  vpre: Float64Array;
  g: Float64Array;
  /** Views of the workspace's injections (the iterate) as complex vectors. */
  x1: ComplexVec;
  x2: ComplexVec;
  iecInj: ComplexVec;
  noInj: ComplexVec;
  /** The network without converters, for the voltage sources' share of I"k (made when first needed). */
  share?: SourceShare;
}

function islandWork(model: EngineInternal["model"], island: number, colU: ComplexVec[][]): IslandUnits {
  const unitIdx = model.inverters.map((u, j) => (model.nodes[u.node].island === island ? j : -1)).filter((j) => j >= 0);
  const J = unitIdx.length;
  const block = unitBlock(model, unitIdx, colU);
  const work = new InjectionWork(J);
  return {
    unitIdx,
    units: compactUnits(model, unitIdx),
    block,
    response: new FaultCoupledResponse(J, block),
    work,
    vpre: new Float64Array(J),
    g: new Float64Array(8),
    x1: { re: work.x1r, im: work.x1i },
    x2: { re: work.x2r, im: work.x2i },
    iecInj: { re: new Float64Array(J), im: new Float64Array(J) },
    noInj: { re: new Float64Array(J), im: new Float64Array(J) },
  };
}

/** Devices solved together (one cache line of doubles per row); the transfer layout is documented in SweepDeviceData. */
const BLOCK = TRANSFER_BLOCK;

interface TransferLayout {
  /** Whether the block solves run in the result (rows = nodes in the factor's order) or are copied out by bus. */
  inPlace: boolean;
  /** Rows of each part: every node of the network when the sweep covers most of them, else just its buses. */
  transferRows: number;
  transferBusRow: Int32Array;
  transferSlot: Int32Array;
  /** Row of each swept bus in the solve's order, -1 out of service. */
  solveRow: Int32Array;
  /** Device location of each slot. */
  bySlot: number[];
}

function transferLayout(n: number, inv: Int32Array, combos: (Combination | null)[], busNodes: number[]): TransferLayout {
  const D = combos.length;
  const B = busNodes.length;
  // In place: when the sweep covers most nodes the block solves run in the result itself (rows = every node in the
  // factor's order). A sweep of a few buses copies just their rows.
  const inPlace = 2 * B >= n;
  const rows = inPlace ? n : B;
  const busRow = new Int32Array(B);
  const solveRow = new Int32Array(B);
  for (let b = 0; b < B; b++) {
    solveRow[b] = busNodes[b] < 0 ? -1 : inv[busNodes[b]];
    busRow[b] = busNodes[b] < 0 ? -1 : inPlace ? solveRow[b] : b;
  }
  // Slots: device locations that see zero-sequence current first, then those that never do (behind a delta
  // winding), so that whole blocks of the latter skip the zero-sequence solve and its memory.
  const slot = new Int32Array(D).fill(-1);
  const bySlot: number[] = [];
  const seesZero = (d: number) => (combos[d]?.terms[0]?.nodes.length ?? 0) > 0;
  for (let d = 0; d < D; d++) if (combos[d] && seesZero(d)) bySlot.push(d);
  for (let d = 0; d < D; d++) if (combos[d] && !seesZero(d)) bySlot.push(d);
  bySlot.forEach((d, k) => (slot[d] = k));
  return { inPlace, transferRows: rows, transferBusRow: busRow, transferSlot: slot, solveRow, bySlot };
}

/**
 * The device blocks `claim` hands this thread, until it hands out one past the last: X_s = Z_s C_s for BLOCK devices
 * at a time per sequence (see solveLdltBlock), and their rows injMap[d, j, s] = (Z_s c_d)[node_j], the unit's own
 * injection entering its terminal current with -1. Values equal those of one solve per device and sequence, bit for
 * bit.
 */
export function sweepTransfers(plan: SweepPlan, arrays: SweepArrays, claim: Claim): void {
  const { sys, combos, layout, negative } = plan;
  const { transfer, injMap, negativeAlpha: alpha } = arrays;
  const k = negative?.rank ?? 0;
  const n = sys[1].factor.n;
  const B = plan.busIds.length;
  const J = plan.unitNodes.length;
  const inv = sys[1].factor.ordering.inv;
  const { transferRows: rows, solveRow, bySlot, inPlace } = layout;
  const used = bySlot.length;
  const part = rows * BLOCK;
  const unitRow = new Int32Array(J);
  for (let j = 0; j < J; j++) unitRow[j] = inv[plan.unitNodes[j]] * BLOCK;
  const scratch = inPlace ? null : { re: new Float64Array(n * BLOCK), im: new Float64Array(n * BLOCK) };
  const cols = new Int32Array(BLOCK);
  for (let blk = claim(); blk < plan.blocks; blk = claim()) {
    const m = Math.min(BLOCK, used - blk * BLOCK);
    for (let c = 0; c < m; c++) cols[c] = bySlot[blk * BLOCK + c];
    for (let s = 0; s < (negative ? 2 : 3); s++) {
      const o = (blk * 3 + s) * 2 * part;
      const xr = scratch ? scratch.re : transfer.subarray(o, o + part);
      const xi = scratch ? scratch.im : transfer.subarray(o + part, o + 2 * part);
      let any = false;
      for (let c = 0; c < m && !any; c++) any = (combos[cols[c]]?.terms[s]?.nodes.length ?? 0) > 0;
      // A sequence no device of the block sees stays untouched (zero). Otherwise touch the fresh memory in order
      // first: that costs a fraction of what the solve's scattered first touches would.
      if (!any) continue;
      xr.fill(0);
      xi.fill(0);
      for (let c = 0; c < m; c++) {
        const tm = combos[cols[c]]?.terms[s];
        if (!tm) continue;
        for (let q = 0; q < tm.nodes.length; q++) {
          const at = inv[tm.nodes[q]] * BLOCK + c;
          xr[at] += tm.re[q];
          xi[at] += tm.im[q];
        }
      }
      solveLdltBlock(sys[s].factor, xr, xi, BLOCK);
      for (let c = 0; c < m; c++) {
        const at = (cols[c] * J) * 6 + 2 * s;
        for (let j = 0; j < J; j++) {
          injMap[at + j * 6] = xr[unitRow[j] + c];
          injMap[at + j * 6 + 1] = xi[unitRow[j] + c];
        }
      }
      if (negative && s === 1) {
        // The negative sequence from the positive: alpha per device, and the unit rows X2 = X1 - W alpha.
        for (let c = 0; c < m; c++) {
          const d = cols[c];
          const slot = blk * BLOCK + c;
          negativeAlpha(negative, xr, xi, BLOCK, c, negative.dc[d], alpha, slot * 2 * k);
          const at = (d * J) * 6 + 4;
          for (let j = 0; j < J; j++) {
            const row = unitRow[j] / BLOCK;
            let vr = xr[unitRow[j] + c];
            let vi = xi[unitRow[j] + c];
            for (let h = 0; h < k; h++) {
              const wr = negative.w[(row * k + h) * 2];
              const wi = negative.w[(row * k + h) * 2 + 1];
              const ar = alpha[(slot * k + h) * 2];
              const ai = alpha[(slot * k + h) * 2 + 1];
              vr -= wr * ar - wi * ai;
              vi -= wr * ai + wi * ar;
            }
            injMap[at + j * 6] = vr;
            injMap[at + j * 6 + 1] = vi;
          }
        }
      }
      if (scratch) {
        for (let b = 0; b < B; b++) {
          const r = solveRow[b];
          if (r < 0) continue;
          const to = o + b * BLOCK;
          const from = r * BLOCK;
          for (let c = 0; c < m; c++) {
            transfer[to + c] = xr[from + c];
            transfer[to + part + c] = xi[from + c];
          }
        }
      }
    }
    for (let c = 0; c < m; c++) {
      const d = cols[c];
      const unit = combos[d]?.unit ?? -1;
      if (unit < 0) continue;
      for (let s = 1; s < 3; s++) injMap[(d * J + unit) * 6 + 2 * s] -= 1;
    }
  }
}

/** kappa at node k from the inverse subset: radial branch sum (entries Z[m,k] of the branches at k) or method B. */
function sweepKappa(
  model: EngineInternal["model"],
  here: { branches: number[]; shunts: number[] },
  tk: InverseSubset,
  k: number,
  zkk: Cx,
  c: number,
  un_kV: number,
  isRadial: boolean,
): number {
  const m2 = zkk.re * zkk.re + zkk.im * zkk.im;
  if (!(m2 > 0)) return 1;
  if (!isRadial) return Math.min(1.15 * peakFactor(zkk.im > 0 ? zkk.re / zkk.im : 10), un_kV <= 1 ? 1.8 : 2.0);
  // dV_j = -c Z[j,k] / Zkk; I = y (a dV_k - dV_o / t) for each branch at k, y dV_k for each shunt; each current's
  // peak factor from its own R/X (the branch-sum method).
  const dkr = (-c * (zkk.re * zkk.re + zkk.im * zkk.im)) / m2;
  const dki = (-c * (zkk.im * zkk.re - zkk.re * zkk.im)) / m2;
  let sumPeak = 0;
  const add = (ir: number, ii: number): void => {
    const f2 = ir * ir + ii * ii;
    if (!(Math.sqrt(f2) > 1e-12)) return;
    const zr = (c * -ir) / f2;
    const zi = (-c * -ii) / f2;
    sumPeak += peakFactor(Math.max(0, zi > 0 ? zr / zi : 10)) * Math.sqrt(f2);
  };
  for (const bi of here.branches) {
    const br = model.branches[bi];
    const y = br.y[1];
    if (!y) continue;
    const o = br.from === k ? br.to : br.from;
    const z = o === k ? zkk : tk.entry(o, k);
    const zr = z ? z.re : 0;
    const zi = z ? z.im : 0;
    const dor = (-c * (zr * zkk.re + zi * zkk.im)) / m2;
    const doi = (-c * (zi * zkk.re - zr * zkk.im)) / m2;
    const t = br.t;
    // current at k's end: from end y/t^2 dVk - y/t dVo; to end y dVk - y/t dVo
    const a = br.from === k ? 1 / (t * t) : 1;
    const ur = a * dkr - dor / t;
    const ui = a * dki - doi / t;
    add(y.re * ur - y.im * ui, y.re * ui + y.im * ur);
  }
  for (const si of here.shunts) {
    const sh = model.shunts[si];
    if (sh.refinedOnly || !sh.y[1]) continue;
    const y = sh.y[1];
    add(y.re * dkr - y.im * dki, y.re * dki + y.im * dkr);
  }
  return sumPeak > 0 ? sumPeak / (c / Math.sqrt(m2)) : 1;
}

interface OverrideTargets {
  ikss_kA: Float64Array;
  maxPhase_kA: Float64Array;
  ip_kA: Float64Array;
  xr: Float64Array;
  overrides: SweepResult["deviceData"]["overrides"];
}

/** A bus in an island of current sources only: solved one fault at a time. */
function overrideBus(
  network: CompiledNetwork,
  bus: string,
  b: number,
  types: FaultType[],
  locs: { element: string; end: string }[],
  devices: SweepResult["devices"],
  out: OverrideTargets,
  inverterModel: "iec" | "refined",
): void {
  const T = types.length;
  types.forEach((type, t) => {
    const r = solveFault(network, { kind: "bus", bus }, type, { inverterModel });
    out.ikss_kA[b * T + t] = r.ikss_kA;
    out.maxPhase_kA[b * T + t] = r.maxPhase_kA;
    if (type === "3ph" || out.ip_kA[b] === 0) {
      out.ip_kA[b] = r.ip_kA;
      out.xr[b] = r.xr;
    }
    const seq_A = new Float64Array(locs.length * 6);
    locs.forEach((loc, d) => {
      if (!devices[d].bus) return;
      const e = (loc.end === "terminal" ? r.shunts : r.branchEnds).find((x) => x.element === loc.element && x.end === loc.end);
      if (!e) return;
      for (let s = 0; s < 3; s++) {
        const p = e.seq_A[s];
        const a = (p.ang_deg * Math.PI) / 180;
        seq_A[d * 6 + 2 * s] = p.mag * Math.cos(a);
        seq_A[d * 6 + 2 * s + 1] = p.mag * Math.sin(a);
      }
    });
    out.overrides.push({ b, t, seq_A });
  });
}
