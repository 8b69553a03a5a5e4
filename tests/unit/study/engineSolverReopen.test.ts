// The study's re-solves after openings go through the engine's low-rank update of the scenario's own
// factorization (src/engine/reopen). Checked against the same network built afresh with the opened
// elements taken out (an independent compile and factorization): the same device currents to 1e-8 (the refined
// converter iteration stops at 1e-9 of each unit's rated current, so converged answers differ by about that).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { loadProject } from "../../../src/model/projectFile.ts";
import { engineSolver } from "../../../src/study/engineSolver.ts";
import { faultLocations } from "../../../src/study/faultCases.ts";
import type { FaultSnapshot } from "../../../src/study/studySolver.ts";
import { FAULT_TYPES } from "../../../src/study/types.ts";

const loaded = loadProject(readFileSync(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8"));
if (!loaded.ok) throw new Error(loaded.error.messages.join("\n"));
const project = loaded.project;

function expectSame(a: FaultSnapshot, b: FaultSnapshot, where: string) {
  expect(Math.abs(a.iFault_A - b.iFault_A), `${where}: fault current`).toBeLessThanOrEqual(1e-8 * Math.max(1, b.iFault_A) + 1e-6);
  const ids = new Set([...Object.keys(a.readings), ...Object.keys(b.readings)]);
  for (const id of ids) {
    const pa = a.readings[id]?.m.phase_A ?? [0, 0, 0];
    const pb = b.readings[id]?.m.phase_A ?? [0, 0, 0];
    for (let k = 0; k < 3; k++) expect(Math.abs(pa[k] - pb[k]), `${where}: ${id} phase ${k}`).toBeLessThanOrEqual(1e-8 * Math.max(1, pb[k]) + 1e-3);
  }
}

describe("re-solves with device ends opened", () => {
  const scenario = project.scenarios.find((s) => s.id === "grid-all")!;
  const locations = faultLocations(project, scenario);
  // the genset's breaker and the utility tie relay opened: the genset leaves, the incomer cable is cut at its
  // utility end (a cable opened at one end, with no shunt capacitance, carries nothing)
  const open = [
    { element: "GEN1", end: "terminal" as const },
    { element: "C-INC", end: "from" as const },
  ];
  const fresh = { ...scenario, outOfService: [...scenario.outOfService, "GEN1", "C-INC"] };

  it("agree with a fresh compile of the network without the opened elements, at every location and fault type", () => {
    const solver = engineSolver(project);
    const reference = engineSolver(project);
    for (const type of FAULT_TYPES) {
      const updated = solver.solveOpenedEach!(scenario, open, locations, [type], "min");
      const rebuilt = reference.solveEach!(fresh, locations, type, "min");
      locations.forEach((loc, k) => {
        if (loc.kind === "line" && loc.line === "C-INC") return; // the opened cable itself is gone in the rebuilt network
        expectSame(updated(k, type), rebuilt(k), `${type} at ${JSON.stringify(loc)}`);
      });
    }
  });

  it("answer one fault the same way as the batch", () => {
    const solver = engineSolver(project);
    const batch = solver.solveOpenedEach!(scenario, open, locations, ["3ph", "LG"], "max");
    locations.slice(0, 6).forEach((loc, k) => {
      expectSame(solver.solveOne(scenario, loc, "LG", "max", open), batch(k, "LG"), `LG at ${JSON.stringify(loc)}`);
      expectSame(solver.solveOne(scenario, loc, "3ph", "max", open), batch(k, "3ph"), `3ph at ${JSON.stringify(loc)}`);
    });
  });
});
