// Minimal complex arithmetic on plain {re, im} objects.
import type { Phasor } from "./types.ts";

export const phasor = (re: number, im = 0): Phasor => ({ re, im });
export const add = (a: Phasor, b: Phasor): Phasor => ({ re: a.re + b.re, im: a.im + b.im });
export const mul = (a: Phasor, b: Phasor): Phasor => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const scale = (a: Phasor, k: number): Phasor => ({ re: a.re * k, im: a.im * k });
export const abs = (a: Phasor): number => Math.hypot(a.re, a.im);
export const arg_deg = (a: Phasor): number => (Math.atan2(a.im, a.re) * 180) / Math.PI;
export const polar = (mag: number, angle_deg: number): Phasor => ({
  re: mag * Math.cos((angle_deg * Math.PI) / 180),
  im: mag * Math.sin((angle_deg * Math.PI) / 180),
});
/** The operator a = 1 at 120 degrees. */
export const A_OP: Phasor = polar(1, 120);
export const A2_OP: Phasor = polar(1, 240);
