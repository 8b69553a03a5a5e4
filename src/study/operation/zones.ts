// Protection zones of one scenario: the interrupting devices that trip automatically (a breaker tripped by
// a relay, an LV breaker with a trip unit, a fuse) cut the network graph into zones. Switches and breakers
// that nothing trips join their two sides into one zone. A zone is a set of graph nodes (buses and
// elements), so a cable with a device at each end is a zone of its own, and so is a source behind its own
// breaker.
import type { ScenarioNetwork } from "../scenarioNetwork.ts";
import { across } from "../scenarioNetwork.ts";
import { canTrip } from "./deviceReach.ts";

export interface ProtectionZones {
  /** Node key -> zone index. */
  zoneOf: Map<string, number>;
  /** Zone index -> its node keys. */
  nodes: string[][];
  /** Zone index -> the boundary edges on its rim (edge indices, each once). */
  rim: number[][];
  /** Edge index -> the devices on it that trip; present only for boundary edges. */
  tripping: Map<number, string[]>;
}

/** The zone on the other side of boundary edge `edge` from zone `zone` (the same zone for an edge inside it). */
export function zoneAcross(zones: ProtectionZones, net: ScenarioNetwork, edge: number, zone: number): number {
  const e = net.edges[edge];
  const a = zones.zoneOf.get(e.busKey)!;
  const b = zones.zoneOf.get(e.elementKey)!;
  return a === zone ? b : a;
}

export function protectionZones(net: ScenarioNetwork): ProtectionZones {
  const tripping = new Map<number, string[]>();
  for (const [device, edge] of net.deviceEdge) {
    const d = net.devices.get(device);
    if (!d || !canTrip(d)) continue;
    const list = tripping.get(edge);
    if (list) list.push(device);
    else tripping.set(edge, [device]);
  }
  const zoneOf = new Map<string, number>();
  const nodes: string[][] = [];
  for (const start of net.adjacency.keys()) {
    if (zoneOf.has(start)) continue;
    const z = nodes.length;
    const members = [start];
    zoneOf.set(start, z);
    for (let q = 0; q < members.length; q++) {
      for (const i of net.adjacency.get(members[q]) ?? []) {
        if (tripping.has(i)) continue;
        const next = across(net.edges[i], members[q]);
        if (zoneOf.has(next)) continue;
        zoneOf.set(next, z);
        members.push(next);
      }
    }
    nodes.push(members);
  }
  const rim: number[][] = nodes.map(() => []);
  for (const edge of tripping.keys()) {
    const e = net.edges[edge];
    const a = zoneOf.get(e.busKey)!;
    const b = zoneOf.get(e.elementKey)!;
    rim[a].push(edge);
    if (b !== a) rim[b].push(edge);
  }
  for (const r of rim) r.sort((x, y) => x - y);
  return { zoneOf, nodes, rim, tripping };
}
