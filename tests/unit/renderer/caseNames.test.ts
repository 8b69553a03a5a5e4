import { describe, it, expect } from "vitest";
import { rowLabelByName, rowGroupByName, nameWithId, rowCaption } from "../../../renderer/app/caseNames.ts";
import { caseRowId } from "../../../src/study/keys.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import type { Element } from "../../../src/model/schema.ts";

function doc() {
  const p = newProject("names");
  p.elements.push({ kind: "bus", id: "LV-A", name: "Main switchboard section A", un_kV: 0.4 } as Element, { kind: "bus", id: "B9", un_kV: 0.4 } as Element);
  p.elements.push({ kind: "line", id: "C1", name: "Dock feeder" } as unknown as Element);
  return p;
}

describe("cases by name", () => {
  it("labels a bus case with the bus's name and id, and words for the fault and the limit", () => {
    const id = caseRowId({ location: { kind: "bus", bus: "LV-A" }, faultType: "LL", limit: "min" });
    expect(rowLabelByName(doc(), { id, label: "LL fault on bus LV-A (min)" })).toBe("Line-line fault on Main switchboard section A (LV-A), minimum");
    expect(rowGroupByName(doc(), { id, label: "" })).toEqual({ key: "bus:LV-A", label: "Main switchboard section A (LV-A)" });
  });

  it("groups every point along a line under the line's name", () => {
    const id = caseRowId({ location: { kind: "line", line: "C1", pct: 50 }, faultType: "3ph", limit: "max" });
    expect(rowLabelByName(doc(), { id, label: "" })).toBe("Three-phase fault on Dock feeder (C1) at 50 %, maximum");
    expect(rowGroupByName(doc(), { id, label: "" })).toEqual({ key: "line:C1", label: "Dock feeder (C1), along the line" });
  });

  it("under its group's header a row says only the fault, the limit and the point along a line", () => {
    expect(rowCaption({ id: caseRowId({ location: { kind: "bus", bus: "LV-A" }, faultType: "LL", limit: "min" }), label: "" })).toBe("Line-line, minimum");
    expect(rowCaption({ id: caseRowId({ location: { kind: "line", line: "C1", pct: 50 }, faultType: "3ph", limit: "max" }), label: "" })).toBe("at 50 %: Three-phase, maximum");
  });

  it("an unnamed element shows its id; an unknown row keeps the study's label", () => {
    expect(nameWithId(doc(), "B9")).toBe("B9");
    expect(rowLabelByName(doc(), { id: "odd", label: "as the study said" })).toBe("as the study said");
  });
});
