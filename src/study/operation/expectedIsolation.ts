// The expected isolation of a fault: the smallest set of zone-boundary devices whose opening disconnects
// the faulted zone from every live source, over all paths (rings, parallel feeders, several sources).
// A boundary device that cannot detect the fault by design (a directional element looking away from it,
// an earth-fault-only relay for a three-phase fault) is no boundary for that fault: the zone grows past it
// to the devices that should act, and the plan says which devices restrained and which remote ones clear.
// Backups are found the same way: the zone grown past a device whose breaker fails to open.
import type { ScenarioNetwork } from "../scenarioNetwork.ts";
import { elementNode } from "../scenarioNetwork.ts";
import type { FaultType } from "../types.ts";
import { canDetect, restrainsByDirection, type FaultSide } from "./deviceReach.ts";
import { energisingSources } from "./sources.ts";
import { zoneAcross, type ProtectionZones } from "./zones.ts";

export interface IsolationPlan {
  /** Zones that make up the faulted zone (the fault's own first), grown past devices that cannot see the fault. */
  zones: number[];
  /** Boundary edges that must open, ascending. */
  edges: number[];
  /** Devices on those edges able to detect the fault: the expected isolation. */
  devices: string[];
  /** Boundary devices that restrain by direction: the zone grew past them. */
  restrained: string[];
  /** Boundary devices with no element for this fault type: the zone grew past them. */
  blind: string[];
  /** Live sources inside the faulted zone: no device of the project can disconnect them from the fault. */
  outOfReach: string[];
  /** Per edge of `edges` (same order): the live sources beyond it. */
  beyond: string[][];
}

/** The zone graph and live-source zones of one scenario, shared by every fault location in it. */
export interface IsolationContext {
  net: ScenarioNetwork;
  zones: ProtectionZones;
  /** Zone index -> live (energising) sources whose element node lies in it. */
  liveIn: Map<number, string[]>;
}

export function isolationContext(net: ScenarioNetwork, zones: ProtectionZones): IsolationContext {
  const liveIn = new Map<number, string[]>();
  for (const s of energisingSources(net)) {
    const z = zones.zoneOf.get(elementNode(s));
    if (z === undefined) continue;
    const list = liveIn.get(z);
    if (list) list.push(s);
    else liveIn.set(z, [s]);
  }
  return { net, zones, liveIn };
}

/**
 * Walks the zone graph from `start` without entering `inside` (nor crossing `open` edges), calling `visit` with each
 * zone reached; stops when `visit` returns true.
 */
function walkZones(ctx: IsolationContext, start: number, inside: ReadonlySet<number>, open: ReadonlySet<number> | null, visit: (zone: number) => boolean): void {
  if (visit(start)) return;
  const seen = new Set<number>([start]);
  const queue = [start];
  for (let q = 0; q < queue.length; q++) {
    for (const edge of ctx.zones.rim[queue[q]]) {
      if (open?.has(edge)) continue;
      const next = zoneAcross(ctx.zones, ctx.net, edge, queue[q]);
      if (seen.has(next) || inside.has(next)) continue;
      if (visit(next)) return;
      seen.add(next);
      queue.push(next);
    }
  }
}

const NONE: ReadonlySet<number> = new Set();

/** The live sources reachable from zone `start` without entering `inside`. */
function liveBeyond(ctx: IsolationContext, start: number, inside: ReadonlySet<number>): string[] {
  const found: string[] = [];
  walkZones(ctx, start, inside, null, (z) => {
    found.push(...(ctx.liveIn.get(z) ?? []));
    return false;
  });
  return found;
}

/** True when a live source can be reached from `start` without entering `inside`. */
function reachesLive(ctx: IsolationContext, start: number, inside: ReadonlySet<number>): boolean {
  let live = false;
  walkZones(ctx, start, inside, null, (z) => (live = ctx.liveIn.has(z)));
  return live;
}

/** Which side of boundary edge `edge` the grown zone lies on. */
function sideOf(ctx: IsolationContext, edge: number, inside: ReadonlySet<number>): FaultSide {
  return inside.has(ctx.zones.zoneOf.get(ctx.net.edges[edge].elementKey)!) ? "element" : "bus";
}

/** Grows `inside` until every boundary edge towards a live source has a device able to detect the fault. */
function grow(ctx: IsolationContext, inside: Set<number>, order: number[], faultType: FaultType, restrained: Set<string>, blind: Set<string>): void {
  for (let changed = true; changed; ) {
    changed = false;
    for (const z of order) {
      for (const edge of ctx.zones.rim[z]) {
        const other = zoneAcross(ctx.zones, ctx.net, edge, z);
        if (inside.has(other) || !reachesLive(ctx, other, inside)) continue;
        const side = sideOf(ctx, edge, inside);
        const devices = ctx.zones.tripping.get(edge)!;
        if (devices.some((d) => canDetect(ctx.net.devices.get(d)!, faultType, side))) continue;
        for (const d of devices) (restrainsByDirection(ctx.net.devices.get(d)!, faultType, side) ? restrained : blind).add(d);
        inside.add(other);
        order.push(other);
        changed = true;
        break;
      }
      if (changed) break;
    }
  }
}

function planOf(ctx: IsolationContext, inside: Set<number>, order: number[], faultType: FaultType, restrained: Set<string>, blind: Set<string>): IsolationPlan {
  grow(ctx, inside, order, faultType, restrained, blind);
  const edges = new Set<number>();
  const devices: string[] = [];
  for (const z of order)
    for (const edge of ctx.zones.rim[z]) {
      if (edges.has(edge)) continue;
      const other = zoneAcross(ctx.zones, ctx.net, edge, z);
      if (inside.has(other) || !reachesLive(ctx, other, inside)) continue;
      edges.add(edge);
    }
  const sorted = [...edges].sort((a, b) => a - b);
  const beyond: string[][] = [];
  for (const edge of sorted) {
    const e = ctx.net.edges[edge];
    const outside = inside.has(ctx.zones.zoneOf.get(e.busKey)!) ? ctx.zones.zoneOf.get(e.elementKey)! : ctx.zones.zoneOf.get(e.busKey)!;
    beyond.push(liveBeyond(ctx, outside, inside));
    const side = sideOf(ctx, edge, inside);
    for (const d of ctx.zones.tripping.get(edge)!) if (canDetect(ctx.net.devices.get(d)!, faultType, side)) devices.push(d);
  }
  const outOfReach: string[] = [];
  for (const z of order) outOfReach.push(...(ctx.liveIn.get(z) ?? []));
  return { zones: order, edges: sorted, devices, restrained: [...restrained], blind: [...blind], outOfReach, beyond };
}

/** The expected isolation of a fault at graph node `faultNode` (see faultNode.ts). */
export function expectedIsolation(ctx: IsolationContext, faultNode: string, faultType: FaultType): IsolationPlan {
  const z = ctx.zones.zoneOf.get(faultNode);
  if (z === undefined) return { zones: [], edges: [], devices: [], restrained: [], blind: [], outOfReach: [], beyond: [] };
  return planOf(ctx, new Set([z]), [z], faultType, new Set(), new Set());
}

/**
 * The isolation when the breaker at boundary edge `failed` of `plan` does not open: the zone grown past it.
 * Its devices beyond the original plan's are the backups of the failed edge.
 */
export function isolationWithFailure(ctx: IsolationContext, plan: IsolationPlan, failed: number, faultType: FaultType): IsolationPlan {
  const inside = new Set(plan.zones);
  const order = [...plan.zones];
  const from = inside.has(ctx.zones.zoneOf.get(ctx.net.edges[failed].busKey)!) ? ctx.zones.zoneOf.get(ctx.net.edges[failed].busKey)! : ctx.zones.zoneOf.get(ctx.net.edges[failed].elementKey)!;
  const other = zoneAcross(ctx.zones, ctx.net, failed, from);
  if (!inside.has(other)) {
    inside.add(other);
    order.push(other);
  }
  return planOf(ctx, inside, order, faultType, new Set(plan.restrained), new Set(plan.blind));
}

/** The devices of `failure` that are not in `plan`: the backups. */
export function backupDevices(plan: IsolationPlan, failure: IsolationPlan): string[] {
  const own = new Set(plan.devices);
  return failure.devices.filter((d) => !own.has(d));
}

/**
 * The live sources still connected to zone `start` with the boundary edges `open` open. Devices open only
 * their own edges, which are zone boundaries, so connectivity is a walk over the zone graph (a hundred
 * zones where the network graph has thousands of nodes).
 */
export function liveFeeding(ctx: IsolationContext, start: number, open: ReadonlySet<number>): string[] {
  const found: string[] = [];
  walkZones(ctx, start, NONE, open, (z) => {
    found.push(...(ctx.liveIn.get(z) ?? []));
    return false;
  });
  return found;
}

/** The zones connected to zone `start` with no device open. */
export function zonesConnected(ctx: IsolationContext, start: number): Set<number> {
  const seen = new Set<number>();
  walkZones(ctx, start, NONE, null, (z) => {
    seen.add(z);
    return false;
  });
  return seen;
}
