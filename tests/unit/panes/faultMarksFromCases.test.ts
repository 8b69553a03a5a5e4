import { describe, expect, it } from "vitest";
import type { CaseResult, FaultCase } from "../../../src/study/types.ts";
import { emptyCaseOperation } from "../../../src/study/types.ts";
import { faultMarksFromCases } from "../../../renderer/panes/tcc/faultMarksFromCases.ts";

const fc = (scenario: string, bus: string, faultType: FaultCase["faultType"], limit: FaultCase["limit"]): FaultCase => ({
  id: `${scenario}|bus:${bus}|${faultType}|${limit}`,
  scenario,
  location: { kind: "bus", bus },
  faultType,
  limit,
  label: "",
});
const result = (f: FaultCase, iFault_A: number): CaseResult => ({ faultCase: f, iFault_A, responses: [], chains: { caseId: f.id, paths: [], idealIsolation: [] }, operation: emptyCaseOperation(), verdictIds: [] });

describe("fault-current marks of the selected location", () => {
  const sel = fc("grid", "MV", "3ph", "max");
  const cases = [
    result(sel, 8000),
    result(fc("grid", "MV", "3ph", "min"), 6500),
    result(fc("island", "MV", "3ph", "max"), 900),
    result(fc("island", "MV", "LG", "max"), 700),
    result(fc("grid", "LV", "3ph", "max"), 20000),
  ];
  const names = new Map([
    ["grid", "Grid-tied"],
    ["island", "Islanded"],
  ]);

  it("marks the same fault type in every scenario and limit, in rising current", () => {
    const marks = faultMarksFromCases(cases, sel, { fault_kV: 11, reference_kV: 11, scenarioNames: names });
    // three 3ph cases at MV (fixture); the LV case and the LG case are left out
    expect(marks.map((m) => m.label)).toEqual(["3ph max, Islanded", "3ph min, Grid-tied", "3ph max, Grid-tied"]);
  });

  it("refers the currents to the plot voltage", () => {
    const marks = faultMarksFromCases(cases, sel, { fault_kV: 11, reference_kV: 0.4 });
    // 8000 A at 11 kV is 8000 * 11 / 0.4 = 220 000 A at 0.4 kV (ideal transformer ratio, hand calculation)
    expect(marks[marks.length - 1].current_A).toBeCloseTo(220000, 6);
  });

  it("can mark every fault type at the location", () => {
    expect(faultMarksFromCases(cases, sel, { fault_kV: 11, reference_kV: 11, sameFaultType: false })).toHaveLength(4);
  });
});
