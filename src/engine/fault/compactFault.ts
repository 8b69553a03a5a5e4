// A fault seen only at the fault node and at the inverter units' nodes: enough for the inverter iteration once the
// columns of Z at the unit nodes are known (reciprocity gives Z[k, u] = Z[u, k]). Requires the fault node's positive
// and negative-sequence parts not to float; its zero-sequence part may (then no zero-sequence current flows).
import type { Cx, InverterUnit, Model } from "../network/model.ts";
import type { FaultType } from "../types.ts";
import { faultEquations, type SeqView } from "./faultEquations.ts";
import type { ComplexVec, LinearFault } from "./solveLinearFault.ts";
import { sequenceSystem, zColumn, type Variant } from "../network/sequenceSystem.ts";
import type { EngineCache } from "../network/engineCache.ts";

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

/** The affine response V = a + M x at the unit nodes, flattened as refinedIteration takes it. */
export interface AffineMap {
  a1: { re: number; im: number }[];
  a2: { re: number; im: number }[];
  /** [q * J + j]: response of unit j's V1 (M1) / V2 (M2) to injection q (q < J positive of unit q, else negative). */
  M1r: Float64Array;
  M1i: Float64Array;
  M2r: Float64Array;
  M2i: Float64Array;
}

/**
 * Builds the map analytically: the fault currents are affine in the open-circuit voltages E1, E2 at the fault
 * (three evaluations of the fault equations give the coefficients), and V_U = c + Z_UU x - Z_Uk I.
 */
export function compactAffineMap(p: CompactFaultInput): AffineMap {
  const J = p.unitIdx.length;
  const { colU, k, c } = p;
  const f = (e1: Cx, e2: Cx) => faultEquations(p.type, [p.zeroView, { floating: false, e: e1, z: p.z1kk }, { floating: false, e: e2, z: p.z2kk }], p.zf).i;
  const i0 = f({ re: c, im: 0 }, { re: 0, im: 0 });
  const iE1 = f({ re: c + 1, im: 0 }, { re: 0, im: 0 });
  const iE2 = f({ re: c, im: 0 }, { re: 1, im: 0 });
  const d = (a: Cx, b: Cx): Cx => ({ re: a.re - b.re, im: a.im - b.im });
  const g11 = d(iE1[1], i0[1]);
  const g21 = d(iE1[2], i0[2]);
  const g12 = d(iE2[1], i0[1]);
  const g22 = d(iE2[2], i0[2]);
  const mul = (a: Cx, b: Cx): Cx => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
  const z = (s: 1 | 2, g: number, node: number): Cx => ({ re: colU[s][g].re[node], im: colU[s][g].im[node] });
  const nodes = p.unitIdx.map((g) => p.model.inverters[g].node);
  const zjk1 = p.unitIdx.map((g) => z(1, g, k));
  const zjk2 = p.unitIdx.map((g) => z(2, g, k));
  const a1 = zjk1.map((zz) => {
    const t = mul(zz, i0[1]);
    return { re: c - t.re, im: -t.im };
  });
  const a2 = zjk2.map((zz) => {
    const t = mul(zz, i0[2]);
    return { re: -t.re, im: -t.im };
  });
  const M1r = new Float64Array(2 * J * J);
  const M1i = new Float64Array(2 * J * J);
  const M2r = new Float64Array(2 * J * J);
  const M2i = new Float64Array(2 * J * J);
  for (let q = 0; q < 2 * J; q++) {
    const pos = q < J;
    const gq = p.unitIdx[pos ? q : q - J];
    const zkq = pos ? zjk1[pos ? q : q - J] : zjk2[q - J]; // Z[k, q] = Z[q, k]
    const dI1 = mul(pos ? g11 : g12, zkq);
    const dI2 = mul(pos ? g21 : g22, zkq);
    for (let j = 0; j < J; j++) {
      const v1 = mul(zjk1[j], dI1);
      const v2 = mul(zjk2[j], dI2);
      let r1 = -v1.re;
      let m1 = -v1.im;
      let r2 = -v2.re;
      let m2 = -v2.im;
      if (pos) {
        r1 += colU[1][gq].re[nodes[j]];
        m1 += colU[1][gq].im[nodes[j]];
      } else {
        r2 += colU[2][gq].re[nodes[j]];
        m2 += colU[2][gq].im[nodes[j]];
      }
      M1r[q * J + j] = r1;
      M1i[q * J + j] = m1;
      M2r[q * J + j] = r2;
      M2i[q * J + j] = m2;
    }
  }
  return { a1, a2, M1r, M1i, M2r, M2i };
}
