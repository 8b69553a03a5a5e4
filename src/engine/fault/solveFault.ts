// One fault at a bus or along a line: IEC 60909 (or classic) sequence-network solution with both inverter
// treatments where converters feed, then every branch end's and shunt's currents and every bus's voltages.
import type { CompiledNetwork, EngineMessage, EndCurrent, FaultLocation, FaultOptions, FaultResult, FaultType, InverterOutcome, BusVoltage } from "../types.ts";
import type { Cx, Model } from "../network/model.ts";
import type { EngineCache } from "../network/engineCache.ts";
import { createEngineCache } from "../network/engineCache.ts";
import { sequenceSystem, zColumn, type SequenceSystem, type Variant } from "../network/sequenceSystem.ts";
import { splitLine } from "../network/splitLine.ts";
import { solveLinearFault, type ComplexVec, type LinearFault } from "./solveLinearFault.ts";
import { iecInjections } from "../inverter/iecInjections.ts";
import { refinedIteration, type RefinedOutcome } from "../inverter/refinedIteration.ts";
import { compactResponse, compactUnits, solveCompactFault, unitColumns, type CompactFaultInput } from "./compactFault.ts";
import { allShuntCurrents, branchEndResults, type RawEnd } from "./endCurrents.ts";
import { faultMagnitudes } from "./faultCurrentMagnitude.ts";
import { seqAndPhaseParts, seqAndPhasePhasors, seqToPhase, toPhasor } from "./phasors.ts";
import { peakCurrent_kA, peakKappa } from "./peakCurrent.ts";
import { faultEquations, type SeqView } from "./faultEquations.ts";
import { voltageFactor, breakingFactorMu, motorFactorQ, thermalFactorM } from "../iec60909/factors.ts";

export interface EngineInternal {
  model: Model;
  cache: EngineCache;
}

const SQRT3 = Math.sqrt(3);

/** Resolves a fault location to a model (possibly with a temporary node) and its node. Throws on unknown ids. */
export function locateFault(network: CompiledNetwork, location: FaultLocation): { model: Model; cache: EngineCache; k: number; label: string } | { dead: string } {
  const { model, cache } = network.internal as EngineInternal;
  // A fault between a power station unit's generator and its transformer sees the unit's own corrections
  // (IEC 60909-0:2016, 6.7: KG and K_T,S there, K_S elsewhere): that node has a model variant of its own.
  const at = (k: number, label: string) => {
    const unit = model.inUnit?.get(k);
    return unit ? { model: unit.model, cache: unit.cache, k, label } : { model, cache, k, label };
  };
  if (location.kind === "bus") {
    const k = model.busNode.get(location.bus);
    if (k === undefined) return { dead: `Bus ${location.bus}: not in service in this scenario (or unknown)` };
    return at(k, `bus ${location.bus}`);
  }
  const b = model.branches.find((x) => x.element === location.line && x.kind === "line");
  if (!b) return { dead: `Line ${location.line}: not in service in this scenario (or unknown)` };
  if (!(location.pct >= 0 && location.pct <= 100)) throw new Error(`${b.label}: fault position pct must be within 0-100 (got ${location.pct})`);
  if (location.pct === 0) return at(b.from, `${b.label} at 0 %`);
  if (location.pct === 100) return at(b.to, `${b.label} at 100 %`);
  // A line inside a unit (an auxiliary feeder) is split in that unit's variant.
  const base = model.inUnit?.get(b.from)?.model ?? model.inUnit?.get(b.to)?.model ?? model;
  const s = splitLine(base, location.line, location.pct);
  if (!s) throw new Error(`${b.label}: cannot place a fault point`);
  return { model: s.model, cache: createEngineCache(), k: s.node, label: `${b.label} at ${location.pct} %` };
}

function systems(model: Model, cache: EngineCache, variant: Variant): [SequenceSystem, SequenceSystem, SequenceSystem] {
  return [sequenceSystem(model, cache, 0, variant), sequenceSystem(model, cache, 1, variant), sequenceSystem(model, cache, 2, variant)];
}

function emptyResult(network: CompiledNetwork, location: FaultLocation, type: FaultType, un_kV: number, c: number, messages: EngineMessage[]): FaultResult {
  const z = { mag: 0, ang_deg: 0 };
  return {
    location,
    faultType: type,
    options: network.options,
    un_kV,
    c,
    ikss_kA: 0,
    faultPhase_kA: [z, z, z],
    faultSeq_kA: [z, z, z],
    earth_kA: 0,
    maxPhase_kA: 0,
    ip_kA: 0,
    ikssSources_kA: 0,
    kappa: 1,
    peakMethod: "none",
    ib_kA: 0,
    mu: 1,
    ith_kA: 0,
    m: 0,
    n: 1,
    zk_ohm: { re: 0, im: 0 },
    xr: 0,
    inverter: null,
    branchEnds: [],
    shunts: [],
    buses: [],
    messages,
  };
}

/**
 * I"k (pu) of the same fault driven by the voltage sources alone (the equivalent source c at the fault in the
 * network without converters): the share that carries kappa in ip. A floating sequence has no source.
 */
function sourcesOnlyIkss(type: FaultType, zkk: LinearFault["zkk"], c: number, zf: Cx): number {
  const views = zkk.map((z, s): SeqView => (z ? { floating: false, e: { re: s === 1 ? c : 0, im: 0 }, z } : { floating: true, j: { re: 0, im: 0 } })) as [SeqView, SeqView, SeqView];
  if (!zkk[1]) return 0;
  const fp = faultEquations(type, views, zf);
  return fp.consistent ? faultMagnitudes(type, fp.i).ikss : 0;
}

/** "element|end" and "element" of every protective device location on a branch. */
function deviceEndSet(model: Model): Set<string> {
  const set = new Set<string>();
  for (const d of model.devices) {
    if (d.end === "terminal") continue;
    set.add(d.element);
    set.add(`${d.element}|${d.end}`);
  }
  return set;
}

/**
 * `at`: the fault already placed (a model, its cache and the faulted node), for callers that build the faulted
 * network themselves (re-solves with opened ends place a line point on the base factorization); default locateFault.
 */
export function solveFault(network: CompiledNetwork, location: FaultLocation, type: FaultType, options: FaultOptions = {}, at?: { model: Model; cache: EngineCache; k: number; label: string }): FaultResult {
  const opts = network.options;
  const where = at ?? locateFault(network, location);
  if ("dead" in where) return emptyResult(network, location, type, 0, 0, [{ level: "warning", code: "not-in-service", text: where.dead }]);
  const { model, cache, k, label } = where;
  const n = model.nodes.length;
  const un = model.nodes[k].un_kV;
  const iec = opts.method === "iec60909";
  const c = iec ? voltageFactor(un, opts.limit, opts.lvTolerance_pct) : opts.prefault_pu;
  const zBase = (un * un) / opts.baseMVA;
  const iBase_kA = opts.baseMVA / (SQRT3 * un);
  const zf: Cx = { re: (options.faultR_ohm ?? opts.faultR_ohm) / zBase, im: (options.faultX_ohm ?? opts.faultX_ohm) / zBase };
  const island = model.nodes[k].island;
  const messages: EngineMessage[] = [];
  if (!model.islandLive[island]) {
    messages.push({ level: "warning", code: "dead-island", text: `Fault at ${label}: no source feeds this part of the network in this scenario; fault current is zero` });
    return emptyResult(network, location, type, un, c, messages);
  }
  const live = new Uint8Array(n);
  const vpre = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    if (model.islandLive[model.nodes[j].island]) {
      live[j] = 1;
      vpre[j] = c;
    }
  }
  const units = model.inverters.filter((u) => model.nodes[u.node].island === island);
  const hasInv = units.length > 0;
  const hasGfm = model.shunts.some((s) => s.refinedOnly);
  const cols = (sys: [SequenceSystem, SequenceSystem, SequenceSystem]) => sys.map((s) => zColumn(s, k)) as [ComplexVec, ComplexVec, ComplexVec];

  const sysI = systems(model, cache, "iec");
  const zkI = cols(sysI);
  const iecInj = hasInv ? iecInjections(units, sysI[1], zkI[1], k) : null;
  let iecFault = solveLinearFault({ systems: sysI, k, type, zf, vpre, live, zk: zkI, inj: [null, iecInj ? iecInj.inj : null, null] });
  if (!iecFault.consistent && iecInj) {
    // Current sources with no return path for this fault: undetermined, reported as no fault current.
    iecFault = solveLinearFault({ systems: sysI, k, type, zf, vpre, live, zk: zkI, inj: [null, null, null] });
    iecFault.consistent = false;
    for (const x of iecInj.perUnit) x.re = x.im = 0;
  }

  let refined: RefinedOutcome | null = null;
  let sysR = sysI;
  let zkR = zkI;
  if (hasInv) {
    sysR = hasGfm ? systems(model, cache, "refined") : sysI;
    zkR = hasGfm ? cols(sysR) : zkI;
    const full = (a: ComplexVec, b: ComplexVec) => solveLinearFault({ systems: sysR, k, type, zf, vpre, live, zk: zkR, inj: [null, a, b] });
    if (!sysR[1].floating[sysR[1].comp[k]] && !sysR[2].floating[sysR[2].comp[k]]) {
      // Iterate on the unit nodes only (cached columns of Z), then one full solution with the final injections.
      const unitIdx = model.inverters.map((u, g) => (model.nodes[u.node].island === island ? g : -1)).filter((g) => g >= 0);
      const colU = unitColumns(model, cache, hasGfm ? "refined" : "iec");
      const zeroView: SeqView = sysR[0].floating[sysR[0].comp[k]] ? { floating: true, j: { re: 0, im: 0 } } : { floating: false, e: { re: 0, im: 0 }, z: { re: zkR[0].re[k], im: zkR[0].im[k] } };
      const cin: CompactFaultInput = { model, unitIdx, colU, k, type, zf, c, zeroView, z1kk: { re: zkR[1].re[k], im: zkR[1].im[k] }, z2kk: { re: zkR[2].re[k], im: zkR[2].im[k] } };
      const r = refinedIteration(compactUnits(model, unitIdx), unitIdx.length, new Float64Array(unitIdx.length).fill(c), (a, b) => solveCompactFault(cin, a, b), compactResponse(cin));
      const inj1 = { re: new Float64Array(n), im: new Float64Array(n) };
      const inj2 = { re: new Float64Array(n), im: new Float64Array(n) };
      unitIdx.forEach((g, l) => {
        const node = model.inverters[g].node;
        inj1.re[node] += r.inj[0].re[l];
        inj1.im[node] += r.inj[0].im[l];
        inj2.re[node] += r.inj[1].re[l];
        inj2.im[node] += r.inj[1].im[l];
      });
      refined = { ...r, fault: full(inj1, inj2), inj: [inj1, inj2] };
    } else refined = refinedIteration(units, n, vpre, full);
    if (!refined.fault.consistent) {
      const zero = { re: new Float64Array(n), im: new Float64Array(n) };
      refined = { ...refined, fault: { ...full(zero, zero), consistent: false }, inj: [zero, zero], out: refined.out.map(() => ({ i1: { re: 0, im: 0 }, i2: { re: 0, im: 0 } })) };
    }
  }
  const used = hasInv ? (options.inverterModel ?? opts.inverterModel) : "iec";
  const fault: LinearFault = used === "refined" && refined ? refined.fault : iecFault;
  const variant: Variant = used === "refined" && refined ? "refined" : "iec";

  const unitInj = new Map<string, [Cx, Cx]>();
  units.forEach((u, j) => {
    if (variant === "refined" && refined) unitInj.set(u.element, [refined.out[j].i1, refined.out[j].i2]);
    else if (iecInj) unitInj.set(u.element, [iecInj.perUnit[j], { re: 0, im: 0 }]);
  });
  if (variant === "refined" && refined) {
    // Grid-forming units: the shunt carries the unlimited part; the injection is the limiting correction.
    units.forEach((u, j) => {
      if (u.control !== "grid-forming") return;
      const zf2 = u.zForming.re ** 2 + u.zForming.im ** 2;
      const divZ = (a: Cx): Cx => ({ re: (a.re * u.zForming.re + a.im * u.zForming.im) / zf2, im: (a.im * u.zForming.re - a.re * u.zForming.im) / zf2 });
      const i1u = divZ({ re: vpre[u.node] - fault.v[1].re[u.node], im: -fault.v[1].im[u.node] });
      const i2u = divZ({ re: -fault.v[2].re[u.node], im: -fault.v[2].im[u.node] });
      unitInj.set(u.element, [
        { re: refined.out[j].i1.re - i1u.re, im: refined.out[j].i1.im - i1u.im },
        { re: refined.out[j].i2.re - i2u.re, im: refined.out[j].i2.im - i2u.im },
      ]);
    });
  }
  if (!fault.consistent) {
    messages.push({
      level: "warning",
      code: "no-voltage-source",
      text: `${type} fault at ${label}: the island has only current-source infeed and no return path in this fault's sequence networks; the fault current is taken as zero`,
    });
  }
  const mags = faultMagnitudes(type, fault.i);
  const ikss_kA = mags.ikss * iBase_kA;
  const shiftK = model.nodes[k].shift_deg;
  const toEnd = (e: RawEnd): EndCurrent => {
    const node = model.nodes[e.node];
    const p = seqAndPhasePhasors(e.i, node.shift_deg - shiftK, (opts.baseMVA * 1000) / (SQRT3 * node.un_kV));
    return { element: e.element, end: e.end, bus: e.bus, seq_A: p.seq, phase_A: p.phase };
  };
  const raw = { shunts: allShuntCurrents(model, variant, fault.v, vpre, unitInj) };
  // Per node: shift relative to the faulted bus and base current, for the branch ends built in one pass.
  const endShift_deg = new Float64Array(n);
  const endBase_A = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const node = model.nodes[j];
    endShift_deg[j] = node.shift_deg - shiftK;
    endBase_A[j] = (opts.baseMVA * 1000) / (SQRT3 * node.un_kV);
  }
  // detail "devices": only the protective devices' branch ends and the buses they (and the fault) sit at.
  const only = options.detail === "devices" ? deviceEndSet(model) : undefined;
  const branchEnds = branchEndResults(model, fault.v, vpre, endShift_deg, endBase_A, only);
  let busWanted: Uint8Array | null = null;
  if (only) {
    busWanted = new Uint8Array(n);
    busWanted[k] = 1;
    for (const e of branchEnds) busWanted[model.busNode.get(e.bus) ?? k] = 1;
    for (const d of model.devices) {
      if (d.end !== "terminal") continue;
      const sh = model.shunts.find((x) => x.element === d.element) ?? model.inverters.find((x) => x.element === d.element);
      if (sh) busWanted[sh.node] = 1;
    }
  }
  const buses: BusVoltage[] = [];
  const [v0, v1, v2] = fault.v;
  for (let j = 0; j < n; j++) {
    const node = model.nodes[j];
    if (node.buses.length === 0 || (busWanted && !busWanted[j])) continue;
    const pu = seqAndPhaseParts(v0.re[j], v0.im[j], v1.re[j], v1.im[j], v2.re[j], v2.im[j], node.shift_deg - shiftK, 1);
    const kv = node.un_kV / SQRT3;
    for (const bus of node.buses) {
      buses.push({
        bus,
        un_kV: node.un_kV,
        phase_kV: pu.phase.map((x) => ({ mag: x.mag * kv, ang_deg: x.ang_deg })) as BusVoltage["phase_kV"],
        phase_pu: pu.phase,
        seq_pu: pu.seq,
        energized: live[j] === 1,
      });
    }
  }

  // Peak, breaking and thermal currents (IEC 60909-0:2016, clauses 8, 9, 12).
  const pk = variant === "refined" ? peakKappa(model, k, zkR[1], fault.zkk[1], c, un) : peakKappa(model, k, zkI[1], iecFault.zkk[1], c, un);
  // The voltage sources' share (every converter removed, grid-forming units too): the IEC variant's network.
  const ikssSources_kA = hasInv ? sourcesOnlyIkss(type, iecFault.zkk, c, zf) * iBase_kA : ikss_kA;
  const ip_kA = peakCurrent_kA(pk.kappa, ikss_kA, ikssSources_kA);
  let ib_pu = mags.ikss;
  if (type === "3ph" && mags.ikss > 0) {
    for (const e of raw.shunts) {
      const st = model.shunts.find((s) => s.element === e.element && !s.refinedOnly);
      if (!st || (st.kind !== "generator" && st.kind !== "motor") || model.nodes[st.node].island !== island) continue;
      const iG = Math.hypot(e.i[1].re, e.i[1].im);
      const mu = breakingFactorMu(iG / st.ir_pu, opts.breakingTime_s);
      // Asynchronous motors decay faster: mu q (IEC 60909-0:2016, 9.1.1); q = 1 when the pole pairs are not known.
      const q = st.kind === "motor" && st.m_MW !== undefined ? motorFactorQ(st.m_MW, opts.breakingTime_s) : 1;
      const du = Math.hypot(st.z1.re, st.z1.im) * iG;
      ib_pu -= (du / c) * (1 - mu * q) * iG;
    }
  }
  const ib_kA = Math.max(0, ib_pu) * iBase_kA;
  const m = thermalFactorM(pk.kappa, opts.thermalTime_s, opts.frequency_Hz);
  const zkk = fault.zkk[1];
  const zk_ohm = zkk ? { re: zkk.re * zBase, im: zkk.im * zBase } : { re: 0, im: 0 };
  const xr = zkk ? (zkk.re > 0 ? zkk.im / zkk.re : 1e9) : 0;

  let inverter: FaultResult["inverter"] = null;
  if (hasInv && refined && iecInj) {
    const iecUnits = units.map((u, j) => ({
      element: u.element,
      control: u.control,
      i1_pu: Math.hypot(iecInj.perUnit[j].re, iecInj.perUnit[j].im) / u.ir_pu,
      i2_pu: 0,
      v1_pu: Math.hypot(iecFault.v[1].re[u.node], iecFault.v[1].im[u.node]) * u.vScale,
      limited: true,
    }));
    const iecOut: InverterOutcome = { model: "iec", ikss_kA: faultMagnitudes(type, iecFault.i).ikss * iBase_kA, units: iecUnits };
    const refOut: InverterOutcome = {
      model: "refined",
      ikss_kA: faultMagnitudes(type, refined.fault.i).ikss * iBase_kA,
      iterations: refined.iterations,
      residual_pu: refined.residual_pu,
      converged: refined.converged,
      units: refined.units,
    };
    inverter = { iec: iecOut, refined: refOut, used };
    if (!refined.converged) {
      messages.push({ level: "warning", code: "inverter-not-converged", text: `Fault at ${label}: the refined inverter iteration did not converge (${refined.iterations} iterations, residual ${refined.residual_pu.toExponential(2)} pu)` });
    }
    let largest = 0;
    let largestLabel = "";
    for (const u of units) {
      const lim = u.iMax_pu * u.ir_pu;
      if (lim > largest) {
        largest = lim;
        largestLabel = u.label;
      }
    }
    if (mags.maxPhase < 1.5 * largest) {
      messages.push({
        level: "warning",
        code: "low-fault-current",
        text: `${type} fault at ${label}: fault current ${(mags.maxPhase * iBase_kA).toFixed(3)} kA is below 1.5 x the current limit of ${largestLabel}; overcurrent protection may not see it`,
      });
    }
  }
  if (zkk && mags.ikss > 0 && (xr > 40 || xr < 0.1)) {
    messages.push({ level: "info", code: "xr-range", text: `Fault at ${label}: X/R ${xr.toFixed(2)} is outside the usual range 0.1-40; check the source and branch data` });
  }
  const ph = seqToPhase(fault.i);
  return {
    location,
    faultType: type,
    options: { ...opts, inverterModel: used, faultR_ohm: zf.re * zBase, faultX_ohm: zf.im * zBase },
    un_kV: un,
    c,
    ikss_kA,
    faultPhase_kA: ph.map((x) => toPhasor(x, iBase_kA)) as FaultResult["faultPhase_kA"],
    faultSeq_kA: fault.i.map((x) => toPhasor(x, iBase_kA)) as FaultResult["faultSeq_kA"],
    earth_kA: mags.earth * iBase_kA,
    maxPhase_kA: mags.maxPhase * iBase_kA,
    ip_kA,
    ikssSources_kA,
    kappa: pk.kappa,
    peakMethod: pk.method,
    ib_kA,
    mu: mags.ikss > 0 ? ib_kA / ikss_kA : 1,
    ith_kA: ikss_kA * Math.sqrt(m + 1),
    m,
    n: 1,
    zk_ohm,
    xr,
    inverter,
    branchEnds,
    shunts: raw.shunts.map(toEnd),
    buses,
    messages,
  };
}
