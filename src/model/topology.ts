// Which buses are joined in a given scenario: in-service branches and closed switches join their buses
// (union-find); each resulting island lists the in-service sources feeding it.
import { ownValue } from "./ownValue.ts";
import { elementBuses, isBranch, isSource, type Element, type Project, type Scenario } from "./schema.ts";

export interface Island {
  /** Bus ids in this island, in project order. */
  buses: string[];
  /** Ids of in-service sources (grid, generator, inverter) connected to a bus of this island. */
  sources: string[];
}


/** A switch's state in a scenario: the scenario's override, else the switch's own state. */
export function isSwitchClosed(element: Element, scenario?: Scenario): boolean {
  if (element.kind !== "switch") return false;
  const override = ownValue(scenario?.switchStates, element.id);
  return override ?? element.closed;
}

/** Islands of in-service buses for one scenario (or the network as drawn when none is given). */
export function findIslands(project: Project, scenario?: Scenario): Island[] {
  const out = new Set(scenario?.outOfService ?? []);
  const buses = project.elements.filter((e) => e.kind === "bus" && !out.has(e.id)).map((e) => e.id);
  const parent = new Map<string, string>(buses.map((b) => [b, b]));
  const root = (b: string): string => {
    let r = b;
    while (parent.get(r) !== r) r = parent.get(r)!;
    // path compression keeps later look-ups short
    let c = b;
    while (c !== r) {
      const next = parent.get(c)!;
      parent.set(c, r);
      c = next;
    }
    return r;
  };
  const join = (a: string, b: string) => {
    if (!parent.has(a) || !parent.has(b)) return;
    const ra = root(a);
    const rb = root(b);
    if (ra !== rb) parent.set(ra, rb);
  };
  for (const e of project.elements) {
    if (out.has(e.id)) continue;
    if (isBranch(e) || (e.kind === "switch" && isSwitchClosed(e, scenario))) {
      const [a, b] = elementBuses(e);
      join(a, b);
    }
  }
  const byRoot = new Map<string, Island>();
  for (const b of buses) {
    const r = root(b);
    if (!byRoot.has(r)) byRoot.set(r, { buses: [], sources: [] });
    byRoot.get(r)!.buses.push(b);
  }
  for (const e of project.elements) {
    if (!isSource(e) || out.has(e.id) || !parent.has(e.bus)) continue;
    byRoot.get(root(e.bus))!.sources.push(e.id);
  }
  return [...byRoot.values()];
}
