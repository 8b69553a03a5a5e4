// A short inventory of a project: how many elements of each kind, buses per voltage level,
// and for each scenario which sources are out of service and which switches it overrides.
import { isSource, type ElementKind, type Project } from "./schema.ts";
import { findIslands } from "./topology.ts";

export interface ScenarioSummary {
  id: string;
  name: string;
  /** Sources (grid, generator, inverter) listed out of service. */
  sourcesOutOfService: string[];
  /** Other elements listed out of service. */
  otherOutOfService: string[];
  /** Switch id -> closed, as overridden by the scenario. */
  switchStates: Record<string, boolean>;
  /** Sources in service. */
  sourcesInService: string[];
  /** Number of separate energised parts (islands with at least one source). */
  energisedIslands: number;
}

export interface ProjectSummary {
  name: string;
  formatVersion: number;
  elementCount: number;
  countsByKind: Partial<Record<ElementKind, number>>;
  /** Nominal kV -> bus ids, highest voltage first. */
  busesByVoltage: { un_kV: number; buses: string[] }[];
  scenarios: ScenarioSummary[];
}

export function summarizeProject(project: Project): ProjectSummary {
  const countsByKind: Partial<Record<ElementKind, number>> = {};
  const byVoltage = new Map<number, string[]>();
  for (const e of project.elements) {
    countsByKind[e.kind] = (countsByKind[e.kind] ?? 0) + 1;
    if (e.kind === "bus") byVoltage.set(e.un_kV, [...(byVoltage.get(e.un_kV) ?? []), e.id]);
  }
  const sourceIds = new Set(project.elements.filter(isSource).map((e) => e.id));
  const scenarios = project.scenarios.map((s) => ({
    id: s.id,
    name: s.name,
    sourcesOutOfService: s.outOfService.filter((id) => sourceIds.has(id)),
    otherOutOfService: s.outOfService.filter((id) => !sourceIds.has(id)),
    switchStates: { ...s.switchStates },
    sourcesInService: [...sourceIds].filter((id) => !s.outOfService.includes(id)),
    energisedIslands: findIslands(project, s).filter((i) => i.sources.length > 0).length,
  }));
  return {
    name: project.meta.name,
    formatVersion: project.formatVersion,
    elementCount: project.elements.length,
    countsByKind,
    busesByVoltage: [...byVoltage.entries()].sort((a, b) => b[0] - a[0]).map(([un_kV, buses]) => ({ un_kV, buses })),
    scenarios,
  };
}
