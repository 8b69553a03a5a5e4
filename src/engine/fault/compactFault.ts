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
  /** Optional Z among the units (see unitBlock), the same for every faulted bus: spares the scattered reads. */
  block?: UnitBlock;
}

/** Z[u_q, u_j] among the units taking part, per [q * J + j], positive (z1) and negative (z2) sequence. */
export interface UnitBlock {
  z1r: Float64Array;
  z1i: Float64Array;
  z2r: Float64Array;
  z2i: Float64Array;
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

/** The affine response V = a + M x at the unit nodes, flattened as refinedIteration takes it. */
export interface AffineMap {
  /** a: unit voltages with no converter injection, positive (a1) and negative (a2) sequence. */
  a1r: Float64Array;
  a1i: Float64Array;
  a2r: Float64Array;
  a2i: Float64Array;
  /** [q * J + j]: response of unit j's V1 (M1) / V2 (M2) to injection q (q < J positive of unit q, else negative). */
  M1r: Float64Array;
  M1i: Float64Array;
  M2r: Float64Array;
  M2i: Float64Array;
}

/**
 * Builds the map analytically: the fault currents are affine in the open-circuit voltages E1, E2 at the fault
 * (three evaluations of the fault equations give the coefficients), and V_U = c + Z_UU x - Z_Uk I.
 * Written with scalars (no temporaries): the sweep builds one map per bus and fault type.
 */
export function compactAffineMap(p: CompactFaultInput): AffineMap {
  const J = p.unitIdx.length;
  const { colU, k, c } = p;
  const f = (e1: Cx, e2: Cx) => faultEquations(p.type, [p.zeroView, { floating: false, e: e1, z: p.z1kk }, { floating: false, e: e2, z: p.z2kk }], p.zf).i;
  const i0 = f({ re: c, im: 0 }, { re: 0, im: 0 });
  const iE1 = f({ re: c + 1, im: 0 }, { re: 0, im: 0 });
  const iE2 = f({ re: c, im: 0 }, { re: 1, im: 0 });
  const g11r = iE1[1].re - i0[1].re;
  const g11i = iE1[1].im - i0[1].im;
  const g21r = iE1[2].re - i0[2].re;
  const g21i = iE1[2].im - i0[2].im;
  const g12r = iE2[1].re - i0[1].re;
  const g12i = iE2[1].im - i0[1].im;
  const g22r = iE2[2].re - i0[2].re;
  const g22i = iE2[2].im - i0[2].im;
  const nodes = new Int32Array(J);
  const z1r = new Float64Array(J);
  const z1i = new Float64Array(J);
  const z2r = new Float64Array(J);
  const z2i = new Float64Array(J);
  const a1r = new Float64Array(J);
  const a1i = new Float64Array(J);
  const a2r = new Float64Array(J);
  const a2i = new Float64Array(J);
  const i01r = i0[1].re;
  const i01i = i0[1].im;
  const i02r = i0[2].re;
  const i02i = i0[2].im;
  for (let j = 0; j < J; j++) {
    const g = p.unitIdx[j];
    nodes[j] = p.model.inverters[g].node;
    z1r[j] = colU[1][g].re[k];
    z1i[j] = colU[1][g].im[k];
    z2r[j] = colU[2][g].re[k];
    z2i[j] = colU[2][g].im[k];
    // a1 = c - Z[j,k] I0_1, a2 = -Z[j,k] I0_2
    a1r[j] = c - (z1r[j] * i01r - z1i[j] * i01i);
    a1i[j] = -(z1r[j] * i01i + z1i[j] * i01r);
    a2r[j] = -(z2r[j] * i02r - z2i[j] * i02i);
    a2i[j] = -(z2r[j] * i02i + z2i[j] * i02r);
  }
  const M1r = new Float64Array(2 * J * J);
  const M1i = new Float64Array(2 * J * J);
  const M2r = new Float64Array(2 * J * J);
  const M2i = new Float64Array(2 * J * J);
  for (let q = 0; q < 2 * J; q++) {
    const pos = q < J;
    const l = pos ? q : q - J;
    const gq = p.unitIdx[l];
    // Z[k, q] = Z[q, k]
    const zr = pos ? z1r[l] : z2r[l];
    const zi = pos ? z1i[l] : z2i[l];
    const h1r = pos ? g11r : g12r;
    const h1i = pos ? g11i : g12i;
    const h2r = pos ? g21r : g22r;
    const h2i = pos ? g21i : g22i;
    const d1r = h1r * zr - h1i * zi;
    const d1i = h1r * zi + h1i * zr;
    const d2r = h2r * zr - h2i * zi;
    const d2i = h2r * zi + h2i * zr;
    const col = pos ? colU[1][gq] : colU[2][gq];
    const blk = p.block;
    const br = blk ? (pos ? blk.z1r : blk.z2r) : null;
    const bi = blk ? (pos ? blk.z1i : blk.z2i) : null;
    for (let j = 0; j < J; j++) {
      let r1 = -(z1r[j] * d1r - z1i[j] * d1i);
      let m1 = -(z1r[j] * d1i + z1i[j] * d1r);
      let r2 = -(z2r[j] * d2r - z2i[j] * d2i);
      let m2 = -(z2r[j] * d2i + z2i[j] * d2r);
      const zr = br && bi ? br[l * J + j] : col.re[nodes[j]];
      const zi = br && bi ? bi[l * J + j] : col.im[nodes[j]];
      if (pos) {
        r1 += zr;
        m1 += zi;
      } else {
        r2 += zr;
        m2 += zi;
      }
      M1r[q * J + j] = r1;
      M1i[q * J + j] = m1;
      M2r[q * J + j] = r2;
      M2i[q * J + j] = m2;
    }
  }
  return { a1r, a1i, a2r, a2i, M1r, M1i, M2r, M2i };
}
