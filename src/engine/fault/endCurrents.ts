// Sequence currents at branch ends and shunt terminals from the node voltages of a fault solution, in per unit of
// each end's node base and in the unshifted frame. Superposition on the no-load prefault state: prefault currents
// are zero, so currents follow from the voltage change (V - vpre in positive sequence, V otherwise).
import type { BranchStamp, Cx, InverterUnit, Model, ShuntStamp } from "../network/model.ts";
import type { Variant } from "../network/sequenceSystem.ts";
import type { ComplexVec } from "./solveLinearFault.ts";
import type { EndCurrent } from "../types.ts";
import { seqAndPhaseParts } from "./phasors.ts";

export interface RawEnd {
  element: string;
  end: "from" | "to" | "terminal";
  node: number;
  bus: string;
  /** [zero, positive, negative], pu, from the bus into the element. */
  i: [Cx, Cx, Cx];
}

function dv(v: [ComplexVec, ComplexVec, ComplexVec], vpre: Float64Array, s: number, j: number): Cx {
  return { re: v[s].re[j] - (s === 1 ? vpre[j] : 0), im: v[s].im[j] };
}
const m = (a: Cx, b: Cx): Cx => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });

export function branchEndCurrents(b: BranchStamp, v: [ComplexVec, ComplexVec, ComplexVec], vpre: Float64Array): { from: [Cx, Cx, Cx]; to: [Cx, Cx, Cx] } {
  const from: Cx[] = [];
  const to: Cx[] = [];
  for (let s = 0; s < 3; s++) {
    const y = b.y[s];
    const a = dv(v, vpre, s, b.from);
    const c = dv(v, vpre, s, b.to);
    let f = { re: 0, im: 0 };
    let t = { re: 0, im: 0 };
    if (y) {
      const t2 = b.t * b.t;
      const ya = m(y, a);
      const yc = m(y, c);
      f = { re: ya.re / t2 - yc.re / b.t, im: ya.im / t2 - yc.im / b.t };
      t = { re: yc.re - ya.re / b.t, im: yc.im - ya.im / b.t };
    }
    if (s === 0 && b.y0From) {
      const q = m(b.y0From, a);
      f = { re: f.re + q.re, im: f.im + q.im };
    }
    if (s === 0 && b.y0To) {
      const q = m(b.y0To, c);
      t = { re: t.re + q.re, im: t.im + q.im };
    }
    from.push(f);
    to.push(t);
  }
  return { from: from as [Cx, Cx, Cx], to: to as [Cx, Cx, Cx] };
}

export function shuntCurrent(s: ShuntStamp, v: [ComplexVec, ComplexVec, ComplexVec], vpre: Float64Array): [Cx, Cx, Cx] {
  const out: Cx[] = [];
  for (let q = 0; q < 3; q++) {
    const y = s.y[q];
    out.push(y ? m(y, dv(v, vpre, q, s.node)) : { re: 0, im: 0 });
  }
  return out as [Cx, Cx, Cx];
}

/** Every branch end and shunt terminal; inverters combine their shunt (refined grid-forming) and injections. */
export function allEndCurrents(
  model: Model,
  variant: Variant,
  v: [ComplexVec, ComplexVec, ComplexVec],
  vpre: Float64Array,
  unitInj: Map<string, [Cx, Cx]>,
): { branchEnds: RawEnd[]; shunts: RawEnd[] } {
  const branchEnds: RawEnd[] = [];
  for (const b of model.branches) {
    const c = branchEndCurrents(b, v, vpre);
    const ends = b.reportEnds ?? ["from", "to"];
    if (ends.includes("from")) branchEnds.push({ element: b.element, end: "from", node: b.from, bus: b.fromBus, i: c.from });
    if (ends.includes("to")) branchEnds.push({ element: b.element, end: "to", node: b.to, bus: b.toBus, i: c.to });
  }
  const shunts = allShuntCurrents(model, variant, v, vpre, unitInj);
  return { branchEnds, shunts };
}

/** Every shunt terminal (the second half of allEndCurrents). */
export function allShuntCurrents(model: Model, variant: Variant, v: [ComplexVec, ComplexVec, ComplexVec], vpre: Float64Array, unitInj: Map<string, [Cx, Cx]>): RawEnd[] {
  const shunts: RawEnd[] = [];
  const inverterShunt = new Map<string, [Cx, Cx, Cx]>();
  for (const s of model.shunts) {
    if (s.refinedOnly) {
      if (variant === "refined") inverterShunt.set(s.element, shuntCurrent(s, v, vpre));
      continue;
    }
    shunts.push({ element: s.element, end: "terminal", node: s.node, bus: s.bus, i: shuntCurrent(s, v, vpre) });
  }
  for (const u of model.inverters as InverterUnit[]) {
    const base = inverterShunt.get(u.element) ?? [
      { re: 0, im: 0 },
      { re: 0, im: 0 },
      { re: 0, im: 0 },
    ];
    const inj = unitInj.get(u.element) ?? [
      { re: 0, im: 0 },
      { re: 0, im: 0 },
    ];
    shunts.push({
      element: u.element,
      end: "terminal",
      node: u.node,
      bus: u.bus,
      i: [base[0], { re: base[1].re - inj[0].re, im: base[1].im - inj[0].im }, { re: base[2].re - inj[1].re, im: base[2].im - inj[1].im }],
    });
  }
  return shunts;
}

/**
 * Every reported branch end's currents straight into result form (primary amperes, shifted to the faulted bus's
 * frame): the same operations as branchEndCurrents followed by seqAndPhasePhasors, without the intermediate objects
 * (a result on a large network has tens of thousands of branch ends). `shift_deg[node]` is the node's shift relative
 * to the faulted bus and `base_A[node]` its base current. `only`: when given, just the ends whose "element|end" (and
 * element) it holds.
 */
export function branchEndResults(
  model: Model,
  v: [ComplexVec, ComplexVec, ComplexVec],
  vpre: Float64Array,
  shift_deg: Float64Array,
  base_A: Float64Array,
  only?: ReadonlySet<string>,
): EndCurrent[] {
  const out: EndCurrent[] = [];
  const f = new Float64Array(6);
  const t = new Float64Array(6);
  for (const b of model.branches) {
    if (only && !only.has(b.element)) continue;
    const ends = b.reportEnds ?? ["from", "to"];
    const wantFrom = ends.includes("from") && (!only || only.has(`${b.element}|from`));
    const wantTo = ends.includes("to") && (!only || only.has(`${b.element}|to`));
    if (!wantFrom && !wantTo) continue;
    for (let s = 0; s < 3; s++) {
      const vr = v[s].re;
      const vi = v[s].im;
      const ar = vr[b.from] - (s === 1 ? vpre[b.from] : 0);
      const ai = vi[b.from];
      const cr = vr[b.to] - (s === 1 ? vpre[b.to] : 0);
      const ci = vi[b.to];
      let fr = 0;
      let fi = 0;
      let tr = 0;
      let ti = 0;
      const y = b.y[s];
      if (y) {
        const t2 = b.t * b.t;
        const yar = y.re * ar - y.im * ai;
        const yai = y.re * ai + y.im * ar;
        const ycr = y.re * cr - y.im * ci;
        const yci = y.re * ci + y.im * cr;
        fr = yar / t2 - ycr / b.t;
        fi = yai / t2 - yci / b.t;
        tr = ycr - yar / b.t;
        ti = yci - yai / b.t;
      }
      if (s === 0 && b.y0From) {
        const q = b.y0From;
        fr = fr + (q.re * ar - q.im * ai);
        fi = fi + (q.re * ai + q.im * ar);
      }
      if (s === 0 && b.y0To) {
        const q = b.y0To;
        tr = tr + (q.re * cr - q.im * ci);
        ti = ti + (q.re * ci + q.im * cr);
      }
      f[2 * s] = fr;
      f[2 * s + 1] = fi;
      t[2 * s] = tr;
      t[2 * s + 1] = ti;
    }
    if (wantFrom) {
      const p = seqAndPhaseParts(f[0], f[1], f[2], f[3], f[4], f[5], shift_deg[b.from], base_A[b.from]);
      out.push({ element: b.element, end: "from", bus: b.fromBus, seq_A: p.seq, phase_A: p.phase });
    }
    if (wantTo) {
      const p = seqAndPhaseParts(t[0], t[1], t[2], t[3], t[4], t[5], shift_deg[b.to], base_A[b.to]);
      out.push({ element: b.element, end: "to", bus: b.toBus, seq_A: p.seq, phase_A: p.phase });
    }
  }
  return out;
}
