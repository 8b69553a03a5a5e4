// Time of a polyline characteristic at a given current, interpolated in log-log space
// (a straight segment on the plot), for the pointer read-out.
import type { CurvePoint } from "./tccTypes.ts";

/** Time in s of the curve at `current_A`, or null outside the curve's current range (no operation
 * below pickup; no sample beyond the last point). On a vertical step (a definite-time or
 * instantaneous element) the curve operates on the faster side, so the smallest time wins. */
export function curveTimeAt(points: readonly CurvePoint[], current_A: number): number | null {
  if (!(current_A > 0)) return null;
  let best: number | null = null;
  const li = Math.log(current_A);
  for (let k = 0; k + 1 < points.length; k++) {
    const [i0, t0] = points[k];
    const [i1, t1] = points[k + 1];
    const lo = Math.min(i0, i1);
    const hi = Math.max(i0, i1);
    if (current_A < lo || current_A > hi) continue;
    let t: number;
    if (i0 === i1) t = Math.min(t0, t1);
    else {
      const f = (li - Math.log(i0)) / (Math.log(i1) - Math.log(i0));
      t = Math.exp(Math.log(t0) + f * (Math.log(t1) - Math.log(t0)));
    }
    if (best === null || t < best) best = t;
  }
  if (best === null && points.length === 1 && points[0][0] === current_A) best = points[0][1];
  return best;
}
