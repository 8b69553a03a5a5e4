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

/** Breadth-first trees rooted at every source: node -> the edge leading one step closer to that source. */
export type SourceTrees = Map<string, Map<string, number>>;

export function sourceTrees(net: ScenarioNetwork): SourceTrees {
  const trees: SourceTrees = new Map();
  for (const source of net.sources) {
    const root = elementNode(source);
    const toward = new Map<string, number>([[root, -1]]);
    const queue = [root];
    for (let q = 0; q < queue.length; q++) {
      const node = queue[q];
      for (const i of net.adjacency.get(node) ?? []) {
        const next = across(net.edges[i], node);
        if (toward.has(next)) continue;
        toward.set(next, i);
        queue.push(next);
      }
    }
    trees.set(source, toward);
  }
  return trees;
}

/**
 * Every source reachable from the fault, each with its path (nearest step first). Pass the trees of
 * sourceTrees() when finding paths for many locations of one scenario: one walk per source instead of
 * one per location.
 */
export function findSourcePaths(net: ScenarioNetwork, loc: FaultLocation, trees: SourceTrees = sourceTrees(net)): SourcePath[] {
  const start = faultNode(loc);
  if (!net.adjacency.has(start)) return [];
  const paths: SourcePath[] = [];
  for (const source of net.sources) {
    const toward = trees.get(source);
    if (!toward || !toward.has(start)) continue;
    const nodes = [start];
    const steps: PathStep[] = [];
    let node = start;
    const root = elementNode(source);
    while (node !== root) {
      const i = toward.get(node)!;
      const next = across(net.edges[i], node);
      // walking outward from node to next; the fault lies on node's side of the edge
      steps.push({ edge: i, faultSide: node.startsWith("e:") ? "element" : "bus" });
      nodes.push(next);
      node = next;
    }
    paths.push({ source, nodes, steps });
  }
  return paths;
}
