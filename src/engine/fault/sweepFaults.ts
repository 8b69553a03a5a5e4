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
import { compactUnits, loadFaultColumns, responseFromAffine, unitBlock, unitColumns, type CompactFaultInput } from "./compactFault.ts";
import { FaultAffine, faultMagnitudesOf } from "./faultAffine.ts";
import { FaultCoupledResponse } from "../inverter/unitResponse.ts";
import { InjectionWork, iterateInjections } from "../inverter/refinedIteration.ts";
import { solveLdltBlock } from "../sparse/ldlt.ts";
import { inverseSubset, type InverseSubset } from "../sparse/takahashi.ts";
import { deviceCombination, type Combination } from "./deviceCombination.ts";
import type { SeqView } from "./faultEquations.ts";
import { voltageFactor, peakFactor } from "../iec60909/factors.ts";
import { isRadialIsland } from "./peakCurrent.ts";
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
  const tk: InverseSubset[] = sys.map((s) => inverseSubset(s.factor));

  const locs = options.devices ? [...options.devices] : [...model.devices];
  const D = locs.length;
  const J = model.inverters.length;
  const devices: SweepResult["devices"] = [];
  const base_A = new Float64Array(D);
  const shift_deg = new Float64Array(D);
  const injMap = new Float64Array(D * J * 6);
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
  const layout = deviceTransfers(model, sys, combos, busNodes, injMap);
  // Columns of Z at the inverter nodes (positive and negative sequence).
  const colU = unitColumns(model, cache, sysVariant);

  const ikss_kA = new Float64Array(B * T);
  const maxPhase_kA = new Float64Array(B * T);
  const ip_kA = new Float64Array(B);
  const xrOut = new Float64Array(B);
  const faultSeq_pu = new Float64Array(B * T * 6);
  const inj_pu = new Float64Array(B * T * J * 6);
  const busShift_deg = new Float64Array(B);
  const overrides: SweepResult["deviceData"]["overrides"] = [];
  const radial = new Map<number, boolean>();
  const islandUnits = new Map<number, IslandUnits>();
  // Branches and shunts meeting at each node (the radial peak factor looks at them for every faulted bus).
  const atNode: { branches: number[]; shunts: number[] }[] = model.nodes.map(() => ({ branches: [], shunts: [] }));
  model.branches.forEach((br, i) => {
    atNode[br.from].branches.push(i);
    if (br.to !== br.from) atNode[br.to].branches.push(i);
  });
  model.shunts.forEach((sh, i) => atNode[sh.node].shunts.push(i));
  // Per-fault scratch: the fault map, its sequence currents and their magnitudes.
  const fw = { aff: new FaultAffine(), seq: new Float64Array(6), mags: { ikss: 0, maxPhase: 0 } };
  const progressEvery = Math.max(1, Math.floor(B / 50));
  let cancelled = false;

  for (let b = 0; b < B; b++) {
    if (b % progressEvery === 0 && b > 0 && !(yield b / B)) {
      cancelled = true;
      break;
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
    const zf: Cx = { re: opts.faultR_ohm / zBase, im: opts.faultX_ohm / zBase };
    const zkk = [0, 1, 2].map((s) => ({ re: tk[s].re[k], im: tk[s].im[k] }));
    const zeroFloats = sys[0].floating[sys[0].comp[k]];
    const zeroView: SeqView = zeroFloats ? { floating: true, j: { re: 0, im: 0 } } : { floating: false, e: { re: 0, im: 0 }, z: zkk[0] };
    let isl = islandUnits.get(node.island);
    if (!isl) {
      isl = islandWork(model, node.island, colU);
      islandUnits.set(node.island, isl);
    }
    const { unitIdx, iecInj, noInj, work, response } = isl;
    const Jl = unitIdx.length;
    const cin: CompactFaultInput = { model, unitIdx, colU, k, type: "3ph", zf, c, zeroView, z1kk: zkk[1], z2kk: zkk[2], block: isl.block };
    isl.vpre.fill(c);
    // Z_s[u_j, k]: for the refined response, and for the open-circuit voltages the injections make at the fault.
    if (Jl > 0) loadFaultColumns(response, cin);
    let ik3 = -1;
    // IEC 60909 converter currents depend on the faulted bus only (arg I_j = -arg Z_kj): once for all fault types.
    if (Jl > 0 && used === "iec") {
      unitIdx.forEach((g, l) => {
        const u = model.inverters[g];
        const ang = -Math.atan2(colU[1][g].im[k], colU[1][g].re[k]);
        iecInj.re[l] = u.iMax_pu * u.ir_pu * Math.cos(ang);
        iecInj.im[l] = u.iMax_pu * u.ir_pu * Math.sin(ang);
      });
    }
    const { aff, seq, mags } = fw;
    for (let t = 0; t < T; t++) {
      const type = types[t];
      aff.load(type, zeroFloats ? null : zkk[0], zkk[1], zkk[2], zf);
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
    if (ik3 < 0) ik3 = (c / Math.hypot(zkk[1].re, zkk[1].im)) * iBase_kA;
    let isRadial = radial.get(node.island);
    if (isRadial === undefined) {
      isRadial = isRadialIsland(model, node.island);
      radial.set(node.island, isRadial);
    }
    ip_kA[b] = sweepKappa(model, atNode[k], tk[1], k, zkk[1], c, un, isRadial) * Math.SQRT2 * ik3;
    xrOut[b] = zkk[1].re > 0 ? zkk[1].im / zkk[1].re : 1e9;
  }
  if (cancelled) messages.push({ level: "info", code: "cancelled", text: "Sweep cancelled before it finished" });
  else options.onProgress?.(1);
  return {
    scenario: network.scenario,
    options: { ...opts, inverterModel: used },
    busIds,
    types,
    ikss_kA,
    maxPhase_kA,
    ip_kA,
    xr: xrOut,
    devices,
    deviceData: { base_A, ...layout, faultSeq_pu, injMap, inj_pu, nInj: J, shift_deg, busShift_deg, overrides },
    messages,
  };
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
  transfer: Float64Array;
  transferRows: number;
  transferBusRow: Int32Array;
  transferSlot: Int32Array;
}

/**
 * X_s = Z_s C_s for the device combinations, BLOCK devices at a time per sequence (see solveLdltBlock), and
 * injMap[d, j, s] = (Z_s c_d)[node_j]. When the sweep covers most nodes the block solves run in place in the result
 * (rows = every node in the factor's order): writing them out again bus by bus would cost more than the solves
 * themselves, most of it in first touches of fresh memory. A sweep of a few buses copies just their rows. The unit's
 * own injection enters its terminal current with -1. Values equal those of one solve per device and sequence, bit
 * for bit.
 */
function deviceTransfers(
  model: EngineInternal["model"],
  sys: [SequenceSystem, SequenceSystem, SequenceSystem],
  combos: (Combination | null)[],
  busNodes: number[],
  injMap: Float64Array,
): TransferLayout {
  const n = model.nodes.length;
  const D = combos.length;
  const B = busNodes.length;
  const J = model.inverters.length;
  const inv = sys[1].factor.ordering.inv;
  const inPlace = 2 * B >= n;
  const rows = inPlace ? n : B;
  // Each bus's row in the layout and in the solve (the ordering is shared by all sequences).
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
  const used = bySlot.length;
  const blocks = Math.ceil(used / BLOCK);
  const part = rows * BLOCK;
  const transfer = new Float64Array(blocks * 6 * part);
  const unitRow = new Int32Array(J);
  for (let j = 0; j < J; j++) unitRow[j] = inv[model.inverters[j].node] * BLOCK;
  const scratch = inPlace ? null : { re: new Float64Array(n * BLOCK), im: new Float64Array(n * BLOCK) };
  const cols = new Int32Array(BLOCK);
  for (let blk = 0; blk < blocks; blk++) {
    const m = Math.min(BLOCK, used - blk * BLOCK);
    for (let c = 0; c < m; c++) cols[c] = bySlot[blk * BLOCK + c];
    for (let s = 0; s < 3; s++) {
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
  }
  for (let d = 0; d < D; d++) {
    const combo = combos[d];
    if (!combo || combo.unit < 0) continue;
    for (let s = 1; s < 3; s++) injMap[(d * J + combo.unit) * 6 + 2 * s] -= 1;
  }
  return { transfer, transferRows: rows, transferBusRow: busRow, transferSlot: slot };
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
  // dV_j = -c Z[j,k] / Zkk
  const dv = (j: number): Cx => {
    const z = j === k ? zkk : (tk.entry(j, k) ?? { re: 0, im: 0 });
    return { re: (-c * (z.re * zkk.re + z.im * zkk.im)) / m2, im: (-c * (z.im * zkk.re - z.re * zkk.im)) / m2 };
  };
  let sumPeak = 0;
  const dk = dv(k);
  const add = (ir: number, ii: number) => {
    const mag = Math.hypot(ir, ii);
    if (!(mag > 1e-12)) return;
    const f2 = ir * ir + ii * ii;
    const zr = (c * -ir) / f2;
    const zi = (-c * -ii) / f2;
    sumPeak += peakFactor(Math.max(0, zi > 0 ? zr / zi : 10)) * mag;
  };
  for (const bi of here.branches) {
    const br = model.branches[bi];
    const y = br.y[1];
    if (!y) continue;
    const other = dv(br.from === k ? br.to : br.from);
    const t = br.t;
    // current at k's end: from end y/t^2 dVk - y/t dVo; to end y dVk - y/t dVo
    const a = br.from === k ? 1 / (t * t) : 1;
    const ur = a * dk.re - other.re / t;
    const ui = a * dk.im - other.im / t;
    add(y.re * ur - y.im * ui, y.re * ui + y.im * ur);
  }
  for (const si of here.shunts) {
    const s = model.shunts[si];
    if (s.refinedOnly || !s.y[1]) continue;
    const y = s.y[1];
    add(y.re * dk.re - y.im * dk.im, y.re * dk.im + y.im * dk.re);
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
