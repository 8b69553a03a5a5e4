// Sequence-to-phase transforms and phasor formatting.
import type { Cx } from "../network/model.ts";
import type { Phasor } from "../types.ts";

const A = { re: -0.5, im: Math.sqrt(3) / 2 };
const A2 = { re: -0.5, im: -Math.sqrt(3) / 2 };
const mul = (a: Cx, b: Cx): Cx => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });

/** [a, b, c] from [zero, positive, negative]. */
export function seqToPhase(s: [Cx, Cx, Cx]): [Cx, Cx, Cx] {
  const [i0, i1, i2] = s;
  const b1 = mul(A2, i1);
  const b2 = mul(A, i2);
  const c1 = mul(A, i1);
  const c2 = mul(A2, i2);
  return [
    { re: i0.re + i1.re + i2.re, im: i0.im + i1.im + i2.im },
    { re: i0.re + b1.re + b2.re, im: i0.im + b1.im + b2.im },
    { re: i0.re + c1.re + c2.re, im: i0.im + c1.im + c2.im },
  ];
}

export function toPhasor(z: Cx, scale = 1): Phasor {
  const mag = Math.hypot(z.re, z.im) * scale;
  return { mag, ang_deg: mag > 0 ? (Math.atan2(z.im, z.re) * 180) / Math.PI : 0 };
}

/** Rotates sequence quantities by a node's phase shift: positive by +shift, negative by -shift, zero unchanged. */
export function shiftSeq(s: [Cx, Cx, Cx], shift_deg: number): [Cx, Cx, Cx] {
  if (shift_deg === 0) return s;
  const r = (shift_deg * Math.PI) / 180;
  const p = { re: Math.cos(r), im: Math.sin(r) };
  const q = { re: p.re, im: -p.im };
  return [s[0], mul(s[1], p), mul(s[2], q)];
}
