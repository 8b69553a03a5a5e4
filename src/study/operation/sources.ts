// Which in-service sources hold a voltage up on their own (and so must be disconnected from a fault),
// and which only follow one (grid-following converters cease to energise on their own protection when the
// voltage collapses or the island is lost: IEEE 1547-2018 clause 8.1 and 6.4, from memory).
import type { ScenarioNetwork } from "../scenarioNetwork.ts";

export function isEnergising(net: ScenarioNetwork, source: string): boolean {
  const e = net.elements.get(source);
  return e?.kind === "grid" || e?.kind === "generator" || (e?.kind === "inverter" && e.control === "grid-forming");
}

/** In-service sources able to hold a voltage up on their own: grids, generators, grid-forming converters. */
export function energisingSources(net: ScenarioNetwork): string[] {
  return net.sources.filter((s) => isEnergising(net, s));
}

/** In-service grid-following converters. */
export function followingSources(net: ScenarioNetwork): string[] {
  return net.sources.filter((s) => !isEnergising(net, s));
}
