// Enumerates the fault cases of a study: every bus and points along every line or cable (its two
// ends and criteria.linePoints_pct), for each fault type, scenario and limit the scenario asks for.
import type { Element, Project, Scenario } from "../model/schema.ts";
import { caseId } from "./keys.ts";
import { FAULT_TYPES, type FaultCase, type FaultLimit, type FaultLocation, type FaultType, type StudyOptions } from "./types.ts";

const FAULT_WORDS: Record<FaultType, string> = { "3ph": "3ph", LL: "LL", LG: "LG", LLG: "LLG" };

export { caseId, caseRowId, locationKey } from "./keys.ts";

/** `bus LV-A` or `cable C1 "Dock feeder" at 50 %`. */
export function locationLabel(loc: FaultLocation, elements: ReadonlyMap<string, Element>): string {
  if (loc.kind === "bus") return `bus ${loc.bus}`;
  const line = elements.get(loc.line);
  const word = line?.kind === "line" && line.construction === "overhead" ? "line" : "cable";
  return `${word} ${loc.line} at ${loc.pct} %`;
}


export function caseLabel(scenario: Scenario, loc: FaultLocation, faultType: FaultType, limit: FaultLimit, elements: ReadonlyMap<string, Element>): string {
  return `${FAULT_WORDS[faultType]} fault on ${locationLabel(loc, elements)} (${scenario.name}, ${limit})`;
}

/**
 * Fault locations of one scenario: its in-service buses, then points along its in-service lines.
 * A line's two ends are its end buses (the engine puts a 0 % or 100 % fault on the bus itself), so the
 * points along it are criteria.linePoints_pct.
 */
export function faultLocations(project: Project, scenario: Scenario, options: StudyOptions = {}): FaultLocation[] {
  const out = new Set(scenario.outOfService);
  const onlyBuses = options.buses ? new Set(options.buses) : null;
  const locations: FaultLocation[] = [];
  for (const e of project.elements) {
    if (e.kind !== "bus" || out.has(e.id)) continue;
    if (onlyBuses && !onlyBuses.has(e.id)) continue;
    locations.push({ kind: "bus", bus: e.id });
  }
  if (options.linePoints === false) return locations;
  const points = [...new Set(project.criteria.linePoints_pct)].sort((a, b) => a - b);
  for (const e of project.elements) {
    if (e.kind !== "line" || out.has(e.id) || out.has(e.fromBus) || out.has(e.toBus)) continue;
    // With a bus filter, keep the lines touching one of the chosen buses.
    if (onlyBuses && !onlyBuses.has(e.fromBus) && !onlyBuses.has(e.toBus)) continue;
    for (const pct of points) locations.push({ kind: "line", line: e.id, pct });
  }
  return locations;
}

/** Every fault case selected by `options`, grouped by scenario, then limit, then fault type, then location. */
export function enumerateFaultCases(project: Project, options: StudyOptions = {}): FaultCase[] {
  const elements = new Map(project.elements.map((e) => [e.id, e] as const));
  const wantScenarios = options.scenarios ? new Set(options.scenarios) : null;
  const types = options.faultTypes ?? FAULT_TYPES;
  const cases: FaultCase[] = [];
  for (const scenario of project.scenarios) {
    if (wantScenarios && !wantScenarios.has(scenario.id)) continue;
    const locations = faultLocations(project, scenario, options);
    const limits = scenario.limits.filter((l) => !options.limits || options.limits.includes(l));
    for (const limit of limits)
      for (const faultType of types)
        for (const location of locations)
          cases.push({
            id: caseId(scenario.id, location, faultType, limit),
            scenario: scenario.id,
            location,
            faultType,
            limit,
            label: caseLabel(scenario, location, faultType, limit, elements),
          });
  }
  return cases;
}
