// The graph node a fault location sits at: its bus, or for a point along a line the line's element node.
import type { FaultLocation } from "./types.ts";
import { busNode, elementNode } from "./scenarioNetwork.ts";

export function faultNode(loc: FaultLocation): string {
  return loc.kind === "bus" ? busNode(loc.bus) : elementNode(loc.line);
}
