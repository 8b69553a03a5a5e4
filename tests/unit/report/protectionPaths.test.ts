import { describe, expect, it } from "vitest";
import { protectionPaths } from "../../../src/report/protectionPaths.ts";
import { emptyCaseOperation, type CaseResult, type FaultLimit } from "../../../src/study/types.ts";

function fakeCase(id: string, scenario: string, limit: FaultLimit, chains: { devices: string[]; current_A: number }[]): CaseResult {
  return {
    faultCase: { id, scenario, location: { kind: "bus", bus: "B" }, faultType: "3ph", limit, label: id },
    iFault_A: 0,
    responses: [],
    operation: emptyCaseOperation(),
    chains: {
      caseId: id,
      idealIsolation: [],
      paths: chains.map((c) => ({
        source: "G",
        sourceName: "G",
        sourceKind: "grid" as const,
        elements: [],
        links: c.devices.map((d, k) => ({ device: d, deviceName: d, depth: k, role: k ? ("backup" as const) : ("primary" as const), current_A: c.current_A, tClear_s: null, marginToNext_s: null })),
      })),
    },
    verdictIds: [],
  };
}

describe("protection paths", () => {
  it("draws a chain that is part of a longer chain with the longer one", () => {
    const paths = protectionPaths([
      fakeCase("a", "s1", "max", [{ devices: ["F1", "Q1", "R1"], current_A: 5000 }]),
      fakeCase("b", "s2", "max", [{ devices: ["Q1", "R1"], current_A: 9000 }]),
      fakeCase("c", "s1", "min", [{ devices: ["F1", "Q1", "R1"], current_A: 2000 }]),
    ]);
    expect(paths).toHaveLength(1);
    expect(paths[0].devices).toEqual(["F1", "Q1", "R1"]);
    expect(paths[0].scenarios).toEqual(["s1", "s2"]);
    // the primary's own extremes: 5000 A at max, 2000 A at min (case b has a different primary)
    expect(paths[0].primaryMax_A).toBe(5000);
    expect(paths[0].primaryMin_A).toBe(2000);
  });

  it("marks earth-fault plots with the primary's residual current in LG and LLG cases only", () => {
    const lg = fakeCase("e", "s1", "min", [{ devices: ["F1", "Q1"], current_A: 900 }]);
    lg.faultCase.faultType = "LG";
    lg.responses = [{ device: "F1", iResidual_A: 850 } as CaseResult["responses"][number]];
    const three = fakeCase("t", "s1", "max", [{ devices: ["F1", "Q1"], current_A: 1200 }]);
    three.responses = [{ device: "F1", iResidual_A: 5 } as CaseResult["responses"][number]];
    const [p] = protectionPaths([lg, three]);
    expect(p.residualMax_A).toBe(850);
    expect(p.residualMin_A).toBe(850);
    expect(p.primaryMax_A).toBe(1200);
    expect(p.primaryMin_A).toBe(900);
  });

  it("keeps chains that only share devices out of order", () => {
    const paths = protectionPaths([
      fakeCase("a", "s1", "max", [{ devices: ["Q1", "R1"], current_A: 10 }]),
      fakeCase("b", "s1", "max", [{ devices: ["R1", "Q1"], current_A: 10 }]),
    ]);
    expect(paths.map((p) => p.devices.join(">"))).toEqual(["Q1>R1", "R1>Q1"]);
  });
});
