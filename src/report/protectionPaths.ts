// Protection paths: the chains of devices met from a fault outward to a source (primary, first backup, ...),
// gathered over every case of the study. A chain that is a contiguous part of a longer chain is drawn with
// that longer one, so each device series appears on one time-current plot.
import type { CaseResult, FaultLimit } from "../study/types.ts";

export interface ProtectionPath {
  /** Device ids, primary first. */
  devices: string[];
  /** Scenario ids in which the chain (or a longer chain containing it) occurs. */
  scenarios: string[];
  /** Largest and smallest current the primary device carries as primary, A, over the cases of each limit. */
  primaryMax_A: number | null;
  primaryMin_A: number | null;
}

const contains = (long: readonly string[], short: readonly string[]) => {
  for (let k = 0; k + short.length <= long.length; k++) if (short.every((d, j) => long[k + j] === d)) return true;
  return false;
};

export function protectionPaths(cases: readonly CaseResult[]): ProtectionPath[] {
  const found = new Map<string, { devices: string[]; scenarios: Set<string>; current: Record<FaultLimit, number[]> }>();
  for (const c of cases)
    for (const p of c.chains.paths) {
      const devices = p.links.map((l) => l.device);
      if (devices.length === 0) continue;
      const key = devices.join(">");
      let entry = found.get(key);
      if (!entry) found.set(key, (entry = { devices, scenarios: new Set(), current: { max: [], min: [] } }));
      entry.scenarios.add(c.faultCase.scenario);
      const i = p.links[0].current_A;
      if (Number.isFinite(i) && i >= 1) entry.current[c.faultCase.limit].push(i);
    }
  const all = [...found.values()].sort((a, b) => b.devices.length - a.devices.length || (a.devices.join(">") < b.devices.join(">") ? -1 : 1));
  const kept: typeof all = [];
  for (const e of all) {
    const host = kept.find((k) => contains(k.devices, e.devices));
    if (host) {
      for (const s of e.scenarios) host.scenarios.add(s);
      continue;
    }
    kept.push(e);
  }
  return kept
    .map((e) => ({
      devices: e.devices,
      scenarios: [...e.scenarios].sort(),
      primaryMax_A: e.current.max.length ? Math.max(...e.current.max) : e.current.min.length ? Math.max(...e.current.min) : null,
      primaryMin_A: e.current.min.length ? Math.min(...e.current.min) : e.current.max.length ? Math.min(...e.current.max) : null,
    }))
    .sort((a, b) => (a.devices.join(">") < b.devices.join(">") ? -1 : a.devices.join(">") > b.devices.join(">") ? 1 : 0));
}
