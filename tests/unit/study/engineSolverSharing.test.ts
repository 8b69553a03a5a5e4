import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { loadProject } from "../../../src/model/projectFile.ts";
import type { Project, Scenario } from "../../../src/model/schema.ts";
import { compileNetwork, solveFault } from "../../../src/engine/index.ts";
import { engineSolver } from "../../../src/study/engineSolver.ts";
import type { FaultLocation } from "../../../src/study/types.ts";

const loaded = loadProject(readFileSync(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8"));
if (!loaded.ok) throw new Error(loaded.error.messages.join("\n"));
const project = loaded.project;
const scenario = (id: string): Scenario => project.scenarios.find((s) => s.id === id)!;
const buses: FaultLocation[] = project.elements.filter((e) => e.kind === "bus").map((e) => ({ kind: "bus", bus: e.id }));

describe("the engine-bound study solver", () => {
  it("answers one location at a time exactly as it answers them all at once", () => {
    const all = engineSolver(project).solveMany(scenario("grid-all"), buses, "LG", "max");
    const at = engineSolver(project).solveEach!(scenario("grid-all"), buses, "LG", "max");
    buses.forEach((_, k) => expect(at(k)).toEqual(all[k])); // same solver, two read orders: identical data
  });

  it("answers a blinding variant that is another scenario's network with that network's fault currents", () => {
    // island-genset with the genset switched out has the same elements in service as island-inverters
    const solver = engineSolver(project);
    const base = scenario("island-genset");
    const variant: Scenario = { ...base, outOfService: [...base.outOfService, "GEN1"] };
    const viaVariant = solver.solveMany(variant, buses, "3ph", "min");
    // independent computation: the engine's single-fault solver on the island-inverters scenario as drawn
    const compiled = compileNetwork(project, { scenario: "island-inverters", limit: "min" });
    if (!compiled.ok) throw new Error("island-inverters does not compile");
    buses.forEach((loc, k) => {
      const single = solveFault(compiled.network, loc, "3ph");
      expect(viaVariant[k].iFault_A).toBeCloseTo(single.maxPhase_kA * 1000, 3);
    });
    // and the scenario's own sweep, which the variant now shares, gives the very same snapshots
    const own = solver.solveMany(scenario("island-inverters"), buses, "3ph", "min");
    buses.forEach((_, k) => expect(own[k].readings).toEqual(viaVariant[k].readings));
  });

  it("gives the devices asked for the same readings as a full answer, and leaves the others out", () => {
    // blinding variants: grid-all without the PV inverter (no other scenario's network: swept for itself) and
    // island-genset without the genset (island-inverters' network: its whole sweep is shared)
    const variants: Scenario[] = [
      { ...scenario("grid-all"), outOfService: ["INV-PV"] },
      { ...scenario("island-genset"), outOfService: ["GRID", "GEN1"] },
    ];
    const wanted = ["R-T1", "Q-T1", "Q-BESS"];
    // by sweep (singleSolveLimit 0) and by single faults (a limit above the bus count)
    for (const variant of variants)
      for (const singleSolveLimit of [0, 1000]) {
        const full = engineSolver(project, { singleSolveLimit }).solveMany(variant, buses, "LG", "min");
        const some = engineSolver(project, { singleSolveLimit }).solveMany(variant, buses, "LG", "min", wanted);
        buses.forEach((_, k) => {
          const expected = Object.fromEntries(Object.entries(full[k].readings).filter(([id]) => wanted.includes(id)));
          expect(some[k].readings).toEqual(expected); // each device's reading is independent of the others read: identical data
          expect(some[k].iFault_A).toBe(full[k].iFault_A);
        });
        expect(full.some((s, k) => Object.keys(s.readings).length > Object.keys(some[k].readings).length)).toBe(true);
      }
  });

  it("gives sweep measurements the sequence quantities only for relays with a directional or 51V function", () => {
    // R-INC made directional (67): its measurement must carry I1, I2, I0 and the prefault V1
    const withDirectional: Project = {
      ...project,
      elements: project.elements.map((e) => (e.id === "R-INC" && e.kind === "relay" ? { ...e, functions: e.functions.map((f) => ({ ...f, direction: "forward" as const })) } : e)),
    };
    const snaps = engineSolver(withDirectional, { singleSolveLimit: 0 }).solveMany(scenario("grid-all"), buses, "3ph", "max");
    const seen = snaps.filter((s) => s.readings["R-INC"]);
    expect(seen.length).toBeGreaterThan(0);
    for (const s of seen) {
      const m = s.readings["R-INC"].m;
      const seq = m.sequence!;
      // a three-phase fault is balanced: I0 = I2 = 0 and |Ia| = |Ib| = |Ic| = |I1| (symmetrical components, Fortescue)
      expect(Math.hypot(seq.i1_A.re, seq.i1_A.im)).toBeCloseTo(m.phase_A[0], 6);
      expect(Math.hypot(seq.i2_A.re, seq.i2_A.im)).toBeLessThan(1e-6 * m.phase_A[0]);
      // no voltages in a sweep: the prefault voltage (1 pu at the bus's angle) stands in for V1
      expect(Math.hypot(seq.v1_pu.re, seq.v1_pu.im)).toBeCloseTo(1, 12);
      // Q-T1 has no directional or restrained function: nothing reads its sequence quantities
      if (s.readings["Q-T1"]) expect(s.readings["Q-T1"].m.sequence).toBeUndefined();
    }
  });

  it("does not share a network between scenarios with different elements in service", () => {
    const solver = engineSolver(project);
    const all = solver.solveMany(scenario("grid-all"), buses, "3ph", "max");
    const noInverters = solver.solveMany(scenario("grid-no-inverters"), buses, "3ph", "max");
    // the inverters add fault current at every bus they feed (IEC 60909-0:2016, 6.1: every source contributes)
    const larger = buses.filter((_, k) => all[k].iFault_A > noInverters[k].iFault_A + 1e-6).length;
    expect(larger).toBeGreaterThan(0);
  });
});
