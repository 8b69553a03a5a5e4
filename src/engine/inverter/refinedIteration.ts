// Islet's refined inverter model: each unit's fault current follows its terminal voltage.
//  grid-following: reactive support Iq = kFactor (1 - |V1|) Ir plus the prefault active current P Ir, reactive
//    first, limited to iMax Ir, in phase with the terminal positive-sequence voltage (the reactive part lags it by
//    90 degrees); optional negative sequence k2 |V2| Ir (leading V2 by 90 degrees, as an inductive negative-sequence
//    impedance would draw) within what the limit leaves.
//  grid-forming: a voltage source (the prefault voltage) behind zForming, stamped in the refined networks; when its
//    current exceeds iMax Ir an extra injection holds it at the limit, at the angle of the unlimited current.
// Solved by a damped fixed-point iteration on the injections; the report says whether it converged.
import type { InverterUnit } from "../network/model.ts";
import type { ComplexVec, LinearFault } from "../fault/solveLinearFault.ts";
import type { InverterUnitResult } from "../types.ts";
import { abs, div, mul, sub } from "../complex.ts";

export const DAMPING = 0.5;
export const MAX_ITERATIONS = 400;
export const TOLERANCE_PU = 1e-11;

export interface RefinedOutcome {
  fault: LinearFault;
  inj: [ComplexVec, ComplexVec];
  iterations: number;
  residual_pu: number;
  converged: boolean;
  units: InverterUnitResult[];
  /** Total current out of each unit into its bus (positive, negative), node pu. */
  out: { i1: { re: number; im: number }; i2: { re: number; im: number } }[];
}

interface Target {
  x1: { re: number; im: number }[];
  x2: { re: number; im: number }[];
  out: RefinedOutcome["out"];
  limited: boolean[];
}

function targets(units: InverterUnit[], f: LinearFault, vpre: Float64Array): Target {
  const x1: Target["x1"] = [];
  const x2: Target["x2"] = [];
  const out: Target["out"] = [];
  const limited: boolean[] = [];
  for (const u of units) {
    const v1 = { re: f.v[1].re[u.node], im: f.v[1].im[u.node] };
    const v2 = { re: f.v[2].re[u.node], im: f.v[2].im[u.node] };
    const lim = u.iMax_pu * u.ir_pu;
    if (u.control === "grid-forming") {
      const iu = div(sub({ re: vpre[u.node], im: 0 }, v1), u.zForming);
      const m = abs(iu);
      const over = m > lim;
      const target = over ? { re: (iu.re * lim) / m, im: (iu.im * lim) / m } : iu;
      x1.push(sub(target, iu));
      x2.push({ re: 0, im: 0 });
      const i2 = div({ re: -v2.re, im: -v2.im }, u.zForming);
      out.push({ i1: target, i2 });
      limited.push(over);
      continue;
    }
    const vm = abs(v1) * u.vScale;
    const dip = Math.max(0, 1 - vm);
    const iq = Math.min(u.kFactor * dip, u.iMax_pu);
    const pmax = Math.sqrt(Math.max(0, u.iMax_pu * u.iMax_pu - iq * iq));
    const ip = Math.max(-pmax, Math.min(pmax, u.activePower_pu));
    const ang = vm > 1e-9 ? Math.atan2(v1.im, v1.re) : 0;
    const rot = { re: Math.cos(ang), im: Math.sin(ang) };
    const i1 = mul({ re: ip * u.ir_pu, im: -iq * u.ir_pu }, rot);
    let i2 = { re: 0, im: 0 };
    if (u.negSeq === "k-factor") {
      const v2m = abs(v2) * u.vScale;
      const room = Math.max(0, u.iMax_pu - Math.hypot(ip, iq));
      const m2 = Math.min(u.k2 * v2m, room);
      if (v2m > 1e-12) i2 = mul({ re: 0, im: (m2 * u.ir_pu) / abs(v2) }, v2);
    }
    x1.push(i1);
    x2.push(i2);
    out.push({ i1, i2 });
    limited.push(Math.hypot(ip, iq) + abs(i2) / u.ir_pu >= u.iMax_pu * (1 - 1e-9));
  }
  return { x1, x2, out, limited };
}

export function refinedIteration(units: InverterUnit[], n: number, vpre: Float64Array, solve: (inj1: ComplexVec, inj2: ComplexVec) => LinearFault): RefinedOutcome {
  const J = units.length;
  let x1 = Array.from({ length: J }, () => ({ re: 0, im: 0 }));
  let x2 = Array.from({ length: J }, () => ({ re: 0, im: 0 }));
  const build = () => {
    const a = { re: new Float64Array(n), im: new Float64Array(n) };
    const b = { re: new Float64Array(n), im: new Float64Array(n) };
    units.forEach((u, j) => {
      a.re[u.node] += x1[j].re;
      a.im[u.node] += x1[j].im;
      b.re[u.node] += x2[j].re;
      b.im[u.node] += x2[j].im;
    });
    return [a, b] as [ComplexVec, ComplexVec];
  };
  // Start from the prefault state: every unit at its prefault active current.
  let inj = build();
  let f = solve(inj[0], inj[1]);
  let t = targets(units, f, vpre);
  x1 = t.x1;
  x2 = t.x2;
  let residual = Infinity;
  let it = 0;
  for (; it < MAX_ITERATIONS; it++) {
    inj = build();
    f = solve(inj[0], inj[1]);
    t = targets(units, f, vpre);
    residual = 0;
    for (let j = 0; j < J; j++) {
      residual = Math.max(residual, abs(sub(t.x1[j], x1[j])) / units[j].ir_pu, abs(sub(t.x2[j], x2[j])) / units[j].ir_pu);
    }
    if (residual < TOLERANCE_PU) break;
    x1 = x1.map((x, j) => ({ re: x.re + DAMPING * (t.x1[j].re - x.re), im: x.im + DAMPING * (t.x1[j].im - x.im) }));
    x2 = x2.map((x, j) => ({ re: x.re + DAMPING * (t.x2[j].re - x.re), im: x.im + DAMPING * (t.x2[j].im - x.im) }));
  }
  const converged = residual < TOLERANCE_PU;
  const unitsOut: InverterUnitResult[] = units.map((u, j) => ({
    element: u.element,
    control: u.control,
    i1_pu: abs(t.out[j].i1) / u.ir_pu,
    i2_pu: abs(t.out[j].i2) / u.ir_pu,
    v1_pu: Math.hypot(f.v[1].re[u.node], f.v[1].im[u.node]) * u.vScale,
    limited: t.limited[j],
  }));
  return { fault: f, inj, iterations: it + 1, residual_pu: residual, converged, units: unitsOut, out: t.out };
}
