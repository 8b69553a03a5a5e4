import { describe, expect, it } from "vitest";
import { runStudy } from "../../../src/study/runStudy.ts";
import { protectionModel } from "../../../src/study/protectionModel.ts";
import type { DeviceReading } from "../../../src/study/studySolver.ts";
import { iecSI_s, makeProject, NO_TOLERANCE, reading3ph, tableSolver } from "./fixtures.ts";

// Bus B (0.4 kV) fed by a grid; feeder F1 to bus X (relay R1), feeder F2 to bus Y (relay R2) where a
// generator GEN runs. A fault at X draws the generator's current backwards through R2.
// Currents (invented for the case, a plausible split): R1 sees 5000 A forward (grid 3500 A + generator 1500 A),
// R2 sees the generator's 1500 A in reverse.
function project(r2Direction: "non-directional" | "forward") {
  return makeProject([
    { kind: "bus", id: "B", un_kV: 0.4 },
    { kind: "bus", id: "X", un_kV: 0.4 },
    { kind: "bus", id: "Y", un_kV: 0.4 },
    { kind: "grid", id: "G", bus: "B", skMax_MVA: 20, skMin_MVA: 20 },
    { kind: "line", id: "F1", fromBus: "B", toBus: "X", length_km: 0.1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.4, x0_ohmPerKm: 0.3, csa_mm2: 240, ampacity_A: 400 },
    { kind: "line", id: "F2", fromBus: "B", toBus: "Y", length_km: 0.1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.4, x0_ohmPerKm: 0.3, csa_mm2: 240, ampacity_A: 400 },
    { kind: "generator", id: "GEN", bus: "Y", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.15, x2_pu: 0.15, x0_pu: 0.05 },
    {
      kind: "relay", id: "R1", at: { element: "F1", end: "from" }, ctPrimary_A: 1000, breakerTime_s: 0.06, tolerance: NO_TOLERANCE,
      functions: [{ id: "51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 800, multiplier: 0.2 }],
    },
    {
      kind: "relay", id: "R2", at: { element: "F2", end: "from" }, ctPrimary_A: 500, breakerTime_s: 0.06, tolerance: NO_TOLERANCE,
      functions: [
        { id: "p", ansi: r2Direction === "forward" ? "67" : "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 400, multiplier: 0.05, direction: r2Direction },
      ],
    },
  ]);
}

// With F2 opened at B the generator is gone and R1 carries the grid's 3500 A.
const solver = tableSolver(
  (_s, loc) => (loc.kind === "bus" && loc.bus === "X" ? { R1: reading3ph(5000, "forward"), R2: reading3ph(1500, "reverse") } : {}),
  null,
  (_s, loc, open): Record<string, DeviceReading> => (loc.kind === "bus" && loc.bus === "X" && open.every((o) => o.element === "F2") ? { R1: reading3ph(3500, "forward") } : {}),
);

describe("sympathetic tripping of a healthy feeder's relay", () => {
  it("fails when R2 trips on the generator's reverse current before R1 clears the fault", async () => {
    const r = await runStudy(project("non-directional"), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["X"] });
    const v = r.verdicts.find((x) => x.id === "sympathetic|R2|s1|bus:X|3ph|max")!;
    // IEC 60255-151 SI: R2 at 1500/400 = 3.75 x trips at t2 = 0.2613 s and opens at t2 + 0.06 s. R1 travels at
    // 5000/800 = 6.25 x (0.750 s to trip) until then, then at 3500/800 = 4.375 x: disk travel (IEC 60255-151, 4.5)
    // gives its trip at t2 + 0.06 + (1 - (t2 + 0.06) / 0.750) * t(4.375 x), and it opens 0.06 s later.
    const t2 = iecSI_s(1500, 400, 0.05);
    const t1Full = iecSI_s(5000, 800, 0.2);
    const t1Trip = t2 + 0.06 + (1 - (t2 + 0.06) / t1Full) * iecSI_s(3500, 800, 0.2);
    expect(v.numbers.trip_s).toBeCloseTo(t2, 3);
    expect(v.numbers.isolated_s).toBeCloseTo(t1Trip + 0.06, 3);
    expect(v.status).toBe("fail");
    expect(v.explanation).toMatch(/flowing back to the fault.*a directional element would restrain it/);
    const c = r.cases[0];
    const r2 = c.responses.find((x) => x.device === "R2")!;
    expect(r2.role).toBe("sympathetic");
    expect(r2.direction).toBe("reverse");
    // R1 alone is expected; R2 only backs R1 up (its opening then separates the generator), and it tripped unwanted
    expect(c.operation.ideal).toEqual(["R1"]);
    expect(c.operation.backups).toEqual([{ device: "R1", backups: ["R2"] }]);
    expect(c.operation.unwanted).toEqual(["R2"]);
    expect(c.operation.operations.map((o) => [o.device, o.action])).toEqual([
      ["R2", "trip"],
      ["R2", "open"],
      ["R1", "trip"],
      ["R1", "open"],
    ]);
  });

  it("clears the verdict once R2's element is directional (forward only)", async () => {
    const r = await runStudy(project("forward"), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["X"] });
    expect(r.verdicts.filter((x) => x.kind === "sympathetic")).toEqual([]);
    const c = r.cases[0];
    expect(c.operation.unwanted).toEqual([]);
    expect(c.operation.operations.map((o) => o.device)).toEqual(["R1", "R1"]);
    // restrained by direction, R2 is no backup: with R1 stuck nothing of the project can separate the generator
    expect(c.operation.backups).toEqual([{ device: "R1", backups: [] }]);
  });

  it("opens R2 in the timeline before R1 when R2 is non-directional", async () => {
    const r = await runStudy(project("non-directional"), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["X"], timelineCases: ["s1|bus:X|3ph|max"] });
    const tl = r.timelines.find((t) => t.caseId === "s1|bus:X|3ph|max")!;
    expect(tl.events[0].device).toBe("R2");
    expect(tl.events[0].action).toBe("trip");
  });
});
