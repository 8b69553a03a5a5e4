// Hardening report, item 2: an engine failure became 0 A (S"k 1e308 MVA, uk 1e-300 %, base 1e-300 MVA passed
// validation, the LDL^T factorisation overflowed, and callers scored 0 A). The engine now refuses such stamps
// when compiling, naming the element and its fields; a factorisation that still fails throws an EngineFailure
// naming the buses and elements; and the bus table marks a figure that is not finite as not computed.
// The projects here bypass the loader on purpose (the loader's physical ranges refuse them first).
import { describe, expect, it } from "vitest";
import { projectSchema, type Project } from "../../../src/model/schema.ts";
import { busFaultTable, busFaultTableWith, compileNetwork, sweepFaults, EngineFailure, NOT_SOLVED, OUT_OF_RANGE, type SweepResult } from "../../../src/engine/index.ts";
import type { Model } from "../../../src/engine/network/model.ts";
import { smallDoc } from "../model/fixtures/smallProject.ts";

function project(change: (p: Project) => void): Project {
  const p = projectSchema.parse(smallDoc());
  change(p);
  return p;
}
const el = (p: Project, id: string) => p.elements.find((e) => e.id === id) as unknown as Record<string, unknown>;

describe("stamps outside the engine's arithmetic", () => {
  const cases: [string, (p: Project) => void, string, RegExp][] = [
    ['S"k 1e308 MVA', (p) => (el(p, "G").skMax_MVA = 1e308), "G", /^Grid feeder G "Utility": .*check skMax_MVA/],
    ["uk 1e-300 % with ur 0", (p) => Object.assign(el(p, "T1"), { uk_pct: 1e-300, ur_pct: 0 }), "T1", /^Transformer T1 "Main transformer": .*check sr_MVA, uk_pct/],
    ["a base of 1e-300 MVA", (p) => (p.meta.baseMVA = 1e-300), "T1", /on the 1e-300 MVA base .*meta\.baseMVA$/],
  ];
  for (const [what, change, element, text] of cases) {
    it(`refuses ${what} when compiling, naming the element`, () => {
      const c = compileNetwork(project(change), { limit: "max", scenario: "S1" });
      expect(c.ok).toBe(false);
      if (c.ok) return;
      const m = c.errors.find((e) => e.element === element);
      expect(m).toMatchObject({ level: "error", code: OUT_OF_RANGE });
      expect(m!.text).toMatch(text);
    });
  }

  it("gives the bus table a failed run with those errors, not a table of zeros", () => {
    const table = busFaultTable(project((p) => (el(p, "G").skMax_MVA = 1e308)));
    const run = table.runs.find((r) => r.scenario === "S1" && r.limit === "max")!;
    expect(run.ok).toBe(false);
    expect(run.buses).toEqual([]);
    expect(run.messages[0]).toMatchObject({ code: OUT_OF_RANGE, element: "G" });
  });
});

describe("a factorisation that fails", () => {
  it("throws an EngineFailure naming the bus and the elements there", () => {
    const c = compileNetwork(project(() => undefined), { limit: "max", scenario: "S1" });
    if (!c.ok) throw new Error("fixture must compile");
    // a shunt path of zero admittance at the grid's node: the pivot there is exactly zero
    const model = (c.network.internal as { model: Model }).model;
    const grid = model.shunts.find((s) => s.element === "G")!;
    grid.y = [{ re: 0, im: 0 }, { re: 0, im: 0 }, { re: 0, im: 0 }];
    let thrown: unknown;
    try {
      sweepFaults(c.network, { types: ["3ph"], devices: [] });
    } catch (err) {
      thrown = err;
    }
    expect(thrown).toBeInstanceOf(EngineFailure);
    const f = thrown as EngineFailure;
    expect(f.code).toBe(NOT_SOLVED);
    expect(f.buses).toEqual(["MV"]);
    expect(f.elements).toEqual(expect.arrayContaining(["G", "T1"]));
    expect(f.message).toMatch(/sequence network could not be solved at bus MV \(elements there: .*G.*\)/);
  });

  it("becomes a failed run of the bus table, the others unaffected", async () => {
    const p = project(() => undefined);
    const table = await busFaultTableWith(p, undefined, async (task, network) => {
      if (task.scenarioId === "S2") throw new EngineFailure("The positive-sequence network could not be solved at bus LV", ["LV"], ["GEN"]);
      return sweepFaults(network, { types: ["3ph", "LL", "LG", "LLG"], devices: [] });
    });
    expect(table.runs.map((r) => [r.scenario, r.ok])).toEqual([["S1", true], ["S1", true], ["S2", false], ["S2", false]]);
    expect(table.runs[2].messages).toEqual([{ level: "error", code: NOT_SOLVED, text: "The positive-sequence network could not be solved at bus LV", element: "GEN" }]);
  });
});

describe("a result that is not a finite number", () => {
  it("stays NaN and fails the run, naming the buses", async () => {
    const p = project(() => undefined);
    const table = await busFaultTableWith(p, "S1", async (_task, network) => {
      const sw: SweepResult = sweepFaults(network, { types: ["3ph", "LL", "LG", "LLG"], devices: [] });
      const lv = sw.busIds.indexOf("LV");
      sw.ikss_kA[lv * sw.types.length] = NaN;
      return sw;
    });
    const run = table.runs[0];
    expect(run.ok).toBe(false);
    expect(run.buses.find((b) => b.bus === "LV")!.ikss_kA["3ph"]).toBeNaN();
    expect(JSON.parse(JSON.stringify(run.buses.find((b) => b.bus === "LV")!.ikss_kA))["3ph"]).toBeNull();
    expect(run.messages[0]).toMatchObject({ level: "error", code: NOT_SOLVED, element: "LV" });
    expect(run.messages[0].text).toMatch(/^Buses LV: the engine could not compute their fault currents/);
  });
});
