// Primary/backup chains: walk each source path from the fault outward; the first device met is the
// primary, the next one protecting the fault's side is its backup, and so on. A device met further
// out that protects the other side (a healthy feeder carrying a downstream source's infeed) is no
// backup: it is a sympathetic-tripping candidate. A source's own breaker always closes its path's chain.
//
// Which devices form each chain depends only on the network, the fault location and the protected sides,
// not on the currents: chainPlan() walks the paths once per location, and chainsFromPlan() fills in each
// case's currents and times.
import type { ProtectedSide } from "./deviceSides.ts";
import type { ScenarioNetwork } from "./scenarioNetwork.ts";
import type { SourcePath } from "./sourcePaths.ts";
import type { ChainLink, DeviceResponse, FaultChains, SourcePathChain } from "./types.ts";

export interface ChainAnalysis {
  chains: FaultChains;
  /** Devices on a source path beyond the primary that protect the side away from the fault. */
  sympatheticCandidates: Set<string>;
}

/** One source path's chain without its case's numbers. */
export interface PlannedChain {
  source: string;
  sourceName: string;
  sourceKind: SourcePathChain["sourceKind"];
  /** Elements from the fault to the source, nearest first (shared by every case at the location). */
  elements: string[];
  /** Chain devices, primary first. */
  devices: string[];
}

/** The chains of one fault location, and what they make of each device, for every case at that location. */
export interface ChainPlan {
  paths: PlannedChain[];
  /** Every device on a source path, in the order the walk meets them. */
  pathDevices: string[];
  /** Sympathetic-tripping candidates in the order they are met (none is a chain member on another path). */
  sympatheticCandidates: string[];
  /** First device of every chain, once each (shared by every case at the location). */
  idealIsolation: string[];
  /** Chain members: primary when first on any path, else backup; and the sources whose paths they sit on. */
  members: Map<string, { role: "primary" | "backup"; onPathsOf: string[] }>;
}

/** The fast-edge clearing time of `next` minus the slow-edge clearing time of `link`. */
export function bandMargin_s(link: DeviceResponse, next: DeviceResponse): number | null {
  if (link.tClearMax_s === null || next.tClearMin_s === null) return null;
  return next.tClearMin_s - link.tClearMax_s;
}

/** The chains along `paths`, counting only the devices for which `has` is true (those with a response). */
export function chainPlan(net: ScenarioNetwork, paths: SourcePath[], sides: ReadonlyMap<string, ProtectedSide>, has: (device: string) => boolean = () => true): ChainPlan {
  const candidates = new Set<string>();
  const planned: PlannedChain[] = [];
  const ideal: string[] = [];
  const pathDevices: string[] = [];
  const onPath = new Set<string>();
  for (const path of paths) {
    const src = net.elements.get(path.source)!;
    const devices: string[] = [];
    const elements: string[] = [];
    for (const step of path.steps) {
      const edge = net.edges[step.edge];
      if (elements[elements.length - 1] !== edge.element && edge.element !== path.source) elements.push(edge.element);
      for (const d of edge.devices) {
        if (!onPath.has(d)) {
          onPath.add(d);
          pathDevices.push(d);
        }
        if (!has(d)) continue;
        const side = sides.get(d) ?? "both";
        // the source's own breaker always backs up its path, whichever way it looks
        const ownBreaker = edge.element === path.source;
        if (devices.length > 0 && !ownBreaker && side !== "both" && side !== step.faultSide) {
          candidates.add(d);
          continue;
        }
        if (!devices.includes(d)) devices.push(d);
      }
    }
    if (devices.length > 0 && !ideal.includes(devices[0])) ideal.push(devices[0]);
    planned.push({ source: path.source, sourceName: src.name ?? "", sourceKind: src.kind as SourcePathChain["sourceKind"], elements, devices });
  }
  const members = new Map<string, { role: "primary" | "backup"; onPathsOf: string[] }>();
  for (const p of planned)
    p.devices.forEach((d, depth) => {
      // A candidate that is a proper chain member on another path stays a chain member.
      candidates.delete(d);
      let m = members.get(d);
      if (!m) {
        m = { role: "backup", onPathsOf: [] };
        members.set(d, m);
      }
      if (depth === 0) m.role = "primary";
      if (!m.onPathsOf.includes(p.source)) m.onPathsOf.push(p.source);
    });
  return { paths: planned, pathDevices, sympatheticCandidates: [...candidates], idealIsolation: ideal, members };
}

/** One case's chains: the plan's devices with their responses in this case. */
export function chainsFromPlan(caseId: string, plan: ChainPlan, responses: ReadonlyMap<string, DeviceResponse>): FaultChains {
  const paths: SourcePathChain[] = [];
  for (const p of plan.paths) {
    const links: ChainLink[] = [];
    const n = p.devices.length;
    let r = n > 0 ? responses.get(p.devices[0])! : null;
    for (let depth = 0; depth < n; depth++) {
      const next = depth + 1 < n ? responses.get(p.devices[depth + 1])! : null;
      links.push({
        device: r!.device,
        deviceName: r!.deviceName,
        depth,
        role: depth === 0 ? "primary" : "backup",
        current_A: r!.iPhase_A,
        tClear_s: r!.tClear_s,
        marginToNext_s: next ? bandMargin_s(r!, next) : null,
      });
      r = next;
    }
    paths.push({ source: p.source, sourceName: p.sourceName, sourceKind: p.sourceKind, elements: p.elements, links });
  }
  return { caseId, paths, idealIsolation: plan.idealIsolation };
}

export function buildChains(
  caseId: string,
  net: ScenarioNetwork,
  paths: SourcePath[],
  responses: ReadonlyMap<string, DeviceResponse>,
  sides: ReadonlyMap<string, ProtectedSide>,
): ChainAnalysis {
  const plan = chainPlan(net, paths, sides, (d) => responses.has(d));
  return { chains: chainsFromPlan(caseId, plan, responses), sympatheticCandidates: new Set(plan.sympatheticCandidates) };
}
