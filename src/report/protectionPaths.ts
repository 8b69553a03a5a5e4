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
  /** Largest and smallest residual current 3I0 through the primary device as primary in earth faults (LG, LLG), A. */
  residualMax_A: number | null;
  residualMin_A: number | null;
}

const contains = (long: readonly string[], short: readonly string[]) => {
  for (let k = 0; k + short.length <= long.length; k++) if (short.every((d, j) => long[k + j] === d)) return true;
  return false;
};

/** The largest current of the maximum calculation and the smallest of the minimum one (either list stands in for the other). */
function extremes<K extends string>(by: Record<FaultLimit, number[]>, key: K): Record<`${K}Max_A` | `${K}Min_A`, number | null> {
  const hi = by.max.length ? by.max : by.min;
  const lo = by.min.length ? by.min : by.max;
  return { [`${key}Max_A`]: hi.length ? Math.max(...hi) : null, [`${key}Min_A`]: lo.length ? Math.min(...lo) : null } as Record<`${K}Max_A` | `${K}Min_A`, number | null>;
}

export function protectionPaths(cases: readonly CaseResult[]): ProtectionPath[] {
  const found = new Map<string, { devices: string[]; scenarios: Set<string>; current: Record<FaultLimit, number[]>; residual: Record<FaultLimit, number[]> }>();
  for (const c of cases)
    for (const p of c.chains.paths) {
      const devices = p.links.map((l) => l.device);
      if (devices.length === 0) continue;
      const key = devices.join(">");
      let entry = found.get(key);
      if (!entry) found.set(key, (entry = { devices, scenarios: new Set(), current: { max: [], min: [] }, residual: { max: [], min: [] } }));
      entry.scenarios.add(c.faultCase.scenario);
      const i = p.links[0].current_A;
      if (Number.isFinite(i) && i >= 1) entry.current[c.faultCase.limit].push(i);
      if (c.faultCase.faultType === "LG" || c.faultCase.faultType === "LLG") {
        const r = c.responses.find((x) => x.device === devices[0])?.iResidual_A;
        if (r !== undefined && Number.isFinite(r) && r >= 1) entry.residual[c.faultCase.limit].push(r);
      }
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
      ...extremes(e.current, "primary"),
      ...extremes(e.residual, "residual"),
    }))
    .sort((a, b) => (a.devices.join(">") < b.devices.join(">") ? -1 : a.devices.join(">") > b.devices.join(">") ? 1 : 0));
}
