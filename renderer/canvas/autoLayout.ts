// Automatic layout for networks without positions (imported or generated): a layered drawing,
// top to bottom, with elkjs. Buses and elements are nodes; ties are edges from element to bus,
// reversed for the upstream terminal so sources sit above their bus and loads below.
import { isProtectiveDevice, type Layout, type Project } from "../../src/model/schema.ts";
import { nodeSize, terminalFields, DEFAULT_BUS_WIDTH } from "./toFlow.ts";

export async function autoLayout(doc: Project): Promise<Layout> {
  // elkjs is large: loaded only when a layout is needed
  const { default: ELK } = await import("elkjs/lib/elk.bundled.js");
  const elk = new ELK();
  const ids = new Set(doc.elements.map((e) => e.id));
  const children: { id: string; width: number; height: number }[] = [];
  const edges: { id: string; sources: string[]; targets: string[] }[] = [];
  for (const e of doc.elements) {
    if (isProtectiveDevice(e)) continue;
    const size = nodeSize(e, e.kind === "bus" ? DEFAULT_BUS_WIDTH : undefined);
    // room to the left for device markers and to the right for captions
    children.push({ id: e.id, width: size.w + (e.kind === "bus" ? 0 : 90), height: size.h });
    const f = terminalFields(e);
    const rec = e as Record<string, unknown>;
    const a = f.a ? rec[f.a] : undefined;
    const b = f.b ? rec[f.b] : undefined;
    const upstreamIsA = e.kind !== "grid";
    if (typeof a === "string" && ids.has(a)) edges.push({ id: `${e.id}:a`, sources: upstreamIsA ? [a] : [e.id], targets: upstreamIsA ? [e.id] : [a] });
    if (typeof b === "string" && ids.has(b)) edges.push({ id: `${e.id}:b`, sources: [e.id], targets: [b] });
  }
  const graph = await elk.layout({
    id: "root",
    layoutOptions: {
      "elk.algorithm": "layered",
      "elk.direction": "DOWN",
      "elk.spacing.nodeNode": "40",
      "elk.layered.spacing.nodeNodeBetweenLayers": "50",
      "elk.layered.nodePlacement.strategy": "BRANDES_KOEPF",
    },
    children,
    edges,
  });
  const byId = new Map(doc.elements.map((e) => [e.id, e]));
  const layout: Layout = {};
  for (const c of graph.children ?? []) {
    const e = byId.get(c.id);
    // elk gives top-left corners; the document keeps centres (element boxes include caption room)
    const offset = e && e.kind !== "bus" ? 45 : 0;
    const size = e ? nodeSize(e, e.kind === "bus" ? DEFAULT_BUS_WIDTH : undefined) : { w: 0, h: 0 };
    layout[c.id] = { x: Math.round((c.x ?? 0) + offset + size.w / 2), y: Math.round((c.y ?? 0) + size.h / 2) };
    if (e?.kind === "bus") layout[c.id].w = DEFAULT_BUS_WIDTH;
  }
  return layout;
}
