// Peak short-circuit current ip (IEC 60909-0:2016, 8.1): for a radial island the sum of the partial peak currents
// of every element meeting at the fault (each with its own R/X, found from its partial current: Z_e = c / I_e under a
// bolted three-phase fault); for a meshed island method B, 1.15 kappa(R/X at the fault), capped at 1.8 (LV) / 2.0.
// kappa belongs to the voltage sources' share of I"k only; full-size converters add their share with kappa = 1
// (see peakCurrent_kA).
import type { Cx, Model } from "../network/model.ts";
import type { PeakMethod } from "../types.ts";
import { peakFactor } from "../iec60909/factors.ts";
import { branchEndCurrents, shuntCurrent } from "./endCurrents.ts";
import type { ComplexVec } from "./solveLinearFault.ts";

/**
 * Peak current with full-size converter units (IEC 60909-0:2016, 8.1; from memory: a converter's contribution to
 * ip is sqrt(2) I"kPF, its current being controlled, with no decaying d.c. component): the a.c. peak of the whole
 * current plus the d.c. part of the voltage sources' share I"k,S (the same fault with the converters' injections
 * removed), ip = sqrt(2) (I"k + (kappa - 1) I"k,S). With the IEC converter model the two shares are in phase
 * (I"k = I"k,S + I"kPF), so this is kappa sqrt(2) I"k,S + sqrt(2) I"kPF; without converters it is kappa sqrt(2) I"k.
 */
export function peakCurrent_kA(kappa: number, ikss_kA: number, ikssSources_kA: number): number {
  return Math.SQRT2 * (ikss_kA + (kappa - 1) * ikssSources_kA);
}

export function isRadialIsland(model: Model, island: number): boolean {
  let nodes = 0;
  let edges = 0;
  for (const n of model.nodes) if (n.island === island) nodes++;
  // an opened branch (protective device open, see network/openEnds.ts) connects nothing
  for (const b of model.branches) if (!b.open && model.nodes[b.from].island === island) edges++;
  return edges === nodes - 1;
}

/**
 * Effective kappa at node k. zk1: positive-sequence column of Z at k (no injections), zkk its diagonal, c the source
 * voltage. Converter infeed is left out of kappa (their currents carry no d.c. component worth counting).
 */
export function peakKappa(model: Model, k: number, zk1: ComplexVec, zkk: Cx | null, c: number, un_kV: number): { kappa: number; method: PeakMethod } {
  if (!zkk || !(Math.hypot(zkk.re, zkk.im) > 0)) return { kappa: 1, method: "none" };
  const island = model.nodes[k].island;
  if (!isRadialIsland(model, island)) {
    const rx = zkk.im > 0 ? zkk.re / zkk.im : 10;
    return { kappa: Math.min(1.15 * peakFactor(rx), un_kV <= 1 ? 1.8 : 2.0), method: "meshed-method-b" };
  }
  // Bolted 3ph fault, no injections: V = c (1 - Z[:,k]/Zkk); currents from dV = -c Z[:,k]/Zkk.
  const m2 = zkk.re * zkk.re + zkk.im * zkk.im;
  const n = model.nodes.length;
  const vre = new Float64Array(n);
  const vim = new Float64Array(n);
  const vpre = new Float64Array(n).fill(c);
  for (let j = 0; j < n; j++) {
    const qr = (zk1.re[j] * zkk.re + zk1.im[j] * zkk.im) / m2;
    const qi = (zk1.im[j] * zkk.re - zk1.re[j] * zkk.im) / m2;
    vre[j] = c - c * qr;
    vim[j] = -c * qi;
  }
  const zero = { re: new Float64Array(n), im: new Float64Array(n) };
  const v: [ComplexVec, ComplexVec, ComplexVec] = [zero, { re: vre, im: vim }, zero];
  let sumPeak = 0;
  let sumMag = 0;
  const add = (i: Cx) => {
    const mag = Math.hypot(i.re, i.im);
    if (!(mag > 1e-12)) return;
    // feed F = -i; Z_e = c / F
    const fr = -i.re;
    const fi = -i.im;
    const f2 = fr * fr + fi * fi;
    const zr = (c * fr) / f2;
    const zi = (-c * fi) / f2;
    const rx = zi > 0 ? zr / zi : 10;
    sumPeak += peakFactor(Math.max(0, rx)) * mag;
    sumMag += mag;
  };
  for (const b of model.branches) {
    if (b.from !== k && b.to !== k) continue;
    const cur = branchEndCurrents(b, v, vpre);
    add(b.from === k ? cur.from[1] : cur.to[1]);
  }
  for (const s of model.shunts) if (s.node === k && !s.refinedOnly) add(shuntCurrent(s, v, vpre)[1]);
  if (!(sumMag > 0)) return { kappa: 1, method: "none" };
  // ip = sqrt2 * sum kappa_e |I_e|; expressed as an effective kappa on I"k = c / |Zkk|.
  return { kappa: sumPeak / (c / Math.sqrt(m2)), method: "radial-branch-sum" };
}
