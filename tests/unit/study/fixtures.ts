// Small hand-built projects and a solver that returns hand-computed currents, so the study logic can be
// checked against arithmetic done outside the project.
import { projectSchema, type Project, type Scenario } from "../../../src/model/schema.ts";
import { measurementFromSequence, type Phasor } from "../../../src/protection/index.ts";
import { polar } from "../../../src/protection/phasor.ts";
import type { DeviceReading, FaultSnapshot, OpenEnd, StudySolver } from "../../../src/study/studySolver.ts";
import type { FaultLocation } from "../../../src/study/types.ts";

export function makeProject(elements: unknown[], scenarios: unknown[] = [{ id: "s1", name: "Base", limits: ["max"] }], criteria: unknown = {}): Project {
  return projectSchema.parse({
    format: "islet-project",
    formatVersion: 1,
    meta: { name: "test" },
    criteria,
    elements,
    scenarios,
  });
}

/** A balanced (3ph) reading of `i_A` flowing forward (lagging V1 = 1 pu by 80 degrees) or reverse. */
export function reading3ph(i_A: number, direction: "forward" | "reverse", v1_pu = 0.5): DeviceReading {
  const i1: Phasor = polar(i_A, direction === "forward" ? -80 : 100);
  const zero: Phasor = { re: 0, im: 0 };
  const m = measurementFromSequence({ i0_A: zero, i1_A: i1, i2_A: zero, v0_pu: zero, v1_pu: polar(v1_pu, 0), v2_pu: zero });
  return { m, direction };
}

export type CurrentTable = (scenario: Scenario, loc: FaultLocation) => Partial<Record<string, DeviceReading>>;

/**
 * A solver answering from a table. Any opened end kills every current (the tables describe radial
 * networks fed from one side, where the first opening on the path clears the fault).
 */
export function tableSolver(
  table: CurrentTable,
  load: Record<string, number> | null = null,
  /** Readings with some ends opened; default: no current at all. */
  opened: (scenario: Scenario, loc: FaultLocation, open: OpenEnd[]) => Record<string, DeviceReading> = () => ({}),
): StudySolver & { calls: number } {
  const snap = (scenario: Scenario, loc: FaultLocation, open: OpenEnd[]): FaultSnapshot => {
    const readings = (open.length ? opened(scenario, loc, open) : table(scenario, loc)) as Record<string, DeviceReading>;
    const iFault_A = Object.values(readings).reduce((m, r) => Math.max(m, ...r.m.phase_A), 0);
    return { iFault_A, readings, messages: [] };
  };
  const solver = {
    calls: 0,
    solveMany(scenario: Scenario, locations: FaultLocation[]) {
      solver.calls++;
      return locations.map((l) => snap(scenario, l, []));
    },
    solveOne(scenario: Scenario, location: FaultLocation, _t: unknown, _l: unknown, open: OpenEnd[]) {
      solver.calls++;
      return snap(scenario, location, open);
    },
    loadCurrents() {
      return load;
    },
  };
  return solver as StudySolver & { calls: number };
}

/** IEC 60255-151:2009 Table 1 standard inverse: t = TMS * 0.14 / (M^0.02 - 1). */
export const iecSI_s = (i_A: number, pickup_A: number, tms: number): number => (tms * 0.14) / ((i_A / pickup_A) ** 0.02 - 1);

export const NO_TOLERANCE = { pickup_pct: 0, time_pct: 0, time_min_s: 0 };
