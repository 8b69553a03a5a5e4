import { describe, expect, it } from "vitest";
import { runStudy } from "../../../src/study/runStudy.ts";
import { protectionModel } from "../../../src/study/protectionModel.ts";
import { makeProject, NO_TOLERANCE, reading3ph, tableSolver } from "./fixtures.ts";

// Grid at A (11 kV) -> line L1 (relay RU at A) -> bus M with generator GEN -> line L2 -> bus N. Fault at N.
// Classic method, E = 11 kV / sqrt 3 = 6350.9 V, reactances Zs = j1, ZL1 = j4, ZL2 = j2, Zgen = j5 ohm
// (independent hand computation, current divider):
//   without GEN: I(RU) = 6350.9 / (1 + 4 + 2) = 907.3 A
//   with GEN:    Zth(M) = (1 + 4) || 5 = 2.5 ohm; If = 6350.9 / (2.5 + 2) = 1411.3 A; I(RU) = If * 5 / 10 = 705.7 A
const E = 11000 / Math.sqrt(3);
const I_WITHOUT = E / 7;
const I_WITH = (E / 4.5) * 0.5;

function project(pickup_A: number) {
  return makeProject(
    [
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "M", un_kV: 11 },
      { kind: "bus", id: "N", un_kV: 11 },
      { kind: "grid", id: "G", bus: "A", skMax_MVA: 121, skMin_MVA: 121 },
      { kind: "line", id: "L1", fromBus: "A", toBus: "M", length_km: 10, r1_ohmPerKm: 0, x1_ohmPerKm: 0.4, r0_ohmPerKm: 0, x0_ohmPerKm: 1.2, csa_mm2: 150, ampacity_A: 300 },
      { kind: "line", id: "L2", fromBus: "M", toBus: "N", length_km: 5, r1_ohmPerKm: 0, x1_ohmPerKm: 0.4, r0_ohmPerKm: 0, x0_ohmPerKm: 1.2, csa_mm2: 150, ampacity_A: 300 },
      { kind: "generator", id: "GEN", bus: "M", sr_MVA: 5, ur_kV: 11, xdss_pu: 0.2, x2_pu: 0.2, x0_pu: 0.1 },
      {
        kind: "relay", id: "RU", at: { element: "L1", end: "from" }, ctPrimary_A: 600, breakerTime_s: 0.06, tolerance: NO_TOLERANCE,
        functions: [{ id: "50", ansi: "50", quantity: "phase", curve: "definite-time", pickup_A, delay_s: 0.3 }],
      },
    ],
    [{ id: "s1", name: "Base", limits: ["min"] }],
  );
}

const solver = tableSolver((s, loc) => {
  if (loc.kind !== "bus" || loc.bus !== "N") return {};
  const genOn = !s.outOfService.includes("GEN");
  return { RU: reading3ph(genOn ? I_WITH : I_WITHOUT, "forward") };
});

describe("blinding of an upstream relay by a generator between it and the fault", () => {
  it("is found when the infeed drops the relay below its 1.5 x pickup margin", async () => {
    // pickup 500 A: 907.3 / 500 = 1.81 >= 1.5 without GEN, 705.7 / 500 = 1.41 < 1.5 with it (common practice margin)
    const r = await runStudy(project(500), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["N"] });
    const v = r.verdicts.find((x) => x.id === "blinding|RU|GEN|s1|bus:N|3ph|min")!;
    expect(v.status).toBe("fail");
    expect(v.numbers.currentWith_A).toBeCloseTo(I_WITH, 0);
    expect(v.numbers.currentWithout_A).toBeCloseTo(I_WITHOUT, 0);
    expect(v.explanation).toMatch(/with GEN feeding/);
  });

  it("is not found when the relay keeps its margin with the infeed", async () => {
    // pickup 300 A: 705.7 / 300 = 2.35 >= 1.5; definite time, so no time growth either
    const r = await runStudy(project(300), { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["N"] });
    const v = r.verdicts.find((x) => x.id === "blinding|RU|GEN|s1|bus:N|3ph|min")!;
    expect(v.status).toBe("pass");
    expect(r.verdicts.filter((x) => x.kind === "blinding" && x.status !== "pass")).toEqual([]);
  });
});
