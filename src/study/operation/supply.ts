// What a set of open edges does to supply: which buses lose every energising source, and the load on them.
import { elementNode, reachable, type ScenarioNetwork } from "../scenarioNetwork.ts";
import { energisingSources } from "./sources.ts";

/** Buses left without an energising source when the `cut` edges are open, and the load on them (kW). */
export function deenergised(net: ScenarioNetwork, cut: ReadonlySet<number>): { buses: string[]; load_kW: number } {
  const live = new Set<string>();
  for (const s of energisingSources(net)) for (const n of reachable(net, elementNode(s), cut)) live.add(n);
  const buses: string[] = [];
  for (const node of net.adjacency.keys()) if (node.startsWith("b:") && !live.has(node)) buses.push(node.slice(2));
  const dead = new Set(buses);
  const out = new Set(net.scenario.outOfService);
  let load_kW = 0;
  for (const e of net.elements.values()) {
    if (out.has(e.id) || !net.adjacency.has(elementNode(e.id))) continue;
    if (e.kind === "load" && dead.has(e.bus)) load_kW += Math.max(0, e.p_kW);
    if (e.kind === "motor" && dead.has(e.bus)) load_kW += e.pr_kW;
  }
  return { buses, load_kW };
}
