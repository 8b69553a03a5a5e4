// Which curve is under the pointer: nearest nominal line in screen pixels, or inside a band.

export type ScreenPolyline = readonly (readonly [number, number])[];

export interface HitTarget {
  /** Index into the caller's list of curves. */
  index: number;
  nominal: ScreenPolyline;
  /** Closed band outline (fast edge then slow edge reversed); may be empty. */
  band: ScreenPolyline;
}

/** Distance in px from point (px, py) to segment (ax, ay)-(bx, by). */
export function distanceToSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  const u = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / len2));
  return Math.hypot(px - (ax + u * dx), py - (ay + u * dy));
}

/** Distance in px from a point to a polyline (Infinity when empty). */
export function distanceToPolyline(px: number, py: number, line: ScreenPolyline): number {
  if (line.length === 1) return Math.hypot(px - line[0][0], py - line[0][1]);
  let best = Infinity;
  for (let k = 0; k + 1 < line.length; k++) {
    best = Math.min(best, distanceToSegment(px, py, line[k][0], line[k][1], line[k + 1][0], line[k + 1][1]));
  }
  return best;
}

/** Even-odd point-in-polygon test (ray casting). */
export function insidePolygon(px: number, py: number, ring: ScreenPolyline): boolean {
  let inside = false;
  for (let k = 0, j = ring.length - 1; k < ring.length; j = k++) {
    const [xk, yk] = ring[k];
    const [xj, yj] = ring[j];
    if (yk > py !== yj > py && px < ((xj - xk) * (py - yk)) / (yj - yk) + xk) inside = !inside;
  }
  return inside;
}

/** The target under the pointer: the nearest nominal line within `tolerance_px`, else the last-drawn (topmost)
 * band that contains the point; a nominal line always wins over a band so thin lines stay grabbable. */
export function hitTest(px: number, py: number, targets: readonly HitTarget[], tolerance_px = 6): number | null {
  let best: number | null = null;
  let bestD = tolerance_px;
  for (const t of targets) {
    const d = distanceToPolyline(px, py, t.nominal);
    if (d <= bestD) {
      bestD = d;
      best = t.index;
    }
  }
  if (best !== null) return best;
  for (let k = targets.length - 1; k >= 0; k--) {
    const t = targets[k];
    if (t.band.length >= 3 && insidePolygon(px, py, t.band)) return t.index;
  }
  return null;
}
