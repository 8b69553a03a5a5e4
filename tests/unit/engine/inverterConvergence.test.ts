import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { loadProject } from "../../../src/model/projectFile.ts";
import { compileNetwork, sweepFaults } from "../../../src/engine/index.ts";

// The refined inverter model is a fixed point (each unit's current follows its terminal voltage); on the demo site's
// islanded scenarios, where converters carry most of the fault current and limits switch, every fault must settle.
// Check: the engine's own residual report (|T(x) - x| below 1e-9 of each unit's rated current, TOLERANCE_PU), i.e. self-consistency.
describe("refined inverter iteration on the demo site's islands", () => {
  const loaded = loadProject(readFileSync(join(__dirname, "../../../assets/demo/dairy-coop.islet"), "utf8"));
  if (!loaded.ok) throw new Error("demo");
  for (const scenario of loaded.project.scenarios.filter((s) => s.id.startsWith("island"))) {
    for (const limit of ["max", "min"] as const) {
      it(`converges for every bus and fault type: ${scenario.id}, ${limit}`, () => {
        const c = compileNetwork(loaded.project, { scenario: scenario.id, limit });
        if (!c.ok) throw new Error("compile");
        const sw = sweepFaults(c.network, { inverterModel: "refined", devices: [] });
        expect(sw.messages.filter((m) => m.code === "inverter-not-converged")).toEqual([]);
        for (const v of sw.ikss_kA) expect(Number.isFinite(v)).toBe(true);
      });
    }
  }
});
