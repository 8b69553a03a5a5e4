// The network solution for one fault with given source injections: sequence voltages at every node (in the
// unshifted frame: every node's prefault positive-sequence voltage is the real number vpre[node]) and the fault
// currents. Linear in the injections, so the refined inverter iteration calls it repeatedly.
//   non-floating part:  V = Voc - Z[:,k] I,  Voc = vpre + Z inj
//   floating part:      V = G inj - G[:,k] I + w (Vk - (G inj)_k + G_kk I) / w_k,  with G = Z' - w w^T
import type { Cx, Seq } from "../network/model.ts";
import type { SequenceSystem } from "../network/sequenceSystem.ts";
import { applyZ } from "../network/sequenceSystem.ts";
import type { FaultType } from "../types.ts";
import { faultEquations, type SeqView } from "./faultEquations.ts";
import { div, mul } from "../complex.ts";

export interface ComplexVec {
  re: Float64Array;
  im: Float64Array;
}

export interface LinearFault {
  v: [ComplexVec, ComplexVec, ComplexVec];
  i: [Cx, Cx, Cx];
  consistent: boolean;
  /** Thevenin impedance of each sequence at the fault (null when floating). */
  zkk: [Cx | null, Cx | null, Cx | null];
}

export interface LinearFaultInput {
  systems: [SequenceSystem, SequenceSystem, SequenceSystem];
  k: number;
  type: FaultType;
  zf: Cx;
  vpre: Float64Array;
  /** Live positive-sequence islands per node (dead nodes stay at zero). */
  live: Uint8Array;
  /** Column k of Z' for each sequence (reused across iterations). */
  zk: [ComplexVec, ComplexVec, ComplexVec];
  /** Injections into nodes per sequence (null = none). */
  inj: [ComplexVec | null, ComplexVec | null, ComplexVec | null];
}

export function solveLinearFault(p: LinearFaultInput): LinearFault {
  const n = p.vpre.length;
  const views: SeqView[] = [];
  const xs: (ComplexVec | null)[] = [];
  const wInj: Cx[] = [];
  for (const s of [0, 1, 2] as Seq[]) {
    const sys = p.systems[s];
    const inj = p.inj[s];
    const x = inj ? applyZ(sys, inj.re, inj.im) : null;
    xs.push(x);
    const ck = sys.comp[p.k];
    let wr = 0;
    let wi = 0;
    if (inj && sys.floating[ck]) {
      for (let j = 0; j < n; j++) {
        if (sys.comp[j] !== ck) continue;
        wr += sys.wre[j] * inj.re[j] - sys.wim[j] * inj.im[j];
        wi += sys.wre[j] * inj.im[j] + sys.wim[j] * inj.re[j];
      }
    }
    wInj.push({ re: wr, im: wi });
    if (sys.floating[ck]) {
      views.push({ floating: true, j: div({ re: wr, im: wi }, { re: sys.wre[p.k], im: sys.wim[p.k] }) });
    } else {
      const e = { re: (s === 1 ? p.vpre[p.k] : 0) + (x ? x.re[p.k] : 0), im: x ? x.im[p.k] : 0 };
      views.push({ floating: false, e, z: { re: p.zk[s].re[p.k], im: p.zk[s].im[p.k] } });
    }
  }
  const fp = faultEquations(p.type, views as [SeqView, SeqView, SeqView], p.zf);
  const v: ComplexVec[] = [];
  for (const s of [0, 1, 2] as Seq[]) {
    const sys = p.systems[s];
    const x = xs[s];
    const zk = p.zk[s];
    const ck = sys.comp[p.k];
    const I = fp.i[s];
    const re = new Float64Array(n);
    const im = new Float64Array(n);
    if (sys.floating[ck]) {
      // G inj and G[:,k] on k's component, then the common-mode term fixed by the fault voltage.
      const wk = { re: sys.wre[p.k], im: sys.wim[p.k] };
      const gx = (j: number): Cx => {
        if (!x) return { re: 0, im: 0 };
        const wj = { re: sys.wre[j], im: sys.wim[j] };
        const t = mul(wj, wInj[s]);
        return { re: x.re[j] - t.re, im: x.im[j] - t.im };
      };
      const gk = (j: number): Cx => {
        const t = mul({ re: sys.wre[j], im: sys.wim[j] }, wk);
        return { re: zk.re[j] - t.re, im: zk.im[j] - t.im };
      };
      const gxk = gx(p.k);
      const gkk = gk(p.k);
      const gkkI = mul(gkk, I);
      const common = div({ re: fp.v[s].re - gxk.re + gkkI.re, im: fp.v[s].im - gxk.im + gkkI.im }, wk);
      for (let j = 0; j < n; j++) {
        if (sys.comp[j] === ck) {
          const a = gx(j);
          const b = mul(gk(j), I);
          const c = mul({ re: sys.wre[j], im: sys.wim[j] }, common);
          re[j] = a.re - b.re + c.re;
          im[j] = a.im - b.im + c.im;
        } else if (!sys.floating[sys.comp[j]]) {
          re[j] = (s === 1 ? p.vpre[j] : 0) + (x ? x.re[j] : 0);
          im[j] = x ? x.im[j] : 0;
        } else if (s === 1) re[j] = p.vpre[j];
      }
    } else {
      for (let j = 0; j < n; j++) {
        const c = sys.comp[j];
        if (sys.floating[c]) {
          if (s === 1) re[j] = p.vpre[j];
          continue;
        }
        let vr = (s === 1 ? p.vpre[j] : 0) + (x ? x.re[j] : 0);
        let vi = x ? x.im[j] : 0;
        if (c === ck) {
          vr -= zk.re[j] * I.re - zk.im[j] * I.im;
          vi -= zk.re[j] * I.im + zk.im[j] * I.re;
        }
        re[j] = vr;
        im[j] = vi;
      }
    }
    for (let j = 0; j < n; j++) {
      if (!p.live[j]) {
        re[j] = 0;
        im[j] = 0;
      }
    }
    v.push({ re, im });
  }
  const zkk = [0, 1, 2].map((s) => (views[s].floating ? null : (views[s] as { z: Cx }).z)) as [Cx | null, Cx | null, Cx | null];
  return { v: v as [ComplexVec, ComplexVec, ComplexVec], i: fp.i, consistent: fp.consistent, zkk };
}
