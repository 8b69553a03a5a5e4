// Islet's refined inverter model: each unit's fault current follows its terminal voltage.
//  grid-following: reactive support Iq = kFactor (1 - |V1|) Ir plus the prefault active current P Ir, reactive
//    first, limited to iMax Ir, in phase with the positive-sequence voltage the unit's phase-locked loop follows (the
//    reactive part lags it by 90 degrees); optional negative sequence k2 |V2| Ir, leading V2 by 90 degrees as an
//    inductive negative-sequence impedance would draw, within what the limit leaves.
//    The angle reference is the unit's terminal voltage with every converter's injection removed (the part the
//    voltage sources and the fault make): where converters alone hold up a collapsed voltage, the terminal angle
//    is made by their own currents, has no fixed point and rotates from one iteration to the next. Where the grid
//    dominates, the two angles agree. At a dead terminal (no source voltage at all) the prefault angle is used.
//  grid-forming: a voltage source (the prefault voltage) behind zForming, stamped in the refined networks (positive
//    and negative sequence); when its largest phase current exceeds iMax Ir, extra injections scale its positive and
//    negative-sequence currents down together to the limit.
// The network response is affine in the injections, so it is sampled once (2J + 1 solutions for J units, or given in
// closed form by the caller) and the
// damped fixed-point iteration runs on that small map; the damping halves whenever the residual grows.
import type { InverterUnit } from "../network/model.ts";
import type { ComplexVec, LinearFault } from "../fault/solveLinearFault.ts";
import type { InverterUnitResult } from "../types.ts";
import type { AffineMap } from "../fault/compactFault.ts";
import { newtonSolve } from "./newtonFallback.ts";

export const MAX_ITERATIONS = 300;
export const TOLERANCE_PU = 1e-11;

type C = { re: number; im: number };

export interface RefinedOutcome {
  fault: LinearFault;
  inj: [ComplexVec, ComplexVec];
  iterations: number;
  residual_pu: number;
  converged: boolean;
  units: InverterUnitResult[];
  /** Total current out of each unit into its bus (positive, negative), node pu. */
  out: { i1: C; i2: C }[];
}

const cm = (a: C, b: C): C => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
const cabs = (a: C) => Math.hypot(a.re, a.im);

const A: C = { re: -0.5, im: Math.sqrt(3) / 2 };
const A2: C = { re: -0.5, im: -Math.sqrt(3) / 2 };
/** Largest phase-current magnitude of positive and negative-sequence currents (no zero sequence in a converter). */
function maxPhase(i1: C, i2: C): number {
  const b1 = cm(A2, i1);
  const b2 = cm(A, i2);
  const c1 = cm(A, i1);
  const c2 = cm(A2, i2);
  return Math.max(Math.hypot(i1.re + i2.re, i1.im + i2.im), Math.hypot(b1.re + b2.re, b1.im + b2.im), Math.hypot(c1.re + c2.re, c1.im + c2.im));
}

interface Target {
  x1: C[];
  x2: C[];
  out: { i1: C; i2: C }[];
  limited: boolean[];
}

function targets(units: InverterUnit[], v1s: C[], v2s: C[], vext: C[], vpre: Float64Array): Target {
  const t: Target = { x1: [], x2: [], out: [], limited: [] };
  units.forEach((u, j) => {
    const v1 = v1s[j];
    const v2 = v2s[j];
    const lim = u.iMax_pu * u.ir_pu;
    if (u.control === "grid-forming") {
      // Unlimited currents out of the source behind zForming (positive: E - V1; negative: -V2), then one common
      // scale so that the largest phase current stays within iMax Ir.
      const z2 = u.zForming.re ** 2 + u.zForming.im ** 2;
      const divZ = (a: C): C => ({ re: (a.re * u.zForming.re + a.im * u.zForming.im) / z2, im: (a.im * u.zForming.re - a.re * u.zForming.im) / z2 });
      const i1u = divZ({ re: vpre[u.node] - v1.re, im: -v1.im });
      const i2u = divZ({ re: -v2.re, im: -v2.im });
      const m = maxPhase(i1u, i2u);
      const k = m > lim ? lim / m : 1;
      const target1 = { re: i1u.re * k, im: i1u.im * k };
      const target2 = { re: i2u.re * k, im: i2u.im * k };
      t.x1.push({ re: target1.re - i1u.re, im: target1.im - i1u.im });
      t.x2.push({ re: target2.re - i2u.re, im: target2.im - i2u.im });
      t.out.push({ i1: target1, i2: target2 });
      t.limited.push(k < 1);
      return;
    }
    const vm = cabs(v1) * u.vScale;
    const dip = Math.max(0, 1 - vm);
    const iq = Math.min(u.kFactor * dip, u.iMax_pu);
    const pmax = Math.sqrt(Math.max(0, u.iMax_pu * u.iMax_pu - iq * iq));
    const ip = Math.max(-pmax, Math.min(pmax, u.activePower_pu));
    const ref = cabs(vext[j]) > 1e-9 ? vext[j] : { re: 1, im: 0 };
    const rm = cabs(ref);
    const i1 = cm({ re: ip * u.ir_pu, im: -iq * u.ir_pu }, { re: ref.re / rm, im: ref.im / rm });
    let i2 = { re: 0, im: 0 };
    if (u.negSeq === "k-factor") {
      const v2m = cabs(v2) * u.vScale;
      const room = Math.max(0, u.iMax_pu - Math.hypot(ip, iq));
      const m2 = Math.min(u.k2 * v2m, room);
      if (v2m > 1e-12) i2 = cm({ re: 0, im: (m2 * u.ir_pu) / cabs(v2) }, v2);
    }
    t.x1.push(i1);
    t.x2.push(i2);
    t.out.push({ i1, i2 });
    t.limited.push(Math.hypot(ip, iq) + cabs(i2) / u.ir_pu >= u.iMax_pu * (1 - 1e-9));
  });
  return t;
}

/** Samples the affine response V = a + M x at the unit nodes with 2J + 1 network solutions. */
function sampleMap(units: InverterUnit[], n: number, solve: (inj1: ComplexVec, inj2: ComplexVec) => LinearFault): AffineMap {
  const J = units.length;
  const vec = () => ({ re: new Float64Array(n), im: new Float64Array(n) });
  const at = (f: LinearFault, s: 1 | 2, u: InverterUnit): C => ({ re: f.v[s].re[u.node], im: f.v[s].im[u.node] });
  const base = solve(vec(), vec());
  const a1 = units.map((u) => at(base, 1, u));
  const a2 = units.map((u) => at(base, 2, u));
  const M1r = new Float64Array(2 * J * J);
  const M1i = new Float64Array(2 * J * J);
  const M2r = new Float64Array(2 * J * J);
  const M2i = new Float64Array(2 * J * J);
  for (let q = 0; q < 2 * J; q++) {
    const i1 = vec();
    const i2 = vec();
    const u = units[q % J];
    (q < J ? i1 : i2).re[u.node] = 1;
    const f = solve(i1, i2);
    units.forEach((w, j) => {
      M1r[q * J + j] = f.v[1].re[w.node] - a1[j].re;
      M1i[q * J + j] = f.v[1].im[w.node] - a1[j].im;
      M2r[q * J + j] = f.v[2].re[w.node] - a2[j].re;
      M2i[q * J + j] = f.v[2].im[w.node] - a2[j].im;
    });
  }
  return { a1, a2, M1r, M1i, M2r, M2i };
}

/** `precomputed`: the affine map when the caller has it in closed form (see compactAffineMap). */
export function refinedIteration(
  units: InverterUnit[],
  n: number,
  vpre: Float64Array,
  solve: (inj1: ComplexVec, inj2: ComplexVec) => LinearFault,
  precomputed?: AffineMap,
): RefinedOutcome {
  const J = units.length;
  const vec = () => ({ re: new Float64Array(n), im: new Float64Array(n) });
  const map = precomputed ?? sampleMap(units, n, solve);
  const { a1, a2, M1r, M1i, M2r, M2i } = map;
  const evalV = (x1: C[], x2: C[]) => {
    const v1 = a1.map((a) => ({ ...a }));
    const v2 = a2.map((a) => ({ ...a }));
    for (let q = 0; q < 2 * J; q++) {
      const x = q < J ? x1[q] : x2[q - J];
      const xr = x.re;
      const xi = x.im;
      if (xr === 0 && xi === 0) continue;
      const o = q * J;
      for (let j = 0; j < J; j++) {
        const a = M1r[o + j];
        const b = M1i[o + j];
        const c = M2r[o + j];
        const d = M2i[o + j];
        v1[j].re += a * xr - b * xi;
        v1[j].im += a * xi + b * xr;
        v2[j].re += c * xr - d * xi;
        v2[j].im += c * xi + d * xr;
      }
    }
    return { v1, v2, vext: a1 };
  };
  let x1: C[] = units.map(() => ({ re: 0, im: 0 }));
  let x2: C[] = units.map(() => ({ re: 0, im: 0 }));
  let e = evalV(x1, x2);
  let t = targets(units, e.v1, e.v2, e.vext, vpre);
  x1 = t.x1;
  x2 = t.x2;
  let residual = Infinity;
  let it = 0;
  /** Damped fixed-point iterations from the present x; the step halves whenever the residual fails to fall by 5 %. */
  const fixedPoint = (alpha0: number, maxIterations: number) => {
    let alpha = alpha0;
    let previous = Infinity;
    for (let k = 0; k < maxIterations; k++, it++) {
      e = evalV(x1, x2);
      t = targets(units, e.v1, e.v2, e.vext, vpre);
      residual = 0;
      for (let j = 0; j < J; j++) {
        const r1 = Math.hypot(t.x1[j].re - x1[j].re, t.x1[j].im - x1[j].im);
        const r2 = Math.hypot(t.x2[j].re - x2[j].re, t.x2[j].im - x2[j].im);
        residual = Math.max(residual, r1 / units[j].ir_pu, r2 / units[j].ir_pu);
      }
      if (residual < TOLERANCE_PU) return;
      // Also breaks two-cycles, whose residual stays put.
      if (residual > 0.95 * previous) alpha = Math.max(0.01, alpha / 2);
      previous = residual;
      const a = alpha;
      x1 = x1.map((x, j) => ({ re: x.re + a * (t.x1[j].re - x.re), im: x.im + a * (t.x1[j].im - x.im) }));
      x2 = x2.map((x, j) => ({ re: x.re + a * (t.x2[j].re - x.re), im: x.im + a * (t.x2[j].im - x.im) }));
    }
  };
  fixedPoint(1, MAX_ITERATIONS);
  if (!(residual < TOLERANCE_PU)) {
    // The damped fixed point stalled (limits switching, strong coupling): finish with Newton's method.
    const m = 4 * J;
    const pack = (a: C[], b: C[]) => {
      const z = new Float64Array(m);
      for (let j = 0; j < J; j++) {
        z[4 * j] = a[j].re;
        z[4 * j + 1] = a[j].im;
        z[4 * j + 2] = b[j].re;
        z[4 * j + 3] = b[j].im;
      }
      return z;
    };
    const unpack = (z: Float64Array): [C[], C[]] => [
      units.map((_, j) => ({ re: z[4 * j], im: z[4 * j + 1] })),
      units.map((_, j) => ({ re: z[4 * j + 2], im: z[4 * j + 3] })),
    ];
    const F = (z: Float64Array) => {
      const [a, b] = unpack(z);
      const ee = evalV(a, b);
      const tt = targets(units, ee.v1, ee.v2, ee.vext, vpre);
      const out = new Float64Array(m);
      for (let j = 0; j < J; j++) {
        out[4 * j] = tt.x1[j].re - a[j].re;
        out[4 * j + 1] = tt.x1[j].im - a[j].im;
        out[4 * j + 2] = tt.x2[j].re - b[j].re;
        out[4 * j + 3] = tt.x2[j].im - b[j].im;
      }
      return out;
    };
    const norm = (f: Float64Array) => {
      let r = 0;
      for (let j = 0; j < J; j++) r = Math.max(r, Math.hypot(f[4 * j], f[4 * j + 1]) / units[j].ir_pu, Math.hypot(f[4 * j + 2], f[4 * j + 3]) / units[j].ir_pu);
      return r;
    };
    const scale = new Float64Array(m);
    units.forEach((u, j) => scale.fill(u.ir_pu, 4 * j, 4 * j + 4));
    const nw = newtonSolve(pack(x1, x2), F, norm, scale, TOLERANCE_PU);
    if (nw.norm < residual) {
      [x1, x2] = unpack(nw.z);
      residual = nw.norm;
    }
    it += nw.steps;
    // Newton stops short at a kink of the limits (min/max switching); small damped steps finish from there.
    if (!(residual < TOLERANCE_PU)) fixedPoint(0.1, 4 * MAX_ITERATIONS);
  }
  const converged = residual < TOLERANCE_PU;
  {
    // Report the state actually injected (after the last update or Newton step).
    e = evalV(x1, x2);
    t = targets(units, e.v1, e.v2, e.vext, vpre);
  }
  // Currents out of each unit for the injections used: x itself (grid-following), or the unlimited source current
  // plus the limiting correction x (grid-forming). Equal to the targets once converged.
  const out = units.map((_, j) => ({
    i1: { re: t.out[j].i1.re - t.x1[j].re + x1[j].re, im: t.out[j].i1.im - t.x1[j].im + x1[j].im },
    i2: { re: t.out[j].i2.re - t.x2[j].re + x2[j].re, im: t.out[j].i2.im - t.x2[j].im + x2[j].im },
  }));
  const inj1 = vec();
  const inj2 = vec();
  units.forEach((u, j) => {
    inj1.re[u.node] += x1[j].re;
    inj1.im[u.node] += x1[j].im;
    inj2.re[u.node] += x2[j].re;
    inj2.im[u.node] += x2[j].im;
  });
  const fault = solve(inj1, inj2);
  const unitsOut: InverterUnitResult[] = units.map((u, j) => ({
    element: u.element,
    control: u.control,
    i1_pu: cabs(out[j].i1) / u.ir_pu,
    i2_pu: cabs(out[j].i2) / u.ir_pu,
    v1_pu: cabs(e.v1[j]) * u.vScale,
    limited: t.limited[j],
  }));
  return { fault, inj: [inj1, inj2], iterations: it + 1, residual_pu: residual, converged, units: unitsOut, out };
}
