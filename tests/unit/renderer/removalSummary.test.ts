import { describe, it, expect } from "vitest";
import { removalSummary, removalNotice } from "../../../renderer/store/removalSummary.ts";
import { applyChanges } from "../../../renderer/store/applyChanges.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { newElement } from "../../../renderer/canvas/newElement.ts";
import type { Element, Project } from "../../../src/model/schema.ts";

function network(): Project {
  const p = newProject("t");
  const add = (e: Element) => p.elements.push(e);
  add({ ...newElement("bus", p), name: "HV board", un_kV: 11 } as Element);
  add({ ...newElement("bus", p), name: "LV board" } as Element);
  add({ ...newElement("transformer", p), hvBus: "B1", lvBus: "B2" } as Element);
  add({ ...newElement("load", p), bus: "B2" } as Element);
  add(newElement("relay", p, { element: "T1", end: "from" }));
  return p;
}

describe("what a deletion takes and leaves", () => {
  it("a bus: the transformer and the load stay, each with a terminal not connected", () => {
    const s = removalSummary(network(), ["B2"]);
    expect(s.removed).toEqual(["LV board (B2)"]);
    expect(s.devicesToo).toEqual([]);
    expect(s.leftUnconnected).toEqual(["Transformer 1 (T1): its LV bus", "Load 1 (LD1): its bus"]);
    // the summary agrees with what the reducer does
    const after = applyChanges(network(), [{ type: "removeElements", ids: ["B2"] }]);
    expect(after.elements.find((e) => e.id === "T1")).toMatchObject({ lvBus: "" });
    expect(after.elements.find((e) => e.id === "LD1")).toMatchObject({ bus: "" });
  });

  it("a transformer takes its relay", () => {
    const s = removalSummary(network(), ["T1"]);
    expect(s.devicesToo).toEqual(["Relay 1 (R1)"]);
    expect(s.leftUnconnected).toEqual([]);
    expect(removalNotice(s).details).toEqual(["Also deleted (protection on it): Relay 1 (R1)"]);
  });

  it("the notice counts what is left not connected", () => {
    const n = removalNotice(removalSummary(network(), ["B2"]));
    expect(n.text).toMatch(/^Deleted LV board \(B2\)\. 2 elements are left with a terminal not connected\./);
    expect(n.details).toHaveLength(2);
  });
});
