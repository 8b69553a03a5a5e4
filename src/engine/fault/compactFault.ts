// A fault seen only at the fault node and at the inverter units' nodes: enough for the inverter iteration once the
// columns of Z at the unit nodes are known (reciprocity gives Z[k, u] = Z[u, k]). Requires the fault node's positive
// and negative-sequence parts not to float; its zero-sequence part may (then no zero-sequence current flows).
import type { Cx, InverterUnit, Model } from "../network/model.ts";
import type { FaultType } from "../types.ts";
import { faultEquations, type SeqView } from "./faultEquations.ts";
import type { ComplexVec, LinearFault } from "./solveLinearFault.ts";
import { sequenceSystem, zColumn, type Variant } from "../network/sequenceSystem.ts";
import type { EngineCache } from "../network/engineCache.ts";
import { FaultCoupledResponse, type UnitBlock } from "../inverter/unitResponse.ts";
import { FaultAffine } from "./faultAffine.ts";

export type { UnitBlock };

const EMPTY: ComplexVec = { re: new Float64Array(0), im: new Float64Array(0) };

/** Columns of Z' (positive [1], negative [2]) at every inverter unit's node, cached per variant. */
export function unitColumns(model: Model, cache: EngineCache, variant: Variant): ComplexVec[][] {
  const key = `units:${variant}`;
  const hit = cache.unitColumns.get(key);
  if (hit) return hit;
  const cols: ComplexVec[][] = [[], [], []];
  for (const s of [1, 2] as const) {
    const sys = sequenceSystem(model, cache, s, variant);
    for (const u of model.inverters) cols[s].push(zColumn(sys, u.node));
  }
  cache.unitColumns.set(key, cols);
  return cols;
}

export interface CompactFaultInput {
  model: Model;
  /** Global indices (into model.inverters) of the units taking part. */
  unitIdx: number[];
  colU: ComplexVec[][];
  k: number;
  type: FaultType;
  zf: Cx;
  c: number;
  zeroView: SeqView;
  z1kk: Cx;
  z2kk: Cx;
  /** Optional Z among the units (see unitBlock), the same for every faulted bus: spares the scattered reads. */
  block?: UnitBlock;
}


/** Reads the unit-to-unit block of Z out of the unit columns once per island. */
export function unitBlock(model: Model, unitIdx: number[], colU: ComplexVec[][]): UnitBlock {
  const J = unitIdx.length;
  const b: UnitBlock = { z1r: new Float64Array(J * J), z1i: new Float64Array(J * J), z2r: new Float64Array(J * J), z2i: new Float64Array(J * J) };
  for (let q = 0; q < J; q++) {
    const c1 = colU[1][unitIdx[q]];
    const c2 = colU[2][unitIdx[q]];
    for (let j = 0; j < J; j++) {
      const node = model.inverters[unitIdx[j]].node;
      b.z1r[q * J + j] = c1.re[node];
      b.z1i[q * J + j] = c1.im[node];
      b.z2r[q * J + j] = c2.re[node];
      b.z2i[q * J + j] = c2.im[node];
    }
  }
  return b;
}

/** Units renumbered 0..J-1 (their `node` is the compact index) for the iteration. */
export function compactUnits(model: Model, unitIdx: number[]): InverterUnit[] {
  return unitIdx.map((g, j) => ({ ...model.inverters[g], node: j }));
}

/**
 * Solution at the compact nodes for injections inj1/inj2 indexed by compact unit. `currentsOnly` skips the unit
 * voltages (the IEC treatment needs the fault currents alone).
 */
export function solveCompactFault(p: CompactFaultInput, inj1: ComplexVec, inj2: ComplexVec, currentsOnly = false): LinearFault {
  const { colU, k, unitIdx, c } = p;
  const Jl = unitIdx.length;
  let e1r = c;
  let e1i = 0;
  let e2r = 0;
  let e2i = 0;
  for (let l = 0; l < Jl; l++) {
    const a = colU[1][unitIdx[l]];
    const z2 = colU[2][unitIdx[l]];
    e1r += a.re[k] * inj1.re[l] - a.im[k] * inj1.im[l];
    e1i += a.re[k] * inj1.im[l] + a.im[k] * inj1.re[l];
    e2r += z2.re[k] * inj2.re[l] - z2.im[k] * inj2.im[l];
    e2i += z2.re[k] * inj2.im[l] + z2.im[k] * inj2.re[l];
  }
  const fp = faultEquations(p.type, [p.zeroView, { floating: false, e: { re: e1r, im: e1i }, z: p.z1kk }, { floating: false, e: { re: e2r, im: e2i }, z: p.z2kk }], p.zf);
  if (currentsOnly) return { v: [EMPTY, EMPTY, EMPTY], i: fp.i, consistent: fp.consistent, zkk: [null, p.z1kk, p.z2kk] };
  const v1 = { re: new Float64Array(Jl), im: new Float64Array(Jl) };
  const v2 = { re: new Float64Array(Jl), im: new Float64Array(Jl) };
  const [, i1, i2] = fp.i;
  for (let u = 0; u < Jl; u++) {
    const nu = p.model.inverters[unitIdx[u]].node;
    let ar = c;
    let ai = 0;
    let br = 0;
    let bi = 0;
    for (let l = 0; l < Jl; l++) {
      const a = colU[1][unitIdx[l]];
      const z2 = colU[2][unitIdx[l]];
      ar += a.re[nu] * inj1.re[l] - a.im[nu] * inj1.im[l];
      ai += a.re[nu] * inj1.im[l] + a.im[nu] * inj1.re[l];
      br += z2.re[nu] * inj2.re[l] - z2.im[nu] * inj2.im[l];
      bi += z2.re[nu] * inj2.im[l] + z2.im[nu] * inj2.re[l];
    }
    const g = unitIdx[u];
    const zu1r = colU[1][g].re[k];
    const zu1i = colU[1][g].im[k];
    const zu2r = colU[2][g].re[k];
    const zu2i = colU[2][g].im[k];
    v1.re[u] = ar - (zu1r * i1.re - zu1i * i1.im);
    v1.im[u] = ai - (zu1r * i1.im + zu1i * i1.re);
    v2.re[u] = br - (zu2r * i2.re - zu2i * i2.im);
    v2.im[u] = bi - (zu2r * i2.im + zu2i * i2.re);
  }
  const z0 = { re: new Float64Array(Jl), im: new Float64Array(Jl) };
  return { v: [z0, v1, v2], i: fp.i, consistent: fp.consistent, zkk: [null, p.z1kk, p.z2kk] };
}

/** Loads Z[u_j, k] for the faulted node k into the response: the same for every fault type at that bus. */
export function loadFaultColumns(r: FaultCoupledResponse, colU: ComplexVec[][], unitIdx: number[], k: number): FaultCoupledResponse {
  for (let j = 0; j < r.J; j++) {
    const u = unitIdx[j];
    r.z1r[j] = colU[1][u].re[k];
    r.z1i[j] = colU[1][u].im[k];
    r.z2r[j] = colU[2][u].re[k];
    r.z2i[j] = colU[2][u].im[k];
  }
  return r;
}

/**
 * Loads the fault type's part of the fault-coupled response (see unitResponse.ts), its columns being loaded
 * (loadFaultColumns): the fault currents' linear dependence on the open-circuit voltages E1, E2 at the fault (see
 * faultAffine.ts). `g` is scratch space (8 numbers).
 */
export function loadFaultResponse(r: FaultCoupledResponse, p: CompactFaultInput, g: Float64Array = new Float64Array(8), aff: FaultAffine = new FaultAffine()): FaultCoupledResponse {
  aff.load(p.type, p.zeroView.floating ? null : p.zeroView.z, p.z1kk, p.z2kk, p.zf);
  return responseFromAffine(r, aff, p.c, g);
}

/** The response's fault part from a loaded fault map: currents with no injection (E1 = c, E2 = 0) and G = dI/dE. */
export function responseFromAffine(r: FaultCoupledResponse, aff: FaultAffine, c: number, g: Float64Array): FaultCoupledResponse {
  const a = aff.a;
  // a[(s * 2 + q) * 2 + re/im] = dI_s / dE_(q+1); g: column E1 (I1, I2), then column E2 (I1, I2)
  g[0] = a[4];
  g[1] = a[5];
  g[2] = a[8];
  g[3] = a[9];
  g[4] = a[6];
  g[5] = a[7];
  g[6] = a[10];
  g[7] = a[11];
  r.setFault(c, a[4] * c, a[5] * c, a[8] * c, a[9] * c, g);
  return r;
}

/** A fresh fault-coupled response for the fault in p (one-off solves; a sweep reuses one with loadFaultResponse). */
export function compactResponse(p: CompactFaultInput): FaultCoupledResponse {
  const block = p.block ?? unitBlock(p.model, p.unitIdx, p.colU);
  return loadFaultResponse(loadFaultColumns(new FaultCoupledResponse(p.unitIdx.length, block), p.colU, p.unitIdx, p.k), p);
}
