import { describe, expect, it } from "vitest";
import type { Verdict } from "../../../src/study/types.ts";
import { linkStatuses } from "../../../renderer/panes/chain/linkStatus.ts";

const base = { scenario: "grid", numbers: {}, explanation: "" };

describe("colour of a chain step", () => {
  const verdicts: Verdict[] = [
    { ...base, id: "1", kind: "sensitivity", status: "pass", caseId: "C1", device: "F1", other: null },
    { ...base, id: "2", kind: "selectivity", status: "fail", caseId: "C1", device: "F1", other: "R2" },
    { ...base, id: "3", kind: "speed", status: "warn", caseId: "C1", device: "R2", other: null },
    { ...base, id: "4", kind: "blinding", status: "fail", caseId: "C2", device: "R2", other: "G1" },
    { ...base, id: "5", kind: "blinding", status: "warn", caseId: "C1", device: "R3", other: "G1" },
  ];
  const s = linkStatuses(verdicts, "C1");
  it("is the worst verdict naming the device in the case", () => {
    // F1: pass and fail -> fail (worst of the two, fixture above)
    expect(s.get("F1")).toBe("fail");
  });
  it("counts a failed selectivity pair against the backup too", () => {
    // R2: its own warn plus the failed pair F1/R2 -> fail; verdict 4 belongs to another case
    expect(s.get("R2")).toBe("fail");
  });
  it("does not colour the infeed source named by a blinding verdict", () => {
    expect(s.get("G1")).toBeUndefined();
    expect(s.get("R3")).toBe("warn");
  });
});
