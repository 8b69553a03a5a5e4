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
// closed form by the caller, see unitResponse.ts) and the damped fixed-point iteration runs on that small map; the
// damping halves whenever the residual grows. The iteration proper (iterateInjections) works in a reusable
// workspace and allocates nothing: a sweep runs it for every bus and fault type.
import type { InverterUnit } from "../network/model.ts";
import type { ComplexVec, LinearFault } from "../fault/solveLinearFault.ts";
import type { InverterUnitResult } from "../types.ts";
import { DenseResponse, type AffineMap, type UnitResponse } from "./unitResponse.ts";
import { newtonSolve } from "./newtonFallback.ts";

export const MAX_ITERATIONS = 300;
/**
 * The iteration stops when no unit's injection moves by more than this fraction of its rated current: a billionth,
 * far below any accuracy a protection study can use (instrument transformers are good to a percent or so), and the
 * independent phase-domain checks still agree to 1e-9 pu (tests/unit/engine/abc).
 */
export const TOLERANCE_PU = 1e-9;

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
/** |(x, y)|: Math.hypot guards against overflow that per-unit values cannot reach, at several times the cost. */
const mag = (x: number, y: number) => Math.sqrt(x * x + y * y);

const A: C = { re: -0.5, im: Math.sqrt(3) / 2 };
const A2: C = { re: -0.5, im: -Math.sqrt(3) / 2 };
/**
 * Workspace of the iteration: every per-unit quantity in typed arrays, so that an iteration step allocates nothing.
 * Create one per number of units and reuse it (see iterateInjections).
 */
export class InjectionWork {
  /** Voltages at the unit nodes for the present injections. */
  readonly v1r: Float64Array;
  readonly v1i: Float64Array;
  readonly v2r: Float64Array;
  readonly v2i: Float64Array;
  /** Targets: the injections each unit wants for those voltages, and its total output currents. */
  readonly t1r: Float64Array;
  readonly t1i: Float64Array;
  readonly t2r: Float64Array;
  readonly t2i: Float64Array;
  readonly o1r: Float64Array;
  readonly o1i: Float64Array;
  readonly o2r: Float64Array;
  readonly o2i: Float64Array;
  readonly limited: Uint8Array;
  /** The injections (the iterate): positive x1, negative x2 per unit. */
  readonly x1r: Float64Array;
  readonly x1i: Float64Array;
  readonly x2r: Float64Array;
  readonly x2i: Float64Array;
  /** Unit directions of the angle references (see referenceDirections). */
  readonly dirR: Float64Array;
  readonly dirI: Float64Array;
  /** The iterate and the targets flattened [x1r, x1i, x2r, x2i] (the arrays above are views of these). */
  readonly x: Float64Array;
  readonly t: Float64Array;
  /** Anderson acceleration over the components that can move (their flat indices in act): the iterate and the
   * residual f = t - x, the previous ones, the last ANDERSON_DEPTH differences dF of f and dG of x + f (ring
   * buffers), the inner products of the dF, and the least-squares system. */
  readonly act: Int32Array;
  readonly ax: Float64Array;
  readonly af: Float64Array;
  readonly axPrev: Float64Array;
  readonly afPrev: Float64Array;
  readonly dG: Float64Array;
  readonly dF: Float64Array;
  readonly dots: Float64Array;
  readonly gram: Float64Array;
  readonly rhs: Float64Array;
  /** The units' figures as a typed array (see unitFigures), and the units they belong to. */
  figures = new Float64Array(0);
  figuresOf: InverterUnit[] | null = null;
  constructor(readonly J: number) {
    const f = () => new Float64Array(J);
    this.v1r = f();
    this.v1i = f();
    this.v2r = f();
    this.v2i = f();
    this.t = new Float64Array(4 * J);
    this.t1r = this.t.subarray(0, J);
    this.t1i = this.t.subarray(J, 2 * J);
    this.t2r = this.t.subarray(2 * J, 3 * J);
    this.t2i = this.t.subarray(3 * J, 4 * J);
    this.o1r = f();
    this.o1i = f();
    this.o2r = f();
    this.o2i = f();
    this.limited = new Uint8Array(J);
    this.x = new Float64Array(4 * J);
    this.x1r = this.x.subarray(0, J);
    this.x1i = this.x.subarray(J, 2 * J);
    this.x2r = this.x.subarray(2 * J, 3 * J);
    this.x2i = this.x.subarray(3 * J, 4 * J);
    this.dirR = f();
    this.dirI = f();
    this.act = new Int32Array(4 * J);
    this.ax = new Float64Array(4 * J);
    this.af = new Float64Array(4 * J);
    this.axPrev = new Float64Array(4 * J);
    this.afPrev = new Float64Array(4 * J);
    this.dG = new Float64Array(ANDERSON_DEPTH * 4 * J);
    this.dF = new Float64Array(ANDERSON_DEPTH * 4 * J);
    this.dots = new Float64Array(ANDERSON_DEPTH * ANDERSON_DEPTH);
    this.gram = new Float64Array(ANDERSON_DEPTH * ANDERSON_DEPTH);
    this.rhs = new Float64Array(ANDERSON_DEPTH);
  }
}

/** Differences kept by the Anderson acceleration, and the iterations it may take before the damped iteration takes over. */
const ANDERSON_DEPTH = 3;
const ANDERSON_ITERATIONS = 60;

/**
 * Unit directions of the angle references: the voltages without converter injections (a1), or the prefault angle at
 * a dead terminal. The same for every iteration, so computed once.
 */
function referenceDirections(a1r: Float64Array, a1i: Float64Array, dirR: Float64Array, dirI: Float64Array): void {
  for (let j = 0; j < a1r.length; j++) {
    let refr = 1;
    let refi = 0;
    if (mag(a1r[j], a1i[j]) > 1e-9) {
      refr = a1r[j];
      refi = a1i[j];
    }
    const rm = mag(refr, refi);
    dirR[j] = refr / rm;
    dirI[j] = refi / rm;
  }
}

/** Figures per unit in UnitFigures order: iMax, ir, vScale, kFactor, activePower, k2 (0 without negative-sequence control). */
const UNIT_FIGURES = 6;

/** The grid-following figures of the units as one typed array, kept in the workspace while the units stay the same. */
function unitFigures(units: InverterUnit[], w: InjectionWork): Float64Array {
  if (w.figuresOf === units) return w.figures;
  const fig = new Float64Array(UNIT_FIGURES * units.length);
  units.forEach((u, j) => {
    fig.set([u.iMax_pu, u.ir_pu, u.vScale, u.kFactor, u.activePower_pu, u.negSeq === "k-factor" ? u.k2 : 0], UNIT_FIGURES * j);
  });
  w.figures = fig;
  w.figuresOf = units;
  return fig;
}

/**
 * Targets for the voltages in w (v1, v2), grid-following currents aligned with the reference directions. `full`
 * also writes the units' output currents and whether each is at its limit (the iteration itself needs neither).
 */
function targets(units: InverterUnit[], w: InjectionWork, vpre: Float64Array, full: boolean): void {
  const { dirR, dirI } = w;
  const fig = unitFigures(units, w);
  for (let j = 0; j < units.length; j++) {
    const u = units[j];
    const v1r = w.v1r[j];
    const v1i = w.v1i[j];
    const v2r = w.v2r[j];
    const v2i = w.v2i[j];
    if (u.control === "grid-forming") {
      const lim = u.iMax_pu * u.ir_pu;
      // Unlimited currents out of the source behind zForming (positive: E - V1; negative: -V2), then one common
      // scale so that the largest phase current stays within iMax Ir.
      const zr = u.zForming.re;
      const zi = u.zForming.im;
      const z2 = zr * zr + zi * zi;
      const e1r = vpre[u.node] - v1r;
      const e1i = -v1i;
      const i1ur = (e1r * zr + e1i * zi) / z2;
      const i1ui = (e1i * zr - e1r * zi) / z2;
      const e2r = -v2r;
      const e2i = -v2i;
      const i2ur = (e2r * zr + e2i * zi) / z2;
      const i2ui = (e2i * zr - e2r * zi) / z2;
      // Largest phase current of the unlimited source (no zero sequence in a converter): Ia = I1 + I2,
      // Ib = a^2 I1 + a I2, Ic = a I1 + a^2 I2.
      const par = i1ur + i2ur;
      const pai = i1ui + i2ui;
      const pbr = A2.re * i1ur - A2.im * i1ui + (A.re * i2ur - A.im * i2ui);
      const pbi = A2.re * i1ui + A2.im * i1ur + (A.re * i2ui + A.im * i2ur);
      const pcr = A.re * i1ur - A.im * i1ui + (A2.re * i2ur - A2.im * i2ui);
      const pci = A.re * i1ui + A.im * i1ur + (A2.re * i2ui + A2.im * i2ur);
      const m = Math.sqrt(Math.max(par * par + pai * pai, pbr * pbr + pbi * pbi, pcr * pcr + pci * pci));
      const k = m > lim ? lim / m : 1;
      const g1r = i1ur * k;
      const g1i = i1ui * k;
      const g2r = i2ur * k;
      const g2i = i2ui * k;
      w.t1r[j] = g1r - i1ur;
      w.t1i[j] = g1i - i1ui;
      w.t2r[j] = g2r - i2ur;
      w.t2i[j] = g2i - i2ui;
      if (full) {
        w.o1r[j] = g1r;
        w.o1i[j] = g1i;
        w.o2r[j] = g2r;
        w.o2i[j] = g2i;
        w.limited[j] = k < 1 ? 1 : 0;
      }
      continue;
    }
    // The unit's figures from the workspace's typed copy (see unitFigures): no object reads in the hot loop.
    const f = UNIT_FIGURES * j;
    const iMax = fig[f];
    const ir = fig[f + 1];
    const vm = Math.sqrt(v1r * v1r + v1i * v1i) * fig[f + 2];
    const dip = Math.max(0, 1 - vm);
    const iq = Math.min(fig[f + 3] * dip, iMax);
    const pmax = Math.sqrt(Math.max(0, iMax * iMax - iq * iq));
    const ip = Math.max(-pmax, Math.min(pmax, fig[f + 4]));
    const ar = ip * ir;
    const ai = -iq * ir;
    const br = dirR[j];
    const bi = dirI[j];
    const i1r = ar * br - ai * bi;
    const i1i = ar * bi + ai * br;
    let i2r = 0;
    let i2i = 0;
    if (fig[f + 5] > 0) {
      // negative-sequence control: k2 |V2| within what the limit leaves, leading V2 by 90 degrees
      const v2abs = mag(v2r, v2i);
      const v2m = v2abs * fig[f + 2];
      const room = Math.max(0, iMax - mag(ip, iq));
      const m2 = Math.min(fig[f + 5] * v2m, room);
      if (v2m > 1e-12) {
        const ci = (m2 * ir) / v2abs;
        i2r = 0 * v2r - ci * v2i;
        i2i = 0 * v2i + ci * v2r;
      }
    }
    w.t1r[j] = i1r;
    w.t1i[j] = i1i;
    w.t2r[j] = i2r;
    w.t2i[j] = i2i;
    if (full) {
      w.o1r[j] = i1r;
      w.o1i[j] = i1i;
      w.o2r[j] = i2r;
      w.o2i[j] = i2i;
      w.limited[j] = mag(ip, iq) + mag(i2r, i2i) / u.ir_pu >= u.iMax_pu * (1 - 1e-9) ? 1 : 0;
    }
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

export interface IterationReport {
  iterations: number;
  residual_pu: number;
  converged: boolean;
}

/** V for the injections x, then the targets for that V, into w (`full`: see targets). */
function step(units: InverterUnit[], resp: UnitResponse, w: InjectionWork, vpre: Float64Array, x1r: Float64Array, x1i: Float64Array, x2r: Float64Array, x2i: Float64Array, full = false): void {
  resp.evaluate(w, x1r, x1i, x2r, x2i);
  targets(units, w, vpre, full);
}

/** Largest |T(x) - x| over the units, in units of each one's rated current (one square root, of the largest square). */
function residualOf(units: InverterUnit[], w: InjectionWork): number {
  let worst = 0;
  for (let j = 0; j < units.length; j++) {
    const ar = w.t1r[j] - w.x1r[j];
    const ai = w.t1i[j] - w.x1i[j];
    const br = w.t2r[j] - w.x2r[j];
    const bi = w.t2i[j] - w.x2i[j];
    const ir = units[j].ir_pu;
    worst = Math.max(worst, (Math.max(ar * ar + ai * ai, br * br + bi * bi) / ir) / ir);
  }
  return Math.sqrt(worst);
}

/**
 * Damped fixed-point iterations from the present w.x; the step halves whenever the residual fails to fall by 5 %
 * (which also breaks two-cycles, whose residual stays put). Returns the last residual and the steps taken.
 */
function fixedPoint(units: InverterUnit[], resp: UnitResponse, w: InjectionWork, vpre: Float64Array, alpha0: number, maxIterations: number): { residual: number; steps: number } {
  const J = w.J;
  const { x1r, x1i, x2r, x2i, t1r, t1i, t2r, t2i } = w;
  let alpha = alpha0;
  let previous = Infinity;
  let residual = Infinity;
  let k = 0;
  for (; k < maxIterations; k++) {
    step(units, resp, w, vpre, x1r, x1i, x2r, x2i);
    residual = residualOf(units, w);
    if (residual < TOLERANCE_PU) return { residual, steps: k };
    if (residual > 0.95 * previous) alpha = Math.max(0.01, alpha / 2);
    previous = residual;
    for (let j = 0; j < J; j++) {
      x1r[j] += alpha * (t1r[j] - x1r[j]);
      x1i[j] += alpha * (t1i[j] - x1i[j]);
      x2r[j] += alpha * (t2r[j] - x2r[j]);
      x2i[j] += alpha * (t2i[j] - x2i[j]);
    }
  }
  return { residual, steps: k };
}

/**
 * Anderson-accelerated fixed point (type II, depth ANDERSON_DEPTH) from the present w.x: the next iterate combines
 * the last few so that their residuals cancel in the least-squares sense. Near a smooth fixed point it needs about
 * half the plain iteration's steps. The history is dropped when the least-squares system is singular or the
 * residual grows tenfold (a limit switching on or off changes the map); the plain damped iteration and Newton's
 * method remain behind it for what this does not settle.
 */
function andersonPoint(units: InverterUnit[], resp: UnitResponse, w: InjectionWork, vpre: Float64Array, maxIterations: number): { residual: number; steps: number } {
  const J = w.J;
  const { x, t, act, ax, af, axPrev, afPrev, dG, dF, dots, gram, rhs } = w;
  // Only the components that can move take part: a grid-following unit without negative-sequence control never
  // injects negative sequence (its x2 stays exactly zero), so the vectors are often half as long.
  let n = 0;
  for (let j = 0; j < J; j++) {
    act[n++] = j;
    act[n++] = J + j;
  }
  for (let j = 0; j < J; j++) {
    if (units[j].control !== "grid-forming" && units[j].negSeq !== "k-factor") continue;
    act[n++] = 2 * J + j;
    act[n++] = 3 * J + j;
  }
  let count = 0;
  let head = 0;
  let previous = Infinity;
  let residual = Infinity;
  let k = 0;
  for (; k < maxIterations; k++) {
    step(units, resp, w, vpre, w.x1r, w.x1i, w.x2r, w.x2i);
    residual = residualOf(units, w);
    if (residual < TOLERANCE_PU) return { residual, steps: k };
    for (let i = 0; i < n; i++) {
      const q = act[i];
      ax[i] = x[q];
      af[i] = t[q] - x[q];
    }
    if (residual > 10 * previous) {
      count = 0;
      head = 0;
    } else if (k > 0) {
      const o = head * n;
      for (let i = 0; i < n; i++) {
        const df = af[i] - afPrev[i];
        dF[o + i] = df;
        dG[o + i] = ax[i] - axPrev[i] + df;
      }
      if (count < ANDERSON_DEPTH) count++;
      // Only the new difference's inner products change (slots 0..count-1 hold the history, in any order).
      for (let a = 0; a < count; a++) {
        let g = 0;
        for (let i = 0; i < n; i++) g += dF[a * n + i] * dF[o + i];
        dots[a * ANDERSON_DEPTH + head] = g;
        dots[head * ANDERSON_DEPTH + a] = g;
      }
      head = (head + 1) % ANDERSON_DEPTH;
    }
    previous = residual;
    for (let i = 0; i < n; i++) {
      axPrev[i] = ax[i];
      afPrev[i] = af[i];
    }
    // gamma = argmin |f - dF gamma| by the normal equations (count x count, a tiny regularisation keeps it solvable).
    let ok = count > 0;
    if (ok) {
      for (let a = 0; a < count; a++) {
        let r = 0;
        for (let i = 0; i < n; i++) r += dF[a * n + i] * af[i];
        rhs[a] = r;
        for (let c = 0; c < count; c++) gram[a * count + c] = dots[a * ANDERSON_DEPTH + c];
      }
      ok = choleskySolve(gram, rhs, count);
    }
    if (!ok) {
      count = 0;
      head = 0;
    }
    for (let i = 0; i < n; i++) {
      let v = ax[i] + af[i];
      for (let a = 0; a < count; a++) v -= dG[a * n + i] * rhs[a];
      x[act[i]] = v;
    }
  }
  return { residual, steps: k };
}

/** Solves the small symmetric positive (semi)definite system g x = b in place (b becomes x); false when singular. */
function choleskySolve(g: Float64Array, b: Float64Array, m: number): boolean {
  let trace = 0;
  for (let a = 0; a < m; a++) trace += g[a * m + a];
  if (!(trace > 0)) return false;
  const eps = 1e-14 * trace;
  for (let a = 0; a < m; a++) g[a * m + a] += eps;
  for (let a = 0; a < m; a++) {
    for (let c = 0; c < a; c++) {
      let s = g[a * m + c];
      for (let q = 0; q < c; q++) s -= g[a * m + q] * g[c * m + q];
      g[a * m + c] = s / g[c * m + c];
    }
    let d = g[a * m + a];
    for (let q = 0; q < a; q++) d -= g[a * m + q] * g[a * m + q];
    if (!(d > eps)) return false;
    g[a * m + a] = Math.sqrt(d);
  }
  for (let a = 0; a < m; a++) {
    let s = b[a];
    for (let q = 0; q < a; q++) s -= g[a * m + q] * b[q];
    b[a] = s / g[a * m + a];
  }
  for (let a = m - 1; a >= 0; a--) {
    let s = b[a];
    for (let q = a + 1; q < m; q++) s -= g[q * m + a] * b[q];
    b[a] = s / g[a * m + a];
  }
  return true;
}

/** The damped fixed point stalled (limits switching, strong coupling): Newton's method from w.x, then small damped steps. */
function newtonFinish(units: InverterUnit[], resp: UnitResponse, w: InjectionWork, vpre: Float64Array, residual0: number): { residual: number; steps: number } {
  const J = w.J;
  const m = 4 * J;
  const { x1r, x1i, x2r, x2i } = w;
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
    step(units, resp, w, vpre, p1r, p1i, p2r, p2i);
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
  let residual = residual0;
  const nw = newtonSolve(pack(), F, norm, scale, TOLERANCE_PU);
  if (nw.norm < residual) {
    unpack(nw.z);
    x1r.set(p1r);
    x1i.set(p1i);
    x2r.set(p2r);
    x2i.set(p2i);
    residual = nw.norm;
  }
  let steps = nw.steps;
  // Newton stops short at a kink of the limits (min/max switching); small damped steps finish from there.
  if (!(residual < TOLERANCE_PU)) {
    const fp = fixedPoint(units, resp, w, vpre, 0.1, 4 * MAX_ITERATIONS);
    residual = fp.residual;
    steps += fp.steps;
  }
  return { residual, steps };
}

/**
 * Solves the refined model's injections for one fault: w.x holds them on return, and w's voltages, targets and
 * outputs are those of that final x. Starts from the targets for no injection.
 */
export function iterateInjections(units: InverterUnit[], resp: UnitResponse, vpre: Float64Array, w: InjectionWork): IterationReport {
  referenceDirections(resp.a1r, resp.a1i, w.dirR, w.dirI);
  w.x1r.fill(0);
  w.x1i.fill(0);
  w.x2r.fill(0);
  w.x2i.fill(0);
  step(units, resp, w, vpre, w.x1r, w.x1i, w.x2r, w.x2i);
  w.x1r.set(w.t1r);
  w.x1i.set(w.t1i);
  w.x2r.set(w.t2r);
  w.x2i.set(w.t2i);
  const aa = andersonPoint(units, resp, w, vpre, ANDERSON_ITERATIONS);
  let residual = aa.residual;
  let it = aa.steps;
  if (!(residual < TOLERANCE_PU)) {
    const fp = fixedPoint(units, resp, w, vpre, 1, MAX_ITERATIONS);
    residual = fp.residual;
    it += fp.steps;
  }
  if (!(residual < TOLERANCE_PU)) {
    const nf = newtonFinish(units, resp, w, vpre, residual);
    residual = nf.residual;
    it += nf.steps;
  }
  // Report the state actually injected (after the last update or Newton step), with the outputs and limits.
  step(units, resp, w, vpre, w.x1r, w.x1i, w.x2r, w.x2i, true);
  return { iterations: it + 1, residual_pu: residual, converged: residual < TOLERANCE_PU };
}

/** `precomputed`: the response when the caller has it in closed form (see compactResponse). */
export function refinedIteration(
  units: InverterUnit[],
  n: number,
  vpre: Float64Array,
  solve: (inj1: ComplexVec, inj2: ComplexVec) => LinearFault,
  precomputed?: UnitResponse,
): RefinedOutcome {
  const resp = precomputed ?? new DenseResponse(sampleMap(units, n, solve));
  const w = new InjectionWork(units.length);
  const report = iterateInjections(units, resp, vpre, w);
  const { x1r, x1i, x2r, x2i } = w;
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
  return { fault, inj: [inj1, inj2], iterations: report.iterations, residual_pu: report.residual_pu, converged: report.converged, units: unitsOut, out };
}
