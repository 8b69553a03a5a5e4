// Fault-point conditions in symmetrical components, given each sequence network seen from the fault node either as
// a Thevenin source (E, Z) or, for a floating part (no shunt path), as a Norton current J with zero admittance.
// Currents I[s] are drawn from the network into the fault; V[s] are the sequence voltages at the fault node.
// Fault impedance zf: 3ph in each phase; LG phase a to earth; LL between b and c; LLG b and c joined, zf to earth.
import type { Cx } from "../network/model.ts";
import type { FaultType } from "../types.ts";
import { add, div, mul, scale, sub, ZERO, abs } from "../complex.ts";

export type SeqView = { floating: false; e: Cx; z: Cx } | { floating: true; j: Cx };

export interface FaultPoint {
  i: [Cx, Cx, Cx];
  v: [Cx, Cx, Cx];
  /** False when floating parts leave the fault undetermined (current sources with nowhere to go). */
  consistent: boolean;
}

const TINY = 1e-12;
const vOf = (view: SeqView, i: Cx): Cx => (view.floating ? ZERO : sub(view.e, mul(view.z, i)));

/** Series connection of sequences `order` with signs, total extra impedance zs: I flows through all. */
function series(views: SeqView[], order: number[], signs: number[], zs: Cx): { i: Cx; ok: boolean; floatingIdx: number } {
  const fl = order.filter((s) => views[s].floating);
  if (fl.length === 0) {
    let e = ZERO;
    let z = zs;
    order.forEach((s, k) => {
      const v = views[s] as { e: Cx; z: Cx };
      e = add(e, scale(v.e, signs[k]));
      z = add(z, v.z);
    });
    return { i: div(e, z), ok: true, floatingIdx: -1 };
  }
  if (fl.length === 1) {
    const s = fl[0];
    const k = order.indexOf(s);
    return { i: scale((views[s] as { j: Cx }).j, signs[k]), ok: true, floatingIdx: s };
  }
  const allZero = fl.every((s) => abs((views[s] as { j: Cx }).j) < TINY);
  return { i: ZERO, ok: allZero, floatingIdx: -2 };
}

export function faultEquations(type: FaultType, views: [SeqView, SeqView, SeqView], zf: Cx): FaultPoint {
  const I: [Cx, Cx, Cx] = [ZERO, ZERO, ZERO];
  const V: [Cx, Cx, Cx] = [ZERO, ZERO, ZERO];
  let consistent = true;
  switch (type) {
    case "3ph": {
      for (const s of [1, 2]) {
        const v = views[s];
        I[s] = v.floating ? v.j : div(v.e, add(v.z, zf));
        V[s] = mul(zf, I[s]);
      }
      V[0] = vOf(views[0], ZERO);
      break;
    }
    case "LG": {
      const r = series(views, [0, 1, 2], [1, 1, 1], scale(zf, 3));
      consistent = r.ok;
      I[0] = I[1] = I[2] = r.i;
      for (const s of [0, 1, 2]) V[s] = vOf(views[s], r.i);
      if (r.floatingIdx >= 0) {
        const others = [0, 1, 2].filter((s) => s !== r.floatingIdx);
        V[r.floatingIdx] = sub(scale(mul(zf, r.i), 3), add(V[others[0]], V[others[1]]));
      }
      break;
    }
    case "LL": {
      const r = series(views, [1, 2], [1, -1], zf);
      consistent = r.ok;
      I[1] = r.i;
      I[2] = scale(r.i, -1);
      V[1] = vOf(views[1], I[1]);
      V[2] = vOf(views[2], I[2]);
      if (r.floatingIdx === 1) V[1] = add(V[2], mul(zf, r.i));
      if (r.floatingIdx === 2) V[2] = sub(V[1], mul(zf, r.i));
      V[0] = vOf(views[0], ZERO);
      break;
    }
    case "LLG": {
      // Norton form: V1 = V2 = V, V0 = V + 3 zf I0, I0 + I1 + I2 = 0.
      const yj = (s: number): { y: Cx; j: Cx } => {
        const v = views[s];
        return v.floating ? { y: ZERO, j: v.j } : { y: div({ re: 1, im: 0 }, v.z), j: div(v.e, v.z) };
      };
      const a0 = yj(0);
      const a1 = yj(1);
      const a2 = yj(2);
      const k0 = div({ re: 1, im: 0 }, add({ re: 1, im: 0 }, scale(mul(zf, a0.y), 3)));
      const num = add(add(a1.j, a2.j), mul(a0.j, k0));
      const den = add(add(a1.y, a2.y), mul(a0.y, k0));
      if (abs(den) < TINY) {
        consistent = abs(num) < TINY;
        break;
      }
      const v = div(num, den);
      I[1] = sub(a1.j, mul(a1.y, v));
      I[2] = sub(a2.j, mul(a2.y, v));
      I[0] = mul(sub(a0.j, mul(a0.y, v)), k0);
      V[1] = v;
      V[2] = v;
      V[0] = add(v, scale(mul(zf, I[0]), 3));
      break;
    }
  }
  return { i: I, v: V, consistent };
}
