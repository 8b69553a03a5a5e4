// A fault part-way along a line: a copy of the model with a temporary node at pct percent from the line's
// fromBus, the line replaced by its two halves (each keeps the line's id and reports its outer end only).
import type { Model } from "./model.ts";
import { inv, scale } from "../complex.ts";

export function splitLine(model: Model, lineId: string, pct: number): { model: Model; node: number } | null {
  const idx = model.branches.findIndex((b) => b.element === lineId && b.kind === "line");
  if (idx < 0) return null;
  const b = model.branches[idx];
  if (!b.line) return null;
  const f = pct / 100;
  const node = model.nodes.length;
  const from = model.nodes[b.from];
  const nodes = [...model.nodes, { buses: [], un_kV: from.un_kV, shift_deg: from.shift_deg, island: from.island }];
  const z = b.line.z;
  const part = (k: number, a: number, c: number, ends: ("from" | "to")[]) => ({
    ...b,
    from: a,
    to: c,
    y: [inv(scale(z[0], k)), inv(scale(z[1], k)), inv(scale(z[2], k))] as typeof b.y,
    z1: scale(z[1], k),
    line: { z: [scale(z[0], k), scale(z[1], k), scale(z[2], k)] as typeof z },
    reportEnds: ends,
  });
  const branches = [...model.branches];
  branches.splice(idx, 1, part(f, b.from, node, ["from"]), part(1 - f, node, b.to, ["to"]));
  return { model: { ...model, nodes, branches }, node };
}
