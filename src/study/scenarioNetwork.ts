// The network of one scenario as a graph the study walks: bus nodes and element nodes joined by
// element-end edges. A protective device sits on the edge of the element end it looks into, so
// opening a device cuts exactly that edge. Out-of-service elements and open switches are left out.
import { isProtectiveDevice, isSource, type Element, type Project, type ProtectiveDevice, type Scenario } from "../model/schema.ts";

export type EndName = "from" | "to" | "terminal";

/** One element end: the element joined to a bus at that end. */
export interface NetEdge {
  index: number;
  bus: string;
  element: string;
  end: EndName;
  /** Devices located at this end, looking into the element. */
  devices: string[];
  /** Node keys of the two ends (busNode(bus), elementNode(element)), built once so that walks make no strings. */
  busKey: string;
  elementKey: string;
}

export interface ScenarioNetwork {
  scenario: Scenario;
  elements: Map<string, Element>;
  devices: Map<string, ProtectiveDevice>;
  /** In-service sources (grid, generator, inverter) by id. */
  sources: string[];
  edges: NetEdge[];
  /** Node key (`b:ID` bus, `e:ID` element) -> indices of its edges. */
  adjacency: Map<string, number[]>;
  /** Device id -> its edge index (devices whose element is out of service are absent). */
  deviceEdge: Map<string, number>;
  /** Devices whose location names an element that is not in service in this scenario. */
  idleDevices: string[];
}

export const busNode = (id: string): string => `b:${id}`;
export const elementNode = (id: string): string => `e:${id}`;

function endsOf(e: Element, closedSwitch: boolean): { bus: string; end: EndName }[] {
  switch (e.kind) {
    case "transformer":
      return [
        { bus: e.hvBus, end: "from" },
        { bus: e.lvBus, end: "to" },
      ];
    case "line":
      return [
        { bus: e.fromBus, end: "from" },
        { bus: e.toBus, end: "to" },
      ];
    case "switch":
      return closedSwitch
        ? [
            { bus: e.busA, end: "from" },
            { bus: e.busB, end: "to" },
          ]
        : [];
    case "grid":
    case "generator":
    case "inverter":
    case "motor":
    case "load":
      return [{ bus: e.bus, end: "terminal" }];
    default:
      return [];
  }
}

/** Builds the graph of `scenario`. Elements touching an out-of-service bus are left out too. */
export function scenarioNetwork(project: Project, scenario: Scenario): ScenarioNetwork {
  const out = new Set(scenario.outOfService);
  const elements = new Map<string, Element>();
  const devices = new Map<string, ProtectiveDevice>();
  for (const e of project.elements) {
    elements.set(e.id, e);
    if (isProtectiveDevice(e)) devices.set(e.id, e);
  }
  const edges: NetEdge[] = [];
  const adjacency = new Map<string, number[]>();
  const endIndex = new Map<string, number>();
  // one key string per node, shared by its edges and the adjacency (walks compare and hash them often)
  const busKeys = new Map<string, string>();
  const elementKeys = new Map<string, string>();
  const keyOf = (id: string, make: typeof busNode): string => {
    const cache = make === busNode ? busKeys : elementKeys;
    let key = cache.get(id);
    if (key === undefined) cache.set(id, (key = make(id)));
    return key;
  };
  const link = (node: string, i: number) => {
    const list = adjacency.get(node);
    if (list) list.push(i);
    else adjacency.set(node, [i]);
  };
  const sources: string[] = [];
  for (const e of project.elements) {
    if (e.kind === "bus") {
      if (!out.has(e.id)) {
        const key = keyOf(e.id, busNode);
        adjacency.set(key, adjacency.get(key) ?? []);
      }
      continue;
    }
    if (out.has(e.id)) continue;
    const closed = e.kind === "switch" ? (Object.hasOwn(scenario.switchStates, e.id) ? scenario.switchStates[e.id] : e.closed) : true;
    const ends = endsOf(e, closed);
    if (ends.length === 0 || ends.some((x) => out.has(x.bus) || elements.get(x.bus)?.kind !== "bus")) continue;
    for (const x of ends) {
      const index = edges.length;
      const busKey = keyOf(x.bus, busNode);
      const elementKey = keyOf(e.id, elementNode);
      edges.push({ index, bus: x.bus, element: e.id, end: x.end, devices: [], busKey, elementKey });
      endIndex.set(`${e.id}|${x.end}`, index);
      link(busKey, index);
      link(elementKey, index);
    }
    if (isSource(e)) sources.push(e.id);
  }
  const deviceEdge = new Map<string, number>();
  const idleDevices: string[] = [];
  for (const d of devices.values()) {
    const i = endIndex.get(`${d.at.element}|${d.at.end}`);
    if (i === undefined || out.has(d.id)) {
      idleDevices.push(d.id);
      continue;
    }
    edges[i].devices.push(d.id);
    deviceEdge.set(d.id, i);
  }
  return { scenario, elements, devices, sources, edges, adjacency, deviceEdge, idleDevices };
}

/** The node at the other end of an edge from `node`. */
export function across(edge: NetEdge, node: string): string {
  return node === edge.busKey ? edge.elementKey : edge.busKey;
}

/**
 * Nodes reachable from `start` without crossing the edges in `cut`.
 * Plain breadth-first search; the graphs are small enough (a few thousand nodes) to walk often.
 */
export function reachable(net: ScenarioNetwork, start: string, cut: ReadonlySet<number>): Set<string> {
  const seen = new Set<string>([start]);
  const queue = [start];
  for (let q = 0; q < queue.length; q++) {
    const node = queue[q];
    for (const i of net.adjacency.get(node) ?? []) {
      if (cut.has(i)) continue;
      const next = across(net.edges[i], node);
      if (!seen.has(next)) {
        seen.add(next);
        queue.push(next);
      }
    }
  }
  return seen;
}
