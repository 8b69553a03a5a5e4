// Which side of its location each device protects. The side holding the scenario's reference sources
// (grid feeders; when islanded, generators and grid-forming inverters) is upstream; the device protects
// the other side. A feeder device protects its element side; an incomer looking into its transformer
// protects its bus side. Where both or neither side reaches a reference source (rings, dead sections)
// the device counts as protecting both sides.
import { elementNode, busNode, reachable, type ScenarioNetwork } from "./scenarioNetwork.ts";

export type ProtectedSide = "element" | "bus" | "both";

/** Sources that set the upstream direction in this scenario. */
export function referenceSources(net: ScenarioNetwork): string[] {
  const grids = net.sources.filter((s) => net.elements.get(s)?.kind === "grid");
  if (grids.length > 0) return grids;
  const forming = net.sources.filter((s) => {
    const e = net.elements.get(s);
    return e?.kind === "generator" || (e?.kind === "inverter" && e.control === "grid-forming");
  });
  return forming.length > 0 ? forming : net.sources;
}

export function deviceSides(net: ScenarioNetwork): Map<string, ProtectedSide> {
  const refNodes = referenceSources(net).map(elementNode);
  const byEdge = new Map<number, ProtectedSide>();
  const sides = new Map<string, ProtectedSide>();
  for (const [device, i] of net.deviceEdge) {
    let side = byEdge.get(i);
    if (!side) {
      const edge = net.edges[i];
      const cut = new Set([i]);
      const fromElement = reachable(net, elementNode(edge.element), cut);
      if (fromElement.has(busNode(edge.bus))) side = "both";
      else {
        const fromBus = reachable(net, busNode(edge.bus), cut);
        const elementUp = refNodes.some((n) => fromElement.has(n));
        const busUp = refNodes.some((n) => fromBus.has(n));
        side = elementUp && !busUp ? "bus" : busUp && !elementUp ? "element" : "both";
      }
      byEdge.set(i, side);
    }
    sides.set(device, side);
  }
  return sides;
}
