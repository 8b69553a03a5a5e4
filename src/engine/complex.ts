// Small complex helpers for the non-hot paths (hot loops use separate re/im typed arrays).
import type { Cx } from "./network/model.ts";

export const cx = (re: number, im = 0): Cx => ({ re, im });
export const ZERO: Cx = { re: 0, im: 0 };
export const add = (a: Cx, b: Cx): Cx => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: Cx, b: Cx): Cx => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: Cx, b: Cx): Cx => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const scale = (a: Cx, k: number): Cx => ({ re: a.re * k, im: a.im * k });
export const abs = (a: Cx): number => Math.hypot(a.re, a.im);
export const arg = (a: Cx): number => Math.atan2(a.im, a.re);
export const polar = (mag: number, ang_rad: number): Cx => ({ re: mag * Math.cos(ang_rad), im: mag * Math.sin(ang_rad) });
export function div(a: Cx, b: Cx): Cx {
  const m = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / m, im: (a.im * b.re - a.re * b.im) / m };
}
export const inv = (a: Cx): Cx => div({ re: 1, im: 0 }, a);
/** Impedance from magnitude and R/X ratio. */
export function zFromRx(zMag: number, rx: number): Cx {
  const x = zMag / Math.sqrt(1 + rx * rx);
  return { re: rx * x, im: x };
}
