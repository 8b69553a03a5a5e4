// Duty: a breaker's ratings against the short-circuit current at its bus.
// Worked example (IAEI Magazine, "Short-circuit calculations using transformer and source impedance", 2018):
// a 1500 kVA, 480 V, 5.75 % transformer on an infinite bus gives 31,374 A at its secondary terminals
// (exact arithmetic 31,377 A). The classic method at 1 pu prefault is that calculation.
import { describe, expect, it } from "vitest";
import { projectSchema } from "../../../src/model/schema.ts";
import { studyProject } from "../../../src/study/studyProject.ts";

function site(breaking_kA: number, making_kA: number) {
  return projectSchema.parse({
    format: "islet-project",
    formatVersion: 1,
    meta: { name: "duty" },
    study: { method: "classic", prefault_pu: 1 },
    elements: [
      { kind: "bus", id: "HV", un_kV: 13.8 },
      { kind: "bus", id: "LV", un_kV: 0.48 },
      { kind: "grid", id: "G", bus: "HV", skMax_MVA: 1e9, skMin_MVA: 1e9, rx: 0.1 },
      { kind: "transformer", id: "T", hvBus: "HV", lvBus: "LV", sr_MVA: 1.5, urHv_kV: 13.8, urLv_kV: 0.48, uk_pct: 5.75, ur_pct: 1, vectorGroup: "Dyn11", earthingLv: { kind: "solid" } },
      { kind: "lvbreaker", id: "Q", at: { element: "T", end: "to" }, in_A: 2000, longTime: { ir_x: 1, tr_s: 10 }, breaking_kA, making_kA },
    ],
    scenarios: [{ id: "s1", name: "Grid", limits: ["max"] }],
  });
}

describe("the duty of a transformer's LV breaker", () => {
  // 1500 kVA / (sqrt 3 x 0.48 kV x 0.0575) = 31,377 A (IAEI worked example); on a 1 % resistance the
  // transformer's X/R = sqrt(5.75^2 - 1) / 1 = 5.662, kappa = 1.02 + 0.98 exp(-3 / 5.662) = 1.597 (IEC 60909-0, (55))
  const ik_kA = 1500 / (Math.sqrt(3) * 0.48 * 0.0575) / 1000;
  const kappa = 1.02 + 0.98 * Math.exp(-3 / Math.sqrt(5.75 ** 2 - 1));
  const ip_kA = kappa * Math.SQRT2 * ik_kA;

  it("fails a breaker rated below the breaking current at its bus and passes one above it", async () => {
    const low = await studyProject(site(30, 100), { linePoints: false, faultTypes: ["3ph"] });
    const v = low.verdicts.find((x) => x.id === "duty|Q|s1")!;
    // far from generators Ib = I"k (IEC 60909-0:2016, 4.5.1); the largest over the fault types is the 3ph value
    // here, since a Dyn11 with a solid LV earth and Z0 = Z1 gives LG = 3ph
    expect(v.numbers.ib_kA).toBeGreaterThan(ik_kA * 0.999);
    expect(v.numbers.ib_kA).toBeLessThan(ik_kA * 1.001);
    expect(v.status).toBe("fail");
    expect(v.explanation).toMatch(/breaking 30\.0 kA < Ib 31\.[34] kA/);
    const high = await studyProject(site(35, 100), { linePoints: false, faultTypes: ["3ph"] });
    expect(high.verdicts.find((x) => x.id === "duty|Q|s1")!.status).toBe("pass");
  });

  it("checks the making rating against the peak current", async () => {
    const r = await studyProject(site(50, 65), { linePoints: false, faultTypes: ["3ph"] });
    const v = r.verdicts.find((x) => x.id === "duty|Q|s1")!;
    expect(v.numbers.ip_kA).toBeGreaterThan(ip_kA * 0.995);
    expect(v.numbers.ip_kA).toBeLessThan(ip_kA * 1.005);
    // ip = 1.597 x sqrt 2 x 31.38 kA = 70.9 kA > 65 kA
    expect(v.status).toBe("fail");
    expect(v.explanation).toMatch(/making 65\.0 kA < ip 70\.\d kA/);
  });
});
