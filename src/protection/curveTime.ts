// Operating time of one standard characteristic at a current multiple M = I / Is.
import type { CurveName } from "../model/schema.ts";
import { CURVE_CONSTANTS } from "./curveConstants.ts";

/**
 * Operating time in s of `curve` at multiple `m` of pickup, before tMin/tMax limits.
 * Infinity when m <= 1 (no pickup). `multiplier` is the IEC TMS or the IEEE TD;
 * `delay_s` is used only by the definite-time curve.
 */
export function curveTime(curve: CurveName, m: number, multiplier: number, delay_s: number): number {
  if (!(m > 1)) return Infinity;
  if (curve === "definite-time") return delay_s;
  const c = CURVE_CONSTANTS[curve];
  if (c.family === "iec") return (multiplier * c.k) / (Math.pow(m, c.a) - 1);
  return multiplier * (c.A / (Math.pow(m, c.p) - 1) + c.B);
}

/**
 * IEEE C37.112 reset time in s (time to reset from full travel) at a multiple m < 1; Infinity at m >= 1.
 * Only IEEE curves have published reset constants; other curves return 0 (instantaneous reset).
 */
export function curveResetTime(curve: CurveName, m: number, multiplier: number): number {
  if (curve === "definite-time") return 0;
  const c = CURVE_CONSTANTS[curve];
  if (c.family !== "ieee") return 0;
  if (m >= 1) return Infinity;
  return (multiplier * c.tr) / (1 - m * m);
}

/**
 * The inverse of curveTime: the multiple M at which the curve gives time t_s (before limits).
 * Infinity when the curve never gets that fast (IEEE: t <= TD * B), NaN for definite time.
 */
export function curveMultipleForTime(curve: CurveName, t_s: number, multiplier: number): number {
  if (curve === "definite-time") return NaN;
  const c = CURVE_CONSTANTS[curve];
  if (!(t_s > 0)) return Infinity;
  if (c.family === "iec") return Math.pow((multiplier * c.k) / t_s + 1, 1 / c.a);
  const rest = t_s / multiplier - c.B;
  if (!(rest > 0)) return Infinity;
  return Math.pow(c.A / rest + 1, 1 / c.p);
}

/** The multiplier (TMS or TD) that makes the curve pass through time t_s at multiple m (for dragging a curve). */
export function curveMultiplierForPoint(curve: CurveName, m: number, t_s: number): number {
  if (curve === "definite-time" || !(m > 1)) return NaN;
  const unit = curveTime(curve, m, 1, 0);
  return t_s / unit;
}
