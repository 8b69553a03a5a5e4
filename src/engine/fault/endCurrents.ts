// Sequence currents at branch ends and shunt terminals from the node voltages of a fault solution, in per unit of
// each end's node base and in the unshifted frame. Superposition on the no-load prefault state: prefault currents
// are zero, so currents follow from the voltage change (V - vpre in positive sequence, V otherwise).
import type { BranchStamp, Cx, InverterUnit, Model, ShuntStamp } from "../network/model.ts";
import type { Variant } from "../network/sequenceSystem.ts";
import type { ComplexVec } from "./solveLinearFault.ts";

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
  return { branchEnds, shunts };
}
