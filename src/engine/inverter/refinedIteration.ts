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

const cabs = (a: C) => Math.hypot(a.re, a.im);

const A: C = { re: -0.5, im: Math.sqrt(3) / 2 };
const A2: C = { re: -0.5, im: -Math.sqrt(3) / 2 };
/** Largest phase-current magnitude of positive and negative-sequence currents (no zero sequence in a converter). */
function maxPhase(i1r: number, i1i: number, i2r: number, i2i: number): number {
  // b1 = a^2 i1, b2 = a i2, c1 = a i1, c2 = a^2 i2 (written out as cm(x, y) = (x.re y.re - x.im y.im, x.re y.im + x.im y.re))
  const b1r = A2.re * i1r - A2.im * i1i;
  const b1i = A2.re * i1i + A2.im * i1r;
  const b2r = A.re * i2r - A.im * i2i;
  const b2i = A.re * i2i + A.im * i2r;
  const c1r = A.re * i1r - A.im * i1i;
  const c1i = A.re * i1i + A.im * i1r;
  const c2r = A2.re * i2r - A2.im * i2i;
  const c2i = A2.re * i2i + A2.im * i2r;
  return Math.max(Math.hypot(i1r + i2r, i1i + i2i), Math.hypot(b1r + b2r, b1i + b2i), Math.hypot(c1r + c2r, c1i + c2i));
}

/**
 * Workspace of the iteration: every per-unit quantity in typed arrays, so that an iteration step allocates nothing
 * (the sweep runs it for every bus and fault type). Arithmetic is the same, operation by operation, as the object
 * form it replaced.
 */
interface Work {
  J: number;
  /** Voltages at the unit nodes for the present injections. */
  v1r: Float64Array;
  v1i: Float64Array;
  v2r: Float64Array;
  v2i: Float64Array;
  /** Targets: the injections each unit wants for those voltages, and its total output currents. */
  t1r: Float64Array;
  t1i: Float64Array;
  t2r: Float64Array;
  t2i: Float64Array;
  o1r: Float64Array;
  o1i: Float64Array;
  o2r: Float64Array;
  o2i: Float64Array;
  limited: Uint8Array;
}

function createWork(J: number): Work {
  const f = () => new Float64Array(J);
  return { J, v1r: f(), v1i: f(), v2r: f(), v2i: f(), t1r: f(), t1i: f(), t2r: f(), t2i: f(), o1r: f(), o1i: f(), o2r: f(), o2i: f(), limited: new Uint8Array(J) };
}

/**
 * Unit directions of the angle references: the voltages without converter injections (a1), or the prefault angle at
 * a dead terminal. The same for every iteration, so computed once.
 */
function referenceDirections(a1r: Float64Array, a1i: Float64Array): { dirR: Float64Array; dirI: Float64Array } {
  const J = a1r.length;
  const dirR = new Float64Array(J);
  const dirI = new Float64Array(J);
  for (let j = 0; j < J; j++) {
    let refr = 1;
    let refi = 0;
    if (Math.hypot(a1r[j], a1i[j]) > 1e-9) {
      refr = a1r[j];
      refi = a1i[j];
    }
    const rm = Math.hypot(refr, refi);
    dirR[j] = refr / rm;
    dirI[j] = refi / rm;
  }
  return { dirR, dirI };
}

/** Targets for the voltages in w (v1, v2), grid-following currents aligned with the reference directions. */
function targets(units: InverterUnit[], w: Work, dirR: Float64Array, dirI: Float64Array, vpre: Float64Array): void {
  for (let j = 0; j < units.length; j++) {
    const u = units[j];
    const v1r = w.v1r[j];
    const v1i = w.v1i[j];
    const v2r = w.v2r[j];
    const v2i = w.v2i[j];
    const lim = u.iMax_pu * u.ir_pu;
    if (u.control === "grid-forming") {
      // Unlimited currents out of the source behind zForming (positive: E - V1; negative: -V2), then one common
      // scale so that the largest phase current stays within iMax Ir.
      const zr = u.zForming.re;
      const zi = u.zForming.im;
      const z2 = zr ** 2 + zi ** 2;
      const e1r = vpre[u.node] - v1r;
      const e1i = -v1i;
      const i1ur = (e1r * zr + e1i * zi) / z2;
      const i1ui = (e1i * zr - e1r * zi) / z2;
      const e2r = -v2r;
      const e2i = -v2i;
      const i2ur = (e2r * zr + e2i * zi) / z2;
      const i2ui = (e2i * zr - e2r * zi) / z2;
      const m = maxPhase(i1ur, i1ui, i2ur, i2ui);
      const k = m > lim ? lim / m : 1;
      const g1r = i1ur * k;
      const g1i = i1ui * k;
      const g2r = i2ur * k;
      const g2i = i2ui * k;
      w.t1r[j] = g1r - i1ur;
      w.t1i[j] = g1i - i1ui;
      w.t2r[j] = g2r - i2ur;
      w.t2i[j] = g2i - i2ui;
      w.o1r[j] = g1r;
      w.o1i[j] = g1i;
      w.o2r[j] = g2r;
      w.o2i[j] = g2i;
      w.limited[j] = k < 1 ? 1 : 0;
      continue;
    }
    const vm = Math.hypot(v1r, v1i) * u.vScale;
    const dip = Math.max(0, 1 - vm);
    const iq = Math.min(u.kFactor * dip, u.iMax_pu);
    const pmax = Math.sqrt(Math.max(0, u.iMax_pu * u.iMax_pu - iq * iq));
    const ip = Math.max(-pmax, Math.min(pmax, u.activePower_pu));
    const ar = ip * u.ir_pu;
    const ai = -iq * u.ir_pu;
    const br = dirR[j];
    const bi = dirI[j];
    const i1r = ar * br - ai * bi;
    const i1i = ar * bi + ai * br;
    let i2r = 0;
    let i2i = 0;
    if (u.negSeq === "k-factor") {
      const v2abs = Math.hypot(v2r, v2i);
      const v2m = v2abs * u.vScale;
      const room = Math.max(0, u.iMax_pu - Math.hypot(ip, iq));
      const m2 = Math.min(u.k2 * v2m, room);
      if (v2m > 1e-12) {
        const ci = (m2 * u.ir_pu) / v2abs;
        i2r = 0 * v2r - ci * v2i;
        i2i = 0 * v2i + ci * v2r;
      }
    }
    w.t1r[j] = i1r;
    w.t1i[j] = i1i;
    w.t2r[j] = i2r;
    w.t2i[j] = i2i;
    w.o1r[j] = i1r;
    w.o1i[j] = i1i;
    w.o2r[j] = i2r;
    w.o2i[j] = i2i;
    w.limited[j] = Math.hypot(ip, iq) + Math.hypot(i2r, i2i) / u.ir_pu >= u.iMax_pu * (1 - 1e-9) ? 1 : 0;
  }
}

/** Samples the affine response V = a + M x at the unit nodes with 2J + 1 network solutions. */
function sampleMap(units: InverterUnit[], n: number, solve: (inj1: ComplexVec, inj2: ComplexVec) => LinearFault): AffineMap {
  const J = units.length;
  const vec = () => ({ re: new Float64Array(n), im: new Float64Array(n) });
  const base = solve(vec(), vec());
  const a1r = new Float64Array(J);
  const a1i = new Float64Array(J);
  const a2r = new Float64Array(J);
  const a2i = new Float64Array(J);
  units.forEach((u, j) => {
    a1r[j] = base.v[1].re[u.node];
    a1i[j] = base.v[1].im[u.node];
    a2r[j] = base.v[2].re[u.node];
    a2i[j] = base.v[2].im[u.node];
  });
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
      M1r[q * J + j] = f.v[1].re[w.node] - a1r[j];
      M1i[q * J + j] = f.v[1].im[w.node] - a1i[j];
      M2r[q * J + j] = f.v[2].re[w.node] - a2r[j];
      M2i[q * J + j] = f.v[2].im[w.node] - a2i[j];
    });
  }
  return { a1r, a1i, a2r, a2i, M1r, M1i, M2r, M2i };
}

/** V = a + M x at the unit nodes, into w.v1 / w.v2 (columns with a zero injection are skipped). */
function evalV(map: AffineMap, w: Work, x1r: Float64Array, x1i: Float64Array, x2r: Float64Array, x2i: Float64Array): void {
  const J = w.J;
  const { M1r, M1i, M2r, M2i } = map;
  const { v1r, v1i, v2r, v2i } = w;
  v1r.set(map.a1r);
  v1i.set(map.a1i);
  v2r.set(map.a2r);
  v2i.set(map.a2i);
  for (let q = 0; q < 2 * J; q++) {
    const xr = q < J ? x1r[q] : x2r[q - J];
    const xi = q < J ? x1i[q] : x2i[q - J];
    if (xr === 0 && xi === 0) continue;
    const o = q * J;
    for (let j = 0; j < J; j++) {
      const a = M1r[o + j];
      const b = M1i[o + j];
      const c = M2r[o + j];
      const d = M2i[o + j];
      v1r[j] += a * xr - b * xi;
      v1i[j] += a * xi + b * xr;
      v2r[j] += c * xr - d * xi;
      v2i[j] += c * xi + d * xr;
    }
  }
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
  const map = precomputed ?? sampleMap(units, n, solve);
  const { dirR, dirI } = referenceDirections(map.a1r, map.a1i);
  const w = createWork(J);
  const step = (x1r: Float64Array, x1i: Float64Array, x2r: Float64Array, x2i: Float64Array) => {
    evalV(map, w, x1r, x1i, x2r, x2i);
    targets(units, w, dirR, dirI, vpre);
  };
  const x1r = new Float64Array(J);
  const x1i = new Float64Array(J);
  const x2r = new Float64Array(J);
  const x2i = new Float64Array(J);
  step(x1r, x1i, x2r, x2i);
  x1r.set(w.t1r);
  x1i.set(w.t1i);
  x2r.set(w.t2r);
  x2i.set(w.t2i);
  let residual = Infinity;
  let it = 0;
  /** Damped fixed-point iterations from the present x; the step halves whenever the residual fails to fall by 5 %. */
  const fixedPoint = (alpha0: number, maxIterations: number) => {
    let alpha = alpha0;
    let previous = Infinity;
    for (let k = 0; k < maxIterations; k++, it++) {
      step(x1r, x1i, x2r, x2i);
      residual = 0;
      for (let j = 0; j < J; j++) {
        const r1 = Math.hypot(w.t1r[j] - x1r[j], w.t1i[j] - x1i[j]);
        const r2 = Math.hypot(w.t2r[j] - x2r[j], w.t2i[j] - x2i[j]);
        residual = Math.max(residual, r1 / units[j].ir_pu, r2 / units[j].ir_pu);
      }
      if (residual < TOLERANCE_PU) return;
      // Also breaks two-cycles, whose residual stays put.
      if (residual > 0.95 * previous) alpha = Math.max(0.01, alpha / 2);
      previous = residual;
      const a = alpha;
      for (let j = 0; j < J; j++) {
        x1r[j] = x1r[j] + a * (w.t1r[j] - x1r[j]);
        x1i[j] = x1i[j] + a * (w.t1i[j] - x1i[j]);
        x2r[j] = x2r[j] + a * (w.t2r[j] - x2r[j]);
        x2i[j] = x2i[j] + a * (w.t2i[j] - x2i[j]);
      }
    }
  };
  fixedPoint(1, MAX_ITERATIONS);
  if (!(residual < TOLERANCE_PU)) {
    // The damped fixed point stalled (limits switching, strong coupling): finish with Newton's method.
    const m = 4 * J;
    const pack = () => {
      const z = new Float64Array(m);
      for (let j = 0; j < J; j++) {
        z[4 * j] = x1r[j];
        z[4 * j + 1] = x1i[j];
        z[4 * j + 2] = x2r[j];
        z[4 * j + 3] = x2i[j];
      }
      return z;
    };
    const p1r = new Float64Array(J);
    const p1i = new Float64Array(J);
    const p2r = new Float64Array(J);
    const p2i = new Float64Array(J);
    const unpack = (z: Float64Array) => {
      for (let j = 0; j < J; j++) {
        p1r[j] = z[4 * j];
        p1i[j] = z[4 * j + 1];
        p2r[j] = z[4 * j + 2];
        p2i[j] = z[4 * j + 3];
      }
    };
    const F = (z: Float64Array) => {
      unpack(z);
      step(p1r, p1i, p2r, p2i);
      const out = new Float64Array(m);
      for (let j = 0; j < J; j++) {
        out[4 * j] = w.t1r[j] - p1r[j];
        out[4 * j + 1] = w.t1i[j] - p1i[j];
        out[4 * j + 2] = w.t2r[j] - p2r[j];
        out[4 * j + 3] = w.t2i[j] - p2i[j];
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
    const nw = newtonSolve(pack(), F, norm, scale, TOLERANCE_PU);
    if (nw.norm < residual) {
      unpack(nw.z);
      x1r.set(p1r);
      x1i.set(p1i);
      x2r.set(p2r);
      x2i.set(p2i);
      residual = nw.norm;
    }
    it += nw.steps;
    // Newton stops short at a kink of the limits (min/max switching); small damped steps finish from there.
    if (!(residual < TOLERANCE_PU)) fixedPoint(0.1, 4 * MAX_ITERATIONS);
  }
  const converged = residual < TOLERANCE_PU;
  // Report the state actually injected (after the last update or Newton step).
  step(x1r, x1i, x2r, x2i);
  // Currents out of each unit for the injections used: x itself (grid-following), or the unlimited source current
  // plus the limiting correction x (grid-forming). Equal to the targets once converged.
  const out = units.map((_, j) => ({
    i1: { re: w.o1r[j] - w.t1r[j] + x1r[j], im: w.o1i[j] - w.t1i[j] + x1i[j] },
    i2: { re: w.o2r[j] - w.t2r[j] + x2r[j], im: w.o2i[j] - w.t2i[j] + x2i[j] },
  }));
  const inj1 = { re: new Float64Array(n), im: new Float64Array(n) };
  const inj2 = { re: new Float64Array(n), im: new Float64Array(n) };
  units.forEach((u, j) => {
    inj1.re[u.node] += x1r[j];
    inj1.im[u.node] += x1i[j];
    inj2.re[u.node] += x2r[j];
    inj2.im[u.node] += x2i[j];
  });
  const fault = solve(inj1, inj2);
  const unitsOut: InverterUnitResult[] = units.map((u, j) => ({
    element: u.element,
    control: u.control,
    i1_pu: cabs(out[j].i1) / u.ir_pu,
    i2_pu: cabs(out[j].i2) / u.ir_pu,
    v1_pu: Math.hypot(w.v1r[j], w.v1i[j]) * u.vScale,
    limited: w.limited[j] === 1,
  }));
  return { fault, inj: [inj1, inj2], iterations: it + 1, residual_pu: residual, converged, units: unitsOut, out };
}
