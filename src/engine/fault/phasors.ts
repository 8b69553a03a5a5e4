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

const S3 = Math.sqrt(3) / 2;
const RAD = 180 / Math.PI;
function phasor(re: number, im: number, scale: number): Phasor {
  const mag = Math.hypot(re, im) * scale;
  return { mag, ang_deg: mag > 0 ? Math.atan2(im, re) * RAD : 0 };
}

/**
 * Sequence triple -> shifted sequence phasors and phase phasors in one pass, without intermediate objects
 * (the hot path of building a fault result with thousands of branch ends).
 */
export function seqAndPhasePhasors(s: [Cx, Cx, Cx], shift_deg: number, scale: number): { seq: [Phasor, Phasor, Phasor]; phase: [Phasor, Phasor, Phasor] } {
  return seqAndPhaseParts(s[0].re, s[0].im, s[1].re, s[1].im, s[2].re, s[2].im, shift_deg, scale);
}

/** The same from the six real parts of [zero, positive, negative]. */
export function seqAndPhaseParts(
  z0r: number,
  z0i: number,
  s1r: number,
  s1i: number,
  s2r: number,
  s2i: number,
  shift_deg: number,
  scale: number,
): { seq: [Phasor, Phasor, Phasor]; phase: [Phasor, Phasor, Phasor] } {
  const r = (shift_deg * Math.PI) / 180;
  const c = Math.cos(r);
  const sn = Math.sin(r);
  const p1r = s1r * c - s1i * sn;
  const p1i = s1r * sn + s1i * c;
  const n2r = s2r * c + s2i * sn;
  const n2i = -s2r * sn + s2i * c;
  // a = -1/2 + j sqrt3/2; a^2 = -1/2 - j sqrt3/2
  const a2p1r = -0.5 * p1r + S3 * p1i;
  const a2p1i = -0.5 * p1i - S3 * p1r;
  const ap1r = -0.5 * p1r - S3 * p1i;
  const ap1i = -0.5 * p1i + S3 * p1r;
  const an2r = -0.5 * n2r - S3 * n2i;
  const an2i = -0.5 * n2i + S3 * n2r;
  const a2n2r = -0.5 * n2r + S3 * n2i;
  const a2n2i = -0.5 * n2i - S3 * n2r;
  return {
    seq: [phasor(z0r, z0i, scale), phasor(p1r, p1i, scale), phasor(n2r, n2i, scale)],
    phase: [
      phasor(z0r + p1r + n2r, z0i + p1i + n2i, scale),
      phasor(z0r + a2p1r + an2r, z0i + a2p1i + an2i, scale),
      phasor(z0r + ap1r + a2n2r, z0i + ap1i + a2n2i, scale),
    ],
  };
}
