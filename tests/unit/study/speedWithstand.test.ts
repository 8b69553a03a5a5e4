import { describe, expect, it } from "vitest";
import { runStudy } from "../../../src/study/runStudy.ts";
import { protectionModel } from "../../../src/study/protectionModel.ts";
import { iecSI_s, makeProject, NO_TOLERANCE, reading3ph, tableSolver } from "./fixtures.ts";

// A 16 mm2 Cu XLPE cable protected by a relay that clears 11 783 A in 0.187 s: the cable's adiabatic limit
// at that current is (k S / I)^2 = (143 * 16 / 11 783)^2 = 0.0377 s (k = 143, IEC 60364-5-54 as tabulated).
const project = makeProject([
  { kind: "bus", id: "LV", un_kV: 0.4 },
  { kind: "bus", id: "END", un_kV: 0.4 },
  { kind: "grid", id: "G", bus: "LV", skMax_MVA: 20, skMin_MVA: 20 },
  { kind: "line", id: "C1", fromBus: "LV", toBus: "END", length_km: 0.01, r1_ohmPerKm: 1.15, x1_ohmPerKm: 0.09, r0_ohmPerKm: 4.6, x0_ohmPerKm: 0.36, csa_mm2: 16, material: "Cu", insulation: "XLPE", ampacity_A: 90 },
  {
    kind: "relay", id: "R-LV", at: { element: "C1", end: "from" }, ctPrimary_A: 1000, breakerTime_s: 0.06, tolerance: NO_TOLERANCE,
    functions: [{ id: "51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 800, multiplier: 0.05 }],
  },
]);
const I = (400 / Math.sqrt(3)) / 0.0196;

describe("the speed check against equipment withstand", () => {
  it("fails a primary that clears within the bus limit but after the cable's adiabatic limit", async () => {
    const solver = tableSolver((_s, loc) => (loc.kind === "bus" && loc.bus === "END" ? { "R-LV": reading3ph(I, "forward") } : {}));
    const r = await runStudy(project, { solver, model: protectionModel() }, { faultTypes: ["3ph"], linePoints: false });
    const v = r.verdicts.find((x) => x.id === "speed|zone|s1|bus:END|3ph|max")!;
    const withstand = ((143 * 16) / I) ** 2; // adiabatic I^2 t = k^2 S^2
    const tClear = iecSI_s(I, 800, 0.05) + 0.06;
    // the cable carries I from 0 until R-LV opens: it uses tClear / withstand of its adiabatic limit
    expect(v.numbers.withstandUsed).toBeCloseTo(tClear / withstand, 2);
    expect(v.numbers.isolated_s).toBeCloseTo(tClear, 3);
    // no clearing limit is set anywhere: only the withstand judges this case
    expect(v.numbers.limit_s).toBeUndefined();
    expect(v.status).toBe("fail");
    expect(v.explanation).toMatch(/C1 carries 11\.78 kA for \d+\.\d+ x its withstand/);
    expect(r.cases.find((c) => c.faultCase.id === "s1|bus:END|3ph|max")!.operation.withstand[0].element).toBe("C1");
  });
});
