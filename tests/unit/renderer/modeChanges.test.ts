import { describe, it, expect } from "vitest";
import { applyChanges } from "../../../renderer/store/applyChanges.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { newElement } from "../../../renderer/canvas/newElement.ts";
import type { Element, Project } from "../../../src/model/schema.ts";

function twoModes(): Project {
  const p = newProject("modes");
  p.elements.push({ ...newElement("bus", p), un_kV: 0.4 } as Element);
  p.elements.push(newElement("bus", p));
  p.elements.push({ ...newElement("switch", p), busA: "B1", busB: "B2" } as Element);
  p.scenarios.push({ id: "island", name: "Islanded", outOfService: [], switchStates: {}, limits: ["max", "min"] });
  return p;
}

describe("operating mode edits", () => {
  it("renames and describes a mode; an empty description is dropped", () => {
    const p = twoModes();
    const named = applyChanges(p, [{ type: "updateScenario", scenarioId: "island", patch: { name: "Island, genset only", description: "Utility tie open" } }]);
    expect(named.scenarios[1]).toMatchObject({ name: "Island, genset only", description: "Utility tie open" });
    const cleared = applyChanges(named, [{ type: "updateScenario", scenarioId: "island", patch: { description: "" } }]);
    expect("description" in cleared.scenarios[1]).toBe(false);
    expect(p.scenarios[1].name).toBe("Islanded"); // the input is never mutated
  });

  it("refuses an empty name and an unknown mode with a message", () => {
    expect(() => applyChanges(twoModes(), [{ type: "updateScenario", scenarioId: "island", patch: { name: "  " } }])).toThrow(/needs a name/);
    expect(() => applyChanges(twoModes(), [{ type: "updateScenario", scenarioId: "nope", patch: { name: "x" } }])).toThrow(/nope/);
  });

  it("sets a switch open in one mode only, and back to its drawn state", () => {
    const opened = applyChanges(twoModes(), [{ type: "setSwitchState", scenarioId: "island", switchId: "SW1", closed: false }]);
    expect(opened.scenarios[1].switchStates).toEqual({ SW1: false });
    expect(opened.scenarios[0].switchStates).toEqual({});
    const drawn = applyChanges(opened, [{ type: "setSwitchState", scenarioId: "island", switchId: "SW1", closed: null }]);
    expect(drawn.scenarios[1].switchStates).toEqual({});
  });

  it("deletes a mode but never the last one", () => {
    const one = applyChanges(twoModes(), [{ type: "removeScenario", scenarioId: "island" }]);
    expect(one.scenarios.map((s) => s.id)).toEqual([twoModes().scenarios[0].id]);
    expect(() => applyChanges(one, [{ type: "removeScenario", scenarioId: one.scenarios[0].id }])).toThrow(/at least one/);
  });
});
