// Islands of the positive-sequence network and each node's vector-group phase shift relative to its island's
// first node. A loop whose transformers disagree on the shift cannot be solved in sequence components.
import type { EngineMessage } from "../types.ts";
import type { Model } from "./model.ts";

export function assignIslands(model: Model): EngineMessage[] {
  const n = model.nodes.length;
  const adj: { to: number; shift: number; label: string; element: string }[][] = Array.from({ length: n }, () => []);
  for (const b of model.branches) {
    if (b.open) continue; // an opened branch connects nothing
    adj[b.from].push({ to: b.to, shift: b.shift_deg, label: b.label, element: b.element });
    adj[b.to].push({ to: b.from, shift: -b.shift_deg, label: b.label, element: b.element });
  }
  const errors: EngineMessage[] = [];
  const seen = new Uint8Array(n);
  let island = 0;
  for (let s = 0; s < n; s++) {
    if (seen[s]) continue;
    seen[s] = 1;
    model.nodes[s].island = island;
    model.nodes[s].shift_deg = 0;
    const stack = [s];
    while (stack.length) {
      const u = stack.pop() as number;
      for (const e of adj[u]) {
        const want = model.nodes[u].shift_deg + e.shift;
        if (!seen[e.to]) {
          seen[e.to] = 1;
          model.nodes[e.to].island = island;
          model.nodes[e.to].shift_deg = want;
          stack.push(e.to);
        } else {
          const d = (((want - model.nodes[e.to].shift_deg) % 360) + 540) % 360 - 180;
          if (Math.abs(d) > 1e-6) {
            errors.push({ level: "error", code: "phase-shift-loop", text: `${e.label}: closes a loop whose transformers have different vector-group phase shifts`, element: e.element });
          }
        }
      }
    }
    island++;
  }
  model.islandLive = new Array(island).fill(false);
  for (const sh of model.shunts) if (sh.kind !== "motor" && !sh.open) model.islandLive[model.nodes[sh.node].island] = true;
  for (const u of model.inverters) model.islandLive[model.nodes[u.node].island] = true;
  return errors.slice(0, 1);
}
