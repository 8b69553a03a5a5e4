// How big a study would be, worked out before it runs, and the budget it must stay within: a small file can
// ask for millions of fault cases (many scenarios, many line points), which would run for hours and out of
// memory. The estimate counts what runStudy would simulate.
import type { Project } from "../model/schema.ts";
import { faultLocations } from "./faultCases.ts";
import { FAULT_TYPES, type StudyOptions } from "./types.ts";

/** Fault cases a study may have (about 25 times the generated 10,000-bus network's 40,000 locations). */
export const STUDY_CASE_BUDGET = 1_000_000;

export interface StudySize {
  cases: number;
  scenarios: number;
  /** Fault locations of the largest scenario. */
  locations: number;
  faultTypes: number;
}

export function studySize(project: Project, options: StudyOptions = {}): StudySize {
  const scenarios = project.scenarios.filter((s) => !options.scenarios || options.scenarios.includes(s.id));
  const types = options.faultTypes?.length ?? FAULT_TYPES.length;
  let cases = 0;
  let locations = 0;
  for (const s of scenarios) {
    const n = faultLocations(project, s, options).length;
    locations = Math.max(locations, n);
    cases += n * types * s.limits.filter((l) => !options.limits || options.limits.includes(l)).length;
  }
  return { cases, scenarios: scenarios.length, locations, faultTypes: types };
}

export class StudyTooLarge extends Error {
  constructor(
    readonly size: StudySize,
    readonly budget: number,
  ) {
    super(
      `The study would have ${size.cases.toLocaleString("en-US")} fault cases (${size.scenarios} scenario(s), up to ${size.locations.toLocaleString("en-US")} fault locations each, ${size.faultTypes} fault type(s), each scenario's limits), over the budget of ${budget.toLocaleString("en-US")}: study fewer scenarios, buses or fault types, or fewer points along the lines (criteria.linePoints_pct)`,
    );
    this.name = "StudyTooLarge";
  }
}

/** Throws StudyTooLarge when the study would exceed `budget` fault cases. */
export function checkStudySize(project: Project, options: StudyOptions = {}, budget = STUDY_CASE_BUDGET): StudySize {
  const size = studySize(project, options);
  if (size.cases > budget) throw new StudyTooLarge(size, budget);
  return size;
}
