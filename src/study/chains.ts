// Primary/backup chains: walk each source path from the fault outward; the first device met is the
// primary, the next one protecting the fault's side is its backup, and so on. A device met further
// out that protects the other side (a healthy feeder carrying a downstream source's infeed) is no
// backup: it is a sympathetic-tripping candidate. A source's own breaker always closes its path's chain.
import type { ProtectedSide } from "./deviceSides.ts";
import type { ScenarioNetwork } from "./scenarioNetwork.ts";
import type { SourcePath } from "./sourcePaths.ts";
import type { ChainLink, DeviceResponse, FaultChains, SourcePathChain } from "./types.ts";

export interface ChainAnalysis {
  chains: FaultChains;
  /** Devices on a source path beyond the primary that protect the side away from the fault. */
  sympatheticCandidates: Set<string>;
}

/** The fast-edge clearing time of `next` minus the slow-edge clearing time of `link`. */
export function bandMargin_s(link: DeviceResponse, next: DeviceResponse): number | null {
  if (link.tClearMax_s === null || next.tClearMin_s === null) return null;
  return next.tClearMin_s - link.tClearMax_s;
}

export function buildChains(
  caseId: string,
  net: ScenarioNetwork,
  paths: SourcePath[],
  responses: ReadonlyMap<string, DeviceResponse>,
  sides: ReadonlyMap<string, ProtectedSide>,
): ChainAnalysis {
  const sympatheticCandidates = new Set<string>();
  const chainPaths: SourcePathChain[] = [];
  const ideal: string[] = [];
  for (const path of paths) {
    const src = net.elements.get(path.source)!;
    const devices: DeviceResponse[] = [];
    const elements: string[] = [];
    for (const step of path.steps) {
      const edge = net.edges[step.edge];
      if (elements[elements.length - 1] !== edge.element && edge.element !== path.source) elements.push(edge.element);
      for (const d of edge.devices) {
        const r = responses.get(d);
        if (!r) continue;
        const side = sides.get(d) ?? "both";
        // the source's own breaker always backs up its path, whichever way it looks
        const ownBreaker = edge.element === path.source;
        if (devices.length > 0 && !ownBreaker && side !== "both" && side !== step.faultSide) {
          sympatheticCandidates.add(d);
          continue;
        }
        if (!devices.includes(r)) devices.push(r);
      }
    }
    const links: ChainLink[] = devices.map((r, depth) => ({
      device: r.device,
      deviceName: r.deviceName,
      depth,
      role: depth === 0 ? "primary" : "backup",
      current_A: r.iPhase_A,
      tClear_s: r.tClear_s,
      marginToNext_s: depth + 1 < devices.length ? bandMargin_s(r, devices[depth + 1]) : null,
    }));
    if (links.length > 0 && !ideal.includes(links[0].device)) ideal.push(links[0].device);
    chainPaths.push({
      source: path.source,
      sourceName: src.name ?? "",
      sourceKind: src.kind as SourcePathChain["sourceKind"],
      elements,
      links,
    });
  }
  // A candidate that is a proper chain member on another path stays a chain member.
  for (const p of chainPaths) for (const l of p.links) sympatheticCandidates.delete(l.device);
  return { chains: { caseId, paths: chainPaths, idealIsolation: ideal }, sympatheticCandidates };
}
