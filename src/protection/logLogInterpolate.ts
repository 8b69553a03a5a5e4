// Time at a current on a point-table curve, interpolated on log-log axes.
import type { CurvePoint } from "./types.ts";

/**
 * Points are [A, s], current increasing and time strictly decreasing (checked by checkDeviceSettings).
 * Below the first current: Infinity (does not operate). Between points: straight line on log-log axes.
 * Above the last current: constant I^2 t from the last point (adiabatic extension), stated as a project choice.
 */
export function logLogInterpolate(points: readonly CurvePoint[], current_A: number): number {
  const n = points.length;
  if (n === 0 || !(current_A >= points[0][0])) return Infinity;
  const [iLast, tLast] = points[n - 1];
  if (current_A >= iLast) return tLast * (iLast / current_A) ** 2;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid][0] <= current_A) lo = mid;
    else hi = mid;
  }
  const [i1, t1] = points[lo];
  const [i2, t2] = points[hi];
  if (current_A === i1) return t1;
  const f = Math.log(current_A / i1) / Math.log(i2 / i1);
  return Math.exp(Math.log(t1) + f * Math.log(t2 / t1));
}

/** Current at which a point-table curve takes t_s (inverse of logLogInterpolate); Infinity when faster than the table reaches. */
export function logLogCurrentForTime(points: readonly CurvePoint[], t_s: number): number {
  const n = points.length;
  if (n === 0 || !(t_s > 0)) return Infinity;
  if (t_s >= points[0][1]) return points[0][0];
  const [iLast, tLast] = points[n - 1];
  if (t_s <= tLast) return iLast * Math.sqrt(tLast / t_s);
  for (let k = 0; k < n - 1; k++) {
    const [i1, t1] = points[k];
    const [i2, t2] = points[k + 1];
    if (t_s <= t1 && t_s >= t2) {
      const f = Math.log(t_s / t1) / Math.log(t2 / t1);
      // clamp: rounding must not put the answer outside its segment (below the first point reads "no operation")
      return Math.min(i2, Math.max(i1, Math.exp(Math.log(i1) + f * Math.log(i2 / i1))));
    }
  }
  return Infinity;
}
