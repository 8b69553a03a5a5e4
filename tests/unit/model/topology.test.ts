// Islands by union of buses over in-service branches and closed switches, checked against
// hand-drawn small networks (each expected grouping worked out by hand in the comments).
import { describe, it, expect } from "vitest";
import { findIslands, isSwitchClosed } from "../../../src/model/topology.ts";
import { projectSchema, type Project, type Scenario } from "../../../src/model/schema.ts";
import { summarizeProject } from "../../../src/model/projectSummary.ts";
import { smallDoc } from "./fixtures/smallProject.ts";

const parse = (doc: unknown): Project => projectSchema.parse(doc);

describe("findIslands", () => {
  it("joins MV, LV and DOCK through the transformer and the cable into one island fed by grid and genset", () => {
    const p = parse(smallDoc());
    expect(findIslands(p, p.scenarios[0])).toEqual([{ buses: ["MV", "LV", "DOCK"], sources: ["G", "GEN"] }]);
  });

  it("splits at an out-of-service branch and drops out-of-service sources", () => {
    const p = parse(smallDoc());
    const s: Scenario = { ...p.scenarios[1], outOfService: ["G", "T1"] };
    // MV alone (grid out: no source); LV + DOCK with the genset
    expect(findIslands(p, s)).toEqual([
      { buses: ["MV"], sources: [] },
      { buses: ["LV", "DOCK"], sources: ["GEN"] },
    ]);
  });

  it("removes an out-of-service bus with the elements on it", () => {
    const p = parse(smallDoc());
    const s: Scenario = { ...p.scenarios[0], outOfService: ["LV"] };
    // without LV, DOCK is cut off; GEN sits on LV and is gone with it
    expect(findIslands(p, s)).toEqual([
      { buses: ["MV"], sources: ["G"] },
      { buses: ["DOCK"], sources: [] },
    ]);
  });

  it("honours a switch's own state unless the scenario overrides it", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "bus", id: "LV2", un_kV: 0.4 }, { kind: "switch", id: "BC", busA: "LV", busB: "LV2", closed: false });
    const p = parse(doc);
    const sw = p.elements.find((e) => e.id === "BC")!;
    expect(isSwitchClosed(sw, p.scenarios[0])).toBe(false);
    expect(findIslands(p, p.scenarios[0])).toHaveLength(2);
    const closed: Scenario = { ...p.scenarios[0], switchStates: { BC: true } };
    expect(isSwitchClosed(sw, closed)).toBe(true);
    expect(findIslands(p, closed)).toHaveLength(1);
  });

  it("uses the network as drawn when no scenario is given", () => {
    expect(findIslands(parse(smallDoc()))).toHaveLength(1);
  });
});

describe("summarizeProject", () => {
  it("counts elements by kind, groups buses by voltage (highest first) and lists each scenario's sources", () => {
    const s = summarizeProject(parse(smallDoc()));
    expect(s.countsByKind).toEqual({ bus: 3, grid: 1, transformer: 1, line: 1, generator: 1, load: 1, lvbreaker: 1, relay: 1 });
    expect(s.busesByVoltage).toEqual([
      { un_kV: 11, buses: ["MV"] },
      { un_kV: 0.4, buses: ["LV", "DOCK"] },
    ]);
    expect(s.scenarios[1]).toEqual({
      id: "S2",
      name: "Islanded",
      sourcesOutOfService: ["G"],
      otherOutOfService: [],
      switchStates: {},
      sourcesInService: ["GEN"],
      energisedIslands: 1,
    });
  });
});
