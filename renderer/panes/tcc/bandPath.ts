// Curves and tolerance bands to SVG path data, given the plot's scales.
import type { CurvePoint } from "./tccTypes.ts";

export type ScaleFn = (v: number) => number;

/** Only points a log plot can show: both coordinates finite and positive. */
export function plottable(points: readonly CurvePoint[]): CurvePoint[] {
  return points.filter(([i, t]) => Number.isFinite(i) && Number.isFinite(t) && i > 0 && t > 0);
}

/** Open polyline "M x,y L x,y ..." ("" with fewer than two points). */
export function linePath(points: readonly CurvePoint[], x: ScaleFn, y: ScaleFn): string {
  const p = plottable(points);
  if (p.length < 2) return "";
  return p.map(([i, t], k) => `${k === 0 ? "M" : "L"}${fmt(x(i))},${fmt(y(t))}`).join("");
}

/** Closed area between the fast edge `min` and the slow edge `max`: along min with rising current,
 * back along max with falling current. "" when either edge has fewer than two points. */
export function bandPath(min: readonly CurvePoint[], max: readonly CurvePoint[], x: ScaleFn, y: ScaleFn): string {
  const a = plottable(min);
  const b = plottable(max);
  if (a.length < 2 || b.length < 2) return "";
  const ring = [...a, ...b.slice().reverse()];
  return ring.map(([i, t], k) => `${k === 0 ? "M" : "L"}${fmt(x(i))},${fmt(y(t))}`).join("") + "Z";
}

/** Screen-space copy of a polyline (for hit-testing). */
export function toScreen(points: readonly CurvePoint[], x: ScaleFn, y: ScaleFn): [number, number][] {
  return plottable(points).map(([i, t]) => [x(i), y(t)]);
}

function fmt(v: number): string {
  // Two decimals are finer than a 4K pixel and keep the path short; clamp absurd values
  // (a curve running to 1e9 s near pickup) so the browser never sees an overflow.
  const c = Math.max(-1e6, Math.min(1e6, v));
  return (Math.round(c * 100) / 100).toString();
}

/** Closed area above a withstand curve (the side where the equipment is damaged): along the curve,
 * then straight up to the screen row `top_px` and back. "" with fewer than two points. */
export function regionAbovePath(points: readonly CurvePoint[], x: ScaleFn, y: ScaleFn, top_px: number): string {
  const p = plottable(points);
  if (p.length < 2) return "";
  const line = p.map(([i, t], k) => `${k === 0 ? "M" : "L"}${fmt(x(i))},${fmt(y(t))}`).join("");
  return `${line}L${fmt(x(p[p.length - 1][0]))},${fmt(top_px)}L${fmt(x(p[0][0]))},${fmt(top_px)}Z`;
}
