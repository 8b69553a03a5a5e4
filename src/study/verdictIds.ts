// Whether every verdict of a study gets an id of its own without the study checking. Verdict ids join the ids of
// scenarios and elements, the location key, fault type and limit with "|" (and ">" within a selectivity pair);
// each verdict kind makes at most one verdict per device (pair, infeed) and case. So when scenario ids, element
// ids, fault types and each scenario's limits are distinct and no id holds a separator, ids cannot repeat, and a
// large study need not look 10^5 ids up to drop repeats. A project that fails the check keeps that look-up.
import type { Project, Scenario } from "../model/schema.ts";
import type { FaultLimit, FaultType } from "./types.ts";

const SEPARATORS = /[|>]/;

function distinct(xs: readonly string[]): boolean {
  return new Set(xs).size === xs.length;
}

export function verdictIdsDistinct(project: Project, scenarios: readonly Scenario[], types: readonly FaultType[], limitsOf: (s: Scenario) => readonly FaultLimit[]): boolean {
  const elementIds = project.elements.map((e) => e.id);
  const scenarioIds = scenarios.map((s) => s.id);
  if (!distinct(elementIds) || !distinct(scenarioIds) || !distinct(types)) return false;
  if (elementIds.some((id) => SEPARATORS.test(id)) || scenarioIds.some((id) => SEPARATORS.test(id))) return false;
  return scenarios.every((s) => distinct(limitsOf(s)));
}
