// Adapter from study results to the pane's fault-current marks: the selected fault location in every
// scenario (and both IEC 60909 limits), referred to the plot voltage.
import type { CaseResult, FaultCase, FaultLocation } from "../../../src/study/types.ts";
import type { TccFaultMark } from "./tccTypes.ts";

export interface FaultMarkOptions {
  /** Nominal voltage at the fault location, kV. */
  fault_kV: number;
  /** Plot reference voltage, kV. */
  reference_kV: number;
  /** Scenario id -> name for the labels (default: the id). */
  scenarioNames?: ReadonlyMap<string, string>;
  /** Only the selected fault type (default true); false marks every fault type at the location. */
  sameFaultType?: boolean;
}

const sameLocation = (a: FaultLocation, b: FaultLocation) =>
  a.kind === "bus" ? b.kind === "bus" && a.bus === b.bus : b.kind === "line" && a.line === b.line && a.pct === b.pct;

/** Marks of the cases at `selected`'s location, in rising current. */
export function faultMarksFromCases(cases: readonly CaseResult[], selected: FaultCase, opts: FaultMarkOptions): TccFaultMark[] {
  const k = opts.fault_kV / opts.reference_kV;
  return cases
    .filter((c) => sameLocation(c.faultCase.location, selected.location))
    .filter((c) => opts.sameFaultType === false || c.faultCase.faultType === selected.faultType)
    .filter((c) => Number.isFinite(c.iFault_A) && c.iFault_A > 0)
    .map((c) => ({
      id: c.faultCase.id,
      label: `${c.faultCase.faultType} ${c.faultCase.limit}, ${opts.scenarioNames?.get(c.faultCase.scenario) ?? c.faultCase.scenario}`,
      current_A: c.iFault_A * k,
      scenarioId: c.faultCase.scenario,
    }))
    .sort((a, b) => a.current_A - b.current_A);
}
