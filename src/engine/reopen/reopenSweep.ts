// Many bus faults with the same ends open, from one update of the base factorization (a mini-sweep): per bus one
// column of each updated sequence network (a solve with the base factor plus the low-rank correction), then every
// fault type and device location in a few complex operations. The result has the sweep's form (types.ts
// SweepResult), read with sweepDeviceCurrents / sweepDeviceCurrentsInto:
//   I_d,s(b, t) = -X_s[k_b, d] If_s(b, t) + sum_j injMap[d, j, s] inj_s(b, t, j),   X_s[k, d] = c_d^T Z'_s[:, k]
// (reciprocity), with the IEC 60909 full-size-converter injections in closed form and the refined converter model
// iterating on each island's units through their closed-form response, as the all-bus sweep does. Faults the closed
// form does not cover are solved one at a time on the same update and kept as overrides: islands of current sources
// only, undetermined faults; faults at a power station unit's LV node go to the fresh compile.
import type { CompiledNetwork, EngineMessage, FaultType, InverterModel, SweepResult } from "../types.ts";
import { FAULT_TYPES, TRANSFER_BLOCK } from "../types.ts";
import type { Cx } from "../network/model.ts";
import { sequenceSystem, zColumn, type SequenceSystem } from "../network/sequenceSystem.ts";
import { deviceCombination, type Combination } from "../fault/deviceCombination.ts";
import { compactUnits, loadFaultColumns, responseFromAffine, unitBlock, unitColumns } from "../fault/compactFault.ts";
import { FaultAffine, faultMagnitudesOf } from "../fault/faultAffine.ts";
import { FaultCoupledResponse } from "../inverter/unitResponse.ts";
import { InjectionWork, iterateInjections } from "../inverter/refinedIteration.ts";
import type { ComplexVec } from "../fault/solveLinearFault.ts";
import type { Model } from "../network/model.ts";
import { faultEquations, type SeqView } from "../fault/faultEquations.ts";
import { faultMagnitudes } from "../fault/faultCurrentMagnitude.ts";
import { voltageFactor } from "../iec60909/factors.ts";
import type { EngineInternal } from "../fault/solveFault.ts";
import { faultFallback, reopenedSet, referenceNetwork, solveReopened, type OpenEnd, type ReopenContext } from "./reopenNetwork.ts";
import { sweepFaults } from "../fault/sweepFaults.ts";
import { peakCurrent_kA, peakKappa } from "../fault/peakCurrent.ts";
import { SourceShare, iecFloatingOf } from "../fault/sourceShare.ts";

const SQRT3 = Math.sqrt(3);

export interface ReopenSweepOptions {
  /** Bus ids to fault (default: every bus). */
  buses?: string[];
  /** Fault types (default: all four). */
  types?: FaultType[];
  /** Device locations to report (default: every protective device's `at` in service). */
  devices?: { element: string; end: "from" | "to" | "terminal" }[];
  /** Override study.inverterModel. */
  inverterModel?: InverterModel;
}

/**
 * Every listed bus fault with `ends` open; ip_kA and xr on the three-phase basis per bus, as sweepFaults gives them. Sets that need a fresh compile (a switch opened) are swept on it.
 */
export function sweepReopened(ctx: ReopenContext, ends: readonly OpenEnd[], options: ReopenSweepOptions = {}): SweepResult {
  const set = reopenedSet(ctx, ends);
  if (!set.network) {
    const r = sweepFaults(referenceNetwork(ctx, set), options);
    r.messages.push({ level: "info", code: "reopen-fresh-compile", text: `Re-solved by a fresh compile of the network: ${set.fallback}` });
    return r;
  }
  const net = set.network;
  const { model, cache } = net.internal as EngineInternal;
  const opts = net.options;
  const types = options.types ? [...options.types] : [...FAULT_TYPES];
  const T = types.length;
  const busIds = options.buses ? [...options.buses] : model.nodes.flatMap((nd) => nd.buses);
  const B = busIds.length;
  const J = model.inverters.length;
  const used: InverterModel = J > 0 ? (options.inverterModel ?? opts.inverterModel) : "iec";
  const hasGfm = model.shunts.some((s) => s.refinedOnly);
  const variant = used === "refined" && hasGfm ? "refined" : "iec";
  const sys = [0, 1, 2].map((s) => sequenceSystem(model, cache, s as 0 | 1 | 2, variant)) as [SequenceSystem, SequenceSystem, SequenceSystem];
  const messages: EngineMessage[] = [];
  const locs = options.devices ? [...options.devices] : [...model.devices];
  const D = locs.length;
  const live = (node: number) => model.islandLive[model.nodes[node].island] === true;
  const colU = J > 0 ? unitColumns(model, cache, variant) : [[], [], []];
  const plan = devicePlan(net, locs, used, variant, sys);
  const { combos } = plan;
  const devices = plan.devices.map((d) => ({ ...d }));
  messages.push(...plan.messages);
  const blocks = Math.ceil(D / TRANSFER_BLOCK);
  const transfer = new Float64Array(blocks * 6 * B * TRANSFER_BLOCK);
  const part = B * TRANSFER_BLOCK;
  const at = (b: number, d: number) => (d - (d % TRANSFER_BLOCK)) * 6 * B + b * TRANSFER_BLOCK + (d % TRANSFER_BLOCK);

  const ikss_kA = new Float64Array(B * T);
  const maxPhase_kA = new Float64Array(B * T);
  const ip_kA = new Float64Array(B);
  const xr = new Float64Array(B);
  const faultSeq_pu = new Float64Array(B * T * 6);
  const inj_pu = new Float64Array(B * T * J * 6);
  const busShift_deg = new Float64Array(B);
  const transferBusRow = new Int32Array(B).fill(-1);
  const overrides: SweepResult["deviceData"]["overrides"] = [];
  const injR = new Float64Array(J);
  const injI = new Float64Array(J);
  const islands = new Map<number, IslandUnits>();
  let iecFloating: ((node: number) => boolean) | undefined;
  const aff = new FaultAffine();
  const seq = new Float64Array(6);
  const mags = { ikss: 0, maxPhase: 0 };

  for (let b = 0; b < B; b++) {
    const k = model.busNode.get(busIds[b]);
    if (k === undefined) {
      messages.push({ level: "warning", code: "not-in-service", text: `Bus ${busIds[b]}: not in service in this scenario (or unknown); its faults are zero` });
      continue;
    }
    const node = model.nodes[k];
    busShift_deg[b] = node.shift_deg;
    if (!live(k)) continue;
    transferBusRow[b] = b;
    const location = { kind: "bus" as const, bus: busIds[b] };
    // One fault at a time (same update, or the fresh compile inside a power station unit).
    const oneByOne = () => {
      types.forEach((type, t) => {
        const r = solveReopened(ctx, ends, location, type, { inverterModel: used });
        ikss_kA[b * T + t] = r.ikss_kA;
        maxPhase_kA[b * T + t] = r.maxPhase_kA;
        if (type === "3ph" || ip_kA[b] === 0) {
          ip_kA[b] = r.ip_kA;
          xr[b] = r.xr;
        }
        const seq_A = new Float64Array(D * 6);
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
        overrides.push({ b, t, seq_A });
      });
    };
    if (sys[1].floating[sys[1].comp[k]] || sys[2].floating[sys[2].comp[k]] || faultFallback(ctx, location) !== null) {
      oneByOne();
      continue;
    }
    const un = node.un_kV;
    const iBase_kA = opts.baseMVA / (SQRT3 * un);
    const c = opts.method === "iec60909" ? voltageFactor(un, opts.limit, opts.lvTolerance_pct) : opts.prefault_pu;
    const zBase = (un * un) / opts.baseMVA;
    const zf: Cx = { re: opts.faultR_ohm / zBase, im: opts.faultX_ohm / zBase };
    const zeroFloats = sys[0].floating[sys[0].comp[k]];
    const cols = [zeroFloats ? null : zColumn(sys[0], k), zColumn(sys[1], k), zColumn(sys[2], k)];
    // X_s[k, d] into the transfer (zero where the fault's part does not reach).
    combos.forEach((combo, d) => {
      if (!combo) return;
      for (let s = 0; s < 3; s++) {
        const col = cols[s];
        if (!col) continue;
        const t: Combination["terms"][number] = combo.terms[s];
        const ck = sys[s].comp[k];
        let re = 0;
        let im = 0;
        for (let q = 0; q < t.nodes.length; q++) {
          const nq = t.nodes[q];
          if (!live(nq) || sys[s].comp[nq] !== ck) continue;
          re += t.re[q] * col.re[nq] - t.im[q] * col.im[nq];
          im += t.re[q] * col.im[nq] + t.im[q] * col.re[nq];
        }
        const o = at(b, d) + 2 * s * part;
        transfer[o] = re;
        transfer[o + part] = im;
      }
    });
    const z = cols.map((col) => (col ? { re: col.re[k], im: col.im[k] } : null));
    const z1 = z[1] as Cx;
    xr[b] = z1.re > 0 ? z1.im / z1.re : 1e9;
    // Peak current on the three-phase basis, as the all-bus sweep gives it (IEC 60909-0:2016, 8.1): kappa from the
    // branch sum or method B at k, the three-phase I"k (the sources' bolted one without a 3ph fault in the list)
    // and the voltage sources' share zS of it.
    const t3 = types.indexOf("3ph");
    const peak = (zS: Cx | null) => {
      const ik3 = t3 >= 0 ? ikss_kA[b * T + t3] : (c / Math.hypot(z1.re, z1.im)) * iBase_kA;
      const ik3S = zS ? (c / Math.hypot(zS.re + zf.re, zS.im + zf.im)) * iBase_kA : 0;
      ip_kA[b] = peakCurrent_kA(peakKappa(model, k, cols[1]!, z1, c, un).kappa, ik3, ik3S);
    };
    // IEC 60909 full-size converters: |I| = iMax Ir at arg I_j = -arg Z1[k, u_j], the same for every fault type.
    let e1r = c;
    let e1i = 0;
    for (let j = 0; j < J; j++) {
      const u = model.inverters[j];
      injR[j] = 0;
      injI[j] = 0;
      if (model.nodes[u.node].island !== node.island) continue;
      const zr = cols[1]!.re[u.node];
      const zi = cols[1]!.im[u.node];
      const ang = -Math.atan2(zi, zr);
      injR[j] = u.iMax_pu * u.ir_pu * Math.cos(ang);
      injI[j] = u.iMax_pu * u.ir_pu * Math.sin(ang);
      e1r += zr * injR[j] - zi * injI[j];
      e1i += zr * injI[j] + zi * injR[j];
    }
    const views: [SeqView, SeqView, SeqView] = [
      zeroFloats ? { floating: true, j: { re: 0, im: 0 } } : { floating: false, e: { re: 0, im: 0 }, z: z[0] as Cx },
      { floating: false, e: { re: e1r, im: e1i }, z: z1 },
      { floating: false, e: { re: 0, im: 0 }, z: z[2] as Cx },
    ];
    let undetermined = false;
    if (used === "refined" && J > 0) {
      // The refined converter model: each fault iterates on its island's units only, through the closed-form
      // response of the unit voltages (unitResponse.ts), as the all-bus sweep does.
      let isl = islands.get(node.island);
      if (!isl) {
        isl = islandUnits(model, node.island, colU);
        islands.set(node.island, isl);
      }
      loadFaultColumns(isl.response, colU, isl.unitIdx, k);
      const Jl = isl.unitIdx.length;
      const z0 = z[0];
      types.forEach((type, t) => {
        aff.load(type, z0, z1, z[2] as Cx, zf);
        if (!aff.consistent) undetermined = true;
        isl.vpre.fill(c);
        const report = Jl > 0 ? iterateInjections(isl.units, responseFromAffine(isl.response, aff, c, isl.g), isl.vpre, isl.work) : null;
        if (report && !report.converged) messages.push({ level: "warning", code: "inverter-not-converged", text: `${type} fault at bus ${busIds[b]}: the refined inverter iteration did not converge` });
        const w = isl.work;
        // E1 = c + sum Z1[k, u] x1_u, E2 = sum Z2[k, u] x2_u
        let er1 = c;
        let ei1 = 0;
        let er2 = 0;
        let ei2 = 0;
        const r = isl.response;
        for (let l = 0; l < Jl; l++) {
          er1 += r.z1r[l] * w.x1r[l] - r.z1i[l] * w.x1i[l];
          ei1 += r.z1r[l] * w.x1i[l] + r.z1i[l] * w.x1r[l];
          er2 += r.z2r[l] * w.x2r[l] - r.z2i[l] * w.x2i[l];
          ei2 += r.z2r[l] * w.x2i[l] + r.z2i[l] * w.x2r[l];
        }
        aff.apply(er1, ei1, er2, ei2, seq);
        faultMagnitudesOf(type, seq, mags);
        ikss_kA[b * T + t] = mags.ikss * iBase_kA;
        maxPhase_kA[b * T + t] = mags.maxPhase * iBase_kA;
        faultSeq_pu.set(seq, (b * T + t) * 6);
        for (let l = 0; l < Jl; l++) {
          const o = ((b * T + t) * J + isl.unitIdx[l]) * 6;
          inj_pu[o + 2] = w.x1r[l];
          inj_pu[o + 3] = w.x1i[l];
          inj_pu[o + 4] = w.x2r[l];
          inj_pu[o + 5] = w.x2i[l];
        }
      });
      // ip: the voltage sources' share without any converter (the grid-forming shunts removed by SourceShare).
      let zS: Cx | null = z1;
      if (Jl > 0 && variant === "refined") {
        isl.share ??= new SourceShare(model, node.island, isl.unitIdx, colU, (iecFloating ??= iecFloatingOf(model)));
        zS = isl.share.drivingPoint(z1, isl.response.z1r, isl.response.z1i, { re: 0, im: 0 });
      }
      peak(zS);
      if (undetermined) oneByOne();
      continue;
    }
    types.forEach((type, t) => {
      const fp = faultEquations(type, views, zf);
      if (!fp.consistent) undetermined = true;
      const mags = faultMagnitudes(type, fp.i);
      ikss_kA[b * T + t] = mags.ikss * iBase_kA;
      maxPhase_kA[b * T + t] = mags.maxPhase * iBase_kA;
      for (let s = 0; s < 3; s++) {
        faultSeq_pu[(b * T + t) * 6 + 2 * s] = fp.i[s].re;
        faultSeq_pu[(b * T + t) * 6 + 2 * s + 1] = fp.i[s].im;
      }
      for (let j = 0; j < J; j++) {
        const o = ((b * T + t) * J + j) * 6;
        inj_pu[o + 2] = injR[j];
        inj_pu[o + 3] = injI[j];
      }
    });
    peak(z1);
    if (undetermined) oneByOne();
  }
  return {
    scenario: net.scenario,
    options: { ...opts, inverterModel: used },
    busIds,
    types,
    ikss_kA,
    maxPhase_kA,
    ip_kA,
    xr,
    devices,
    deviceData: {
      // copies of the cached plan's arrays: a result may be transferred to another thread (which detaches them)
      base_A: plan.base_A.slice(),
      transfer,
      transferRows: B,
      transferBusRow,
      transferSlot: plan.transferSlot.slice(),
      negative: null,
      faultSeq_pu,
      injMap: plan.injMap.slice(),
      inj_pu,
      nInj: J,
      shift_deg: plan.shift_deg.slice(),
      busShift_deg,
      overrides,
    },
    messages,
  };
}

/** An island's converters and the workspace their iteration reuses for every bus and fault type. */
interface IslandUnits {
  unitIdx: number[];
  units: ReturnType<typeof compactUnits>;
  response: FaultCoupledResponse;
  work: InjectionWork;
  vpre: Float64Array;
  g: Float64Array;
  share?: SourceShare;
}

function islandUnits(model: Model, island: number, colU: ComplexVec[][]): IslandUnits {
  const unitIdx = model.inverters.map((u, j) => (model.nodes[u.node].island === island ? j : -1)).filter((j) => j >= 0);
  const J = unitIdx.length;
  return { unitIdx, units: compactUnits(model, unitIdx), response: new FaultCoupledResponse(J, unitBlock(model, unitIdx, colU)), work: new InjectionWork(J), vpre: new Float64Array(J), g: new Float64Array(8) };
}

/** What the sweeps of one opened network share for a list of device locations and a converter model. */
interface DevicePlan {
  combos: (Combination | null)[];
  devices: SweepResult["devices"];
  messages: EngineMessage[];
  base_A: Float64Array;
  shift_deg: Float64Array;
  transferSlot: Int32Array;
  injMap: Float64Array;
}

/** Plans per opened network (dropped with it), by converter model, variant and device list. */
const plans = new WeakMap<CompiledNetwork, Map<string, DevicePlan>>();

/**
 * Device combinations on the opened network (an opened end's own current is zero; dead nodes carry nothing) and
 * their responses to the unit injections, c_d^T Z'[:, u] (positive and negative), minus the unit's own current.
 */
function devicePlan(net: CompiledNetwork, locs: { element: string; end: "from" | "to" | "terminal" }[], used: InverterModel, variant: "iec" | "refined", sys: [SequenceSystem, SequenceSystem, SequenceSystem]): DevicePlan {
  const key = `${used}|${variant}|${locs.map((l) => `${l.element}|${l.end}`).join(";")}`;
  let byKey = plans.get(net);
  if (!byKey) {
    byKey = new Map();
    plans.set(net, byKey);
  }
  const hit = byKey.get(key);
  if (hit) return hit;
  const { model, cache } = net.internal as EngineInternal;
  const opts = net.options;
  const D = locs.length;
  const J = model.inverters.length;
  const live = (node: number) => model.islandLive[model.nodes[node].island] === true;
  const messages: EngineMessage[] = [];

  const combos: (Combination | null)[] = locs.map((loc) => deviceCombination(model, used === "refined" ? "refined" : "iec", loc.element, loc.end));
  const devices: SweepResult["devices"] = [];
  const base_A = new Float64Array(D);
  const shift_deg = new Float64Array(D);
  const transferSlot = new Int32Array(D).fill(-1);
  combos.forEach((combo, d) => {
    const loc = locs[d];
    if (!combo) {
      devices.push({ element: loc.element, end: loc.end, bus: "" });
      messages.push({ level: "warning", code: "device-location", text: `Device location ${loc.element} (${loc.end}): element not in service in this scenario; its currents are zero`, element: loc.element });
      return;
    }
    devices.push({ element: loc.element, end: loc.end, bus: combo.bus });
    const nd = model.nodes[combo.node];
    base_A[d] = (opts.baseMVA * 1000) / (SQRT3 * nd.un_kV);
    shift_deg[d] = nd.shift_deg;
    transferSlot[d] = d;
  });

  const colU = J > 0 ? unitColumns(model, cache, variant) : [[], [], []];
  const injMap = new Float64Array(D * J * 6);
  combos.forEach((combo, d) => {
    if (!combo) return;
    for (let j = 0; j < J; j++)
      for (const s of [1, 2] as const) {
        const t: Combination["terms"][number] = combo.terms[s];
        const col = colU[s][j];
        const cu = sys[s].comp[model.inverters[j].node];
        let re = 0;
        let im = 0;
        for (let q = 0; q < t.nodes.length; q++) {
          const node = t.nodes[q];
          if (!live(node) || sys[s].comp[node] !== cu) continue;
          re += t.re[q] * col.re[node] - t.im[q] * col.im[node];
          im += t.re[q] * col.im[node] + t.im[q] * col.re[node];
        }
        if (combo.unit === j) re -= 1;
        injMap[(d * J + j) * 6 + 2 * s] = re;
        injMap[(d * J + j) * 6 + 2 * s + 1] = im;
      }
  });
  const plan: DevicePlan = { combos, devices, messages, base_A, shift_deg, transferSlot, injMap };
  byKey.set(key, plan);
  return plan;
}
