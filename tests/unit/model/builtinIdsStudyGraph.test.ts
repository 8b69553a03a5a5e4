// Ids that are names of Object.prototype's properties ("constructor", "toString", ...) are ordinary ids:
// the study's graph of a scenario must treat a normally-open switch with such an id as open.
import { describe, expect, it } from "vitest";
import { projectSchema } from "../../../src/model/schema.ts";
import { scenarioNetwork } from "../../../src/study/scenarioNetwork.ts";

const BUILTIN_NAMES = ["constructor", "toString", "hasOwnProperty", "valueOf", "isPrototypeOf", "__proto__"];

function withOpenCoupler(switchId: string) {
  return projectSchema.parse({
    format: "islet-project",
    formatVersion: 1,
    meta: { name: "coupler" },
    elements: [
      { kind: "bus", id: "A", un_kV: 0.4 },
      { kind: "bus", id: "B", un_kV: 0.4 },
      { kind: "switch", id: switchId, busA: "A", busB: "B", closed: false },
    ],
    scenarios: [{ id: "s", name: "base" }],
  });
}

describe("study graph with built-in property names as ids", () => {
  for (const id of BUILTIN_NAMES) {
    it(`leaves the open switch ${id} open`, () => {
      const p = withOpenCoupler(id);
      const net = scenarioNetwork(p, p.scenarios[0]);
      expect(net.edges.filter((e) => e.element === id)).toHaveLength(0);
    });
  }
  it("closes it when the scenario says so", () => {
    const p = withOpenCoupler("constructor");
    const scenario = { ...p.scenarios[0], switchStates: { constructor: true } };
    expect(scenarioNetwork(p, scenario).edges.filter((e) => e.element === "constructor")).toHaveLength(2);
  });
});
