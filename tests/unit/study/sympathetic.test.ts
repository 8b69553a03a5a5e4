import { describe, expect, it } from "vitest";
import { runStudy } from "../../../src/study/runStudy.ts";
import { protectionModel } from "../../../src/study/protectionModel.ts";
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

const solver = tableSolver((_s, loc) =>
  loc.kind === "bus" && loc.bus === "X" ? { R1: reading3ph(5000, "forward"), R2: reading3ph(1500, "reverse") } : {},
);

describe("sympathetic tripping of a healthy feeder's relay", () => {
  it("fails when R2 trips on the generator's reverse current before R1 clears the fault", async () => {
    const r = await runStudy(project("non-directional"), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["X"] });
    const v = r.verdicts.find((x) => x.id === "sympathetic|R2|s1|bus:X|3ph|max")!;
    // IEC 60255-151 SI: R2 at 1500/400 = 3.75 x: 0.2613 s + 0.06 s = 0.321 s; R1 at 5000/800 = 6.25 x: 0.750 s + 0.06 s = 0.810 s
    expect(v.numbers.tClearFast_s).toBeCloseTo(iecSI_s(1500, 400, 0.05) + 0.06, 3);
    expect(v.numbers.faultCleared_s).toBeCloseTo(iecSI_s(5000, 800, 0.2) + 0.06, 3);
    expect(v.status).toBe("fail");
    expect(v.explanation).toMatch(/directional element \(67\/67N\)/);
    const r2 = r.cases[0].responses.find((x) => x.device === "R2")!;
    expect(r2.role).toBe("sympathetic");
    expect(r2.direction).toBe("reverse");
    // R2 is no backup of R1: the chain towards the generator holds R1 only
    const genPath = r.cases[0].chains.paths.find((p) => p.source === "GEN")!;
    expect(genPath.links.map((l) => l.device)).toEqual(["R1"]);
  });

  it("clears the verdict once R2's element is directional (forward only)", async () => {
    const r = await runStudy(project("forward"), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["X"] });
    const v = r.verdicts.find((x) => x.id === "sympathetic|R2|s1|bus:X|3ph|max")!;
    expect(v.status).toBe("pass");
    expect(v.explanation).toMatch(/blocked by its directional element/);
    expect(r.verdicts.filter((x) => x.kind === "sympathetic" && x.status !== "pass")).toEqual([]);
  });

  it("opens R2 in the timeline before R1 when R2 is non-directional", async () => {
    const r = await runStudy(project("non-directional"), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["X"], timelineCases: ["s1|bus:X|3ph|max"] });
    const tl = r.timelines.find((t) => t.caseId === "s1|bus:X|3ph|max")!;
    expect(tl.events[0].device).toBe("R2");
    expect(tl.events[0].action).toBe("trip");
  });
});
