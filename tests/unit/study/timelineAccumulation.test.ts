import { describe, expect, it } from "vitest";
import { runStudy } from "../../../src/study/runStudy.ts";
import { protectionModel } from "../../../src/study/protectionModel.ts";
import type { StudySolver } from "../../../src/study/studySolver.ts";
import { iecSI_s, makeProject, NO_TOLERANCE, reading3ph } from "./fixtures.ts";

// Bus F is fed by the grid through line LG (relay R1, IEC SI, Is 400 A, TMS 0.1) and by a generator through
// line LGEN (relay R2, definite time 0.2 s, Is 300 A). Breaker time 0.06 s for both.
// Before R2 opens R1 sees 2000 A; once the generator is cut off, the grid's share rises to 2400 A (invented split).
const project = makeProject([
  { kind: "bus", id: "S", un_kV: 11 },
  { kind: "bus", id: "F", un_kV: 11 },
  { kind: "bus", id: "GB", un_kV: 11 },
  { kind: "grid", id: "G", bus: "S", skMax_MVA: 100, skMin_MVA: 100 },
  { kind: "generator", id: "GEN", bus: "GB", sr_MVA: 5, ur_kV: 11, xdss_pu: 0.15, x2_pu: 0.15, x0_pu: 0.05 },
  { kind: "line", id: "LG", fromBus: "S", toBus: "F", length_km: 2, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.3, r0_ohmPerKm: 0.3, x0_ohmPerKm: 0.9, csa_mm2: 150, ampacity_A: 300 },
  { kind: "line", id: "LGEN", fromBus: "GB", toBus: "F", length_km: 1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.3, r0_ohmPerKm: 0.3, x0_ohmPerKm: 0.9, csa_mm2: 150, ampacity_A: 300 },
  { kind: "load", id: "LD", bus: "F", p_kW: 400, q_kvar: 100 },
  {
    kind: "relay", id: "R1", at: { element: "LG", end: "from" }, ctPrimary_A: 400, breakerTime_s: 0.06, tolerance: NO_TOLERANCE,
    functions: [{ id: "51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 400, multiplier: 0.1 }],
  },
  {
    kind: "relay", id: "R2", at: { element: "LGEN", end: "from" }, ctPrimary_A: 400, breakerTime_s: 0.06, tolerance: NO_TOLERANCE,
    functions: [{ id: "50", ansi: "50", quantity: "phase", curve: "definite-time", pickup_A: 300, delay_s: 0.2 }],
  },
]);

const solver: StudySolver = {
  solveMany: (_s, locs) => locs.map(() => ({ iFault_A: 0, readings: {}, messages: [] })),
  solveOne(_s, _loc, _t, _l, open) {
    const r1Open = open.some((o) => o.element === "LG");
    const r2Open = open.some((o) => o.element === "LGEN");
    const readings: Record<string, ReturnType<typeof reading3ph>> = {};
    if (!r1Open) readings.R1 = reading3ph(r2Open ? 2400 : 2000, "forward");
    if (!r2Open) readings.R2 = reading3ph(800, "forward");
    return { iFault_A: 2800, readings, messages: [] };
  },
  loadCurrents: () => null,
};

describe("the clearing timeline with a current that changes when a breaker opens", () => {
  it("accumulates R1's travel as the integral of dt / t(I) across the change", async () => {
    const r = await runStudy(project, { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false, buses: ["F"], timelineCases: ["s1|bus:F|3ph|max"] });
    const tl = r.timelines.find((t) => t.caseId === "s1|bus:F|3ph|max")!;
    expect(tl.events.map((e) => [e.device, e.action])).toEqual([
      ["R2", "trip"],
      ["R2", "open"],
      ["R1", "trip"],
      ["R1", "open"],
    ]);
    // hand computation (disk-travel integral, IEC 60255-151 SI times):
    //   t(2000 A) = 0.1 * 0.14 / (5^0.02 - 1) = 0.4281 s; t(2400 A) = 0.1 * 0.14 / (6^0.02 - 1) = 0.3842 s
    //   R2 opens at 0.20 + 0.06 = 0.26 s; R1 travel by then 0.26 / 0.4281 = 0.6073
    //   R1 trips at 0.26 + (1 - 0.6073) * 0.3842 = 0.4109 s, opens 0.06 s later
    const t2000 = iecSI_s(2000, 400, 0.1);
    const t2400 = iecSI_s(2400, 400, 0.1);
    const expectedTrip = 0.26 + (1 - 0.26 / t2000) * t2400;
    expect(tl.events[1].t_s).toBeCloseTo(0.26, 6);
    expect(tl.events[2].t_s).toBeCloseTo(expectedTrip, 4);
    expect(tl.clearedAt_s).toBeCloseTo(expectedTrip + 0.06, 4);
    expect(tl.isolated).toBe(true);
    // bus F with its 400 kW load is lost; buses S and GB stay fed by their sources
    expect(tl.deenergisedBuses).toEqual(["F"]);
    expect(tl.loadLost_kW).toBe(400);
    expect(tl.events[0].currents).toEqual(expect.arrayContaining([{ device: "R1", i_A: 2000 }, { device: "R2", i_A: 800 }]));
    expect(tl.events[2].currents).toEqual([{ device: "R1", i_A: 2400 }]);
  });
});
