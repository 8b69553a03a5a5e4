import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { applyChanges } from "../../../renderer/store/applyChanges.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { newElement } from "../../../renderer/canvas/newElement.ts";
import type { Element, Project } from "../../../src/model/schema.ts";

function smallNetwork(): Project {
  const p = newProject("t");
  const add = (e: Element) => p.elements.push(e);
  add({ ...newElement("bus", p), un_kV: 11 } as Element);
  add(newElement("bus", p));
  add({ ...newElement("transformer", p), hvBus: "B1", lvBus: "B2" } as Element);
  add({ ...newElement("grid", p), bus: "B1" } as Element);
  add(newElement("relay", p, { element: "T1", end: "from" }));
  p.layout = { B1: { x: 0, y: 0, w: 200 }, B2: { x: 0, y: 200 }, T1: { x: 0, y: 100 }, N1: { x: 0, y: -80 } };
  p.scenarios[0].outOfService = ["N1"];
  return p;
}

describe("applyChanges, the one write path of the document", () => {
  it("removing a bus leaves the transformer in place with that terminal not connected", () => {
    const next = applyChanges(smallNetwork(), [{ type: "removeElements", ids: ["B2"] }]);
    const t = next.elements.find((e) => e.id === "T1");
    expect(t).toMatchObject({ hvBus: "B1", lvBus: "" });
    expect(next.layout.B2).toBeUndefined();
  });

  it("removing an element removes the devices that look into it and its scenario entries", () => {
    const next = applyChanges(smallNetwork(), [{ type: "removeElements", ids: ["T1", "N1"] }]);
    expect(next.elements.map((e) => e.id)).toEqual(["B1", "B2"]);
    expect(next.scenarios[0].outOfService).toEqual([]);
  });

  it("sets a nested field by path, leaving its siblings as they were", () => {
    const next = applyChanges(smallNetwork(), [{ type: "setField", id: "R1", path: ["functions", 0, "multiplier"], value: 0.3 }]);
    const r = next.elements.find((e) => e.id === "R1");
    expect(r?.kind === "relay" && r.functions[0]).toMatchObject({ multiplier: 0.3, pickup_A: 200, curve: "iec-standard-inverse" });
  });

  it("refuses to change an element's id or to add a second element with a used id", () => {
    expect(() => applyChanges(smallNetwork(), [{ type: "setField", id: "B1", path: ["id"], value: "X" }])).toThrow(/B1/);
    const p = smallNetwork();
    expect(() => applyChanges(p, [{ type: "addElement", element: p.elements[0] }])).toThrow(/B1/);
  });

  it("moves nodes and keeps a bus's width", () => {
    const next = applyChanges(smallNetwork(), [{ type: "moveNodes", places: { B1: { x: 40, y: 10 } } }]);
    expect(next.layout.B1).toEqual({ x: 40, y: 10, w: 200 });
  });

  it("switches a source in and out of a scenario", () => {
    const p = smallNetwork();
    const inAgain = applyChanges(p, [{ type: "setOutOfService", scenarioId: p.scenarios[0].id, elementId: "N1", out: false }]);
    expect(inAgain.scenarios[0].outOfService).toEqual([]);
    const outAgain = applyChanges(inAgain, [{ type: "setOutOfService", scenarioId: p.scenarios[0].id, elementId: "N1", out: true }]);
    expect(outAgain.scenarios[0].outOfService).toEqual(["N1"]);
  });

  it("never changes the document it is given (property)", () => {
    const ids = ["B1", "B2", "T1", "N1", "R1"];
    const change = fc.oneof(
      fc.record({ type: fc.constant("removeElements" as const), ids: fc.subarray(ids) }),
      fc.record({ type: fc.constant("moveNodes" as const), places: fc.dictionary(fc.constantFrom(...ids), fc.record({ x: fc.integer(), y: fc.integer() })) }),
      fc.record({ type: fc.constant("setField" as const), id: fc.constantFrom("B1", "B2"), path: fc.constant<(string | number)[]>(["un_kV"]), value: fc.double({ min: 0.1, max: 100 }) }),
    );
    fc.assert(
      fc.property(fc.array(change, { maxLength: 5 }), (changes) => {
        const p = smallNetwork();
        const before = JSON.stringify(p);
        try {
          applyChanges(p, changes);
        } catch {
          // an edit of an element removed earlier in the batch is refused; the input must still be intact
        }
        expect(JSON.stringify(p)).toBe(before);
      }),
    );
  });
});
