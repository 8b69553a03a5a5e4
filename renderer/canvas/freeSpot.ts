// Where a new part goes: the nearest spot to the wanted one (near the selection, the view's centre
// or the drop point) where its box overlaps no other part's box. Layout positions are centres.
import { ownValue } from "../../src/model/ownValue.ts";
import type { Project } from "../../src/model/schema.ts";
import { isProtectiveDevice } from "../../src/model/schema.ts";
import { isHorizontal, nodeSize } from "./toFlow.ts";

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Clear space kept around a new part, in flow units. */
const GAP = 16;
/** A part's name and rating are written to its right: that room is kept free too. */
const CAPTION_W = 90;
const STEP = 20;
const MAX_RINGS = 60;

/** The box a part needs: its symbol, and its caption to the right (buses carry their name above the bar, inside their box). */
function withCaption(b: Box, isBus: boolean): Box {
  return isBus ? b : { x: b.x + CAPTION_W / 2, y: b.y, w: b.w + CAPTION_W, h: b.h };
}

function overlaps(a: Box, b: Box): boolean {
  return Math.abs(a.x - b.x) * 2 < a.w + b.w + 2 * GAP && Math.abs(a.y - b.y) * 2 < a.h + b.h + 2 * GAP;
}

/** The boxes of the drawn parts (devices are drawn inside their element). */
export function occupiedBoxes(doc: Project): Box[] {
  const out: Box[] = [];
  for (const e of doc.elements) {
    if (isProtectiveDevice(e)) continue;
    const p = ownValue(doc.layout, e.id);
    if (!p) continue;
    const s = nodeSize(e, p.w, isHorizontal(e, doc.layout));
    out.push(withCaption({ x: p.x, y: p.y, w: s.w, h: s.h }, e.kind === "bus"));
  }
  return out;
}

/** The free centre nearest `want` for a part of size w x h, on the grid step, searched ring by ring. */
export function freeSpot(doc: Project, want: { x: number; y: number }, size: { w: number; h: number }, grid = 10, isBus = false): { x: number; y: number } {
  const taken = occupiedBoxes(doc);
  const snap = (v: number) => Math.round(v / grid) * grid;
  const fits = (x: number, y: number) => !taken.some((b) => overlaps(withCaption({ x, y, w: size.w, h: size.h }, isBus), b));
  const x0 = snap(want.x);
  const y0 = snap(want.y);
  if (fits(x0, y0)) return { x: x0, y: y0 };
  for (let ring = 1; ring <= MAX_RINGS; ring++) {
    let best: { x: number; y: number; d: number } | null = null;
    for (let i = -ring; i <= ring; i++) {
      for (const [dx, dy] of [
        [i, -ring],
        [i, ring],
        [-ring, i],
        [ring, i],
      ]) {
        const x = snap(x0 + dx * STEP);
        const y = snap(y0 + dy * STEP);
        const d = Math.hypot(x - x0, y - y0);
        if ((!best || d < best.d) && fits(x, y)) best = { x, y, d };
      }
    }
    if (best) return { x: best.x, y: best.y };
  }
  return { x: x0, y: y0 };
}
