// A fault part-way along a line: a copy of the model with a temporary node at pct percent from the line's
// fromBus, the line replaced by its two halves (each keeps the line's id and reports its outer end only).
import type { Model } from "./model.ts";
import { inv, scale } from "../complex.ts";
import { openedBranch } from "./openEnds.ts";

export function splitLine(model: Model, lineId: string, pct: number): { model: Model; node: number } | null {
  const idx = model.branches.findIndex((b) => b.element === lineId && b.kind === "line");
  if (idx < 0) return null;
  const b = model.branches[idx];
  if (!b.line) return null;
  const f = pct / 100;
  const node = model.nodes.length;
  const from = model.nodes[b.from];
  // The point belongs where a closed half connects it: a line opened at its from end hangs on its to end, and a
  // point between two opened ends is dead (island -1, no source).
  const opened = b.open ?? [];
  const side = opened.includes("from") ? model.nodes[b.to] : from;
  const island = opened.includes("from") && opened.includes("to") ? -1 : side.island;
  const nodes = [...model.nodes, { buses: [], un_kV: from.un_kV, shift_deg: side.shift_deg, island }];
  const z = b.line.z;
  const part = (k: number, a: number, c: number, ends: ("from" | "to")[]) => {
    const half = {
      ...b,
      from: a,
      to: c,
      y: [inv(scale(z[0], k)), inv(scale(z[1], k)), inv(scale(z[2], k))] as typeof b.y,
      z1: scale(z[1], k),
      line: { z: [scale(z[0], k), scale(z[1], k), scale(z[2], k)] as typeof z },
      reportEnds: ends,
      open: undefined,
    };
    // An opened end stays open on the half that carries it.
    const open = (b.open ?? []).filter((e) => ends.includes(e));
    return open.length ? openedBranch(half, open) : half;
  };
  const branches = [...model.branches];
  branches.splice(idx, 1, part(f, b.from, node, ["from"]), part(1 - f, node, b.to, ["to"]));
  return { model: { ...model, nodes, branches }, node };
}
