// Source paths into a fault: for every in-service source, the route from the fault outward to it
// (breadth-first, so the shortest in element count when the network is meshed).
import type { FaultLocation } from "./types.ts";
import { across, busNode, elementNode, type ScenarioNetwork } from "./scenarioNetwork.ts";

/** One step outward from the fault across an element end. */
export interface PathStep {
  edge: number;
  /** Which side of this edge the fault lies on: the element side (the fault is inside or beyond the element) or the bus side. */
  faultSide: "element" | "bus";
}

export interface SourcePath {
  source: string;
  /** Nodes from the fault node to the source node. */
  nodes: string[];
  steps: PathStep[];
}

export function faultNode(loc: FaultLocation): string {
  return loc.kind === "bus" ? busNode(loc.bus) : elementNode(loc.line);
}

/** Every source reachable from the fault, each with its path (nearest step first). */
export function findSourcePaths(net: ScenarioNetwork, loc: FaultLocation): SourcePath[] {
  const start = faultNode(loc);
  if (!net.adjacency.has(start)) return [];
  const parentEdge = new Map<string, number>([[start, -1]]);
  const queue = [start];
  for (let q = 0; q < queue.length; q++) {
    const node = queue[q];
    for (const i of net.adjacency.get(node) ?? []) {
      const next = across(net.edges[i], node);
      if (parentEdge.has(next)) continue;
      parentEdge.set(next, i);
      queue.push(next);
    }
  }
  const paths: SourcePath[] = [];
  for (const source of net.sources) {
    const target = elementNode(source);
    if (!parentEdge.has(target)) continue;
    const nodes = [target];
    const steps: PathStep[] = [];
    let node = target;
    while (node !== start) {
      const i = parentEdge.get(node)!;
      const prev = across(net.edges[i], node);
      // walking outward we went prev -> node; the fault lies on prev's side of the edge
      steps.push({ edge: i, faultSide: prev.startsWith("e:") ? "element" : "bus" });
      nodes.push(prev);
      node = prev;
    }
    nodes.reverse();
    steps.reverse();
    paths.push({ source, nodes, steps });
  }
  return paths;
}
