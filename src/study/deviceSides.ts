// Which side of its location each device protects. The side holding the scenario's reference sources
// (grid feeders; when islanded, generators and grid-forming inverters) is upstream; the device protects
// the other side. A feeder device protects its element side; an incomer looking into its transformer
// protects its bus side. Where both or neither side reaches a reference source (rings, dead sections)
// the device counts as protecting both sides.
import { elementNode, reachable, type ScenarioNetwork } from "./scenarioNetwork.ts";

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

function sideOf(net: ScenarioNetwork, edgeIndex: number, refNodes: string[], withSwitches: boolean): ProtectedSide | "neither" {
  const edge = net.edges[edgeIndex];
  const cut = new Set([edgeIndex]);
  if (!withSwitches) for (const e of net.edges) if (net.elements.get(e.element)?.kind === "switch") cut.add(e.index);
  if (net.elements.get(edge.element)?.kind === "switch" && !withSwitches) return "neither";
  const fromElement = reachable(net, edge.elementKey, cut);
  if (fromElement.has(edge.busKey)) return "both";
  const fromBus = reachable(net, edge.busKey, cut);
  const elementUp = refNodes.some((n) => fromElement.has(n));
  const busUp = refNodes.some((n) => fromBus.has(n));
  if (!elementUp && !busUp) return "neither";
  return elementUp && !busUp ? "bus" : busUp && !elementUp ? "element" : "both";
}

export function deviceSides(net: ScenarioNetwork): Map<string, ProtectedSide> {
  const refNodes = referenceSources(net).map(elementNode);
  const byEdge = new Map<number, ProtectedSide>();
  const sides = new Map<string, ProtectedSide>();
  for (const [device, i] of net.deviceEdge) {
    let side = byEdge.get(i);
    if (!side) {
      let s = sideOf(net, i, refNodes, false);
      if (s === "neither") s = sideOf(net, i, refNodes, true);
      side = s === "neither" ? "both" : s;
      byEdge.set(i, side);
    }
    sides.set(device, side);
  }
  return sides;
}
