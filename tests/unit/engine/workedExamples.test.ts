import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, type CompiledNetwork } from "../../../src/engine/index.ts";
import { buildProject, bus } from "./helpers/projectBuilder.ts";

function compiled(p: ReturnType<typeof buildProject>): CompiledNetwork {
  const r = compileNetwork(p, { limit: "max" });
  if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
  return r.network;
}

describe("infinite-bus transformer, classic method", () => {
  // IAEI Magazine, "Short-circuit calculations using transformer and source impedance" (2018): 1500 kVA, 480 V,
  // 5.75 % impedance gives 31,374 A at the secondary terminals, I = S / (sqrt3 U Z).
  const p = buildProject(
    [
      bus("P", 13.8),
      bus("S", 0.48),
      { kind: "grid", id: "U", bus: "P", skMax_MVA: 1e12, skMin_MVA: 1e12, rx: 0 },
      { kind: "transformer", id: "T", hvBus: "P", lvBus: "S", sr_MVA: 1.5, urHv_kV: 13.8, urLv_kV: 0.48, uk_pct: 5.75, ur_pct: 0 },
    ],
    { method: "classic", prefault_pu: 1 },
  );
  it("gives 31,374 A within 0.05 %", () => {
    const r = solveFault(compiled(p), { kind: "bus", bus: "S" }, "3ph");
    expect(Math.abs(r.ikss_kA * 1000 - 31374) / 31374).toBeLessThan(0.0005); // IAEI 2018 worked example
    expect(r.options.method).toBe("classic");
    expect(r.c).toBe(1);
  });
});

describe("symmetrical-components handbook example", () => {
  // The Electric Power Engineering Handbook, "Power System" volume, fault analysis, figure 4.8 example:
  // Z1 = Z2 = j0.1422 pu, Z0 = j0.0452 pu, prefault 1.0 pu. A grid feeder with S"k = 100 MVA / 0.1422 on a
  // 100 MVA base and R/X 0 reproduces Z1 = Z2; |Z0|/|Z1| = 0.0452/0.1422 with R0/X0 0 reproduces Z0.
  const p = buildProject(
    [bus("F", 13.8), { kind: "grid", id: "Q", bus: "F", skMax_MVA: 100 / 0.1422, skMin_MVA: 100 / 0.1422, rx: 0, z0z1: 0.0452 / 0.1422, r0x0: 0 }],
    { method: "classic", prefault_pu: 1 },
  );
  const net = compiled(p);
  const iBase_kA = 100 / (Math.sqrt(3) * 13.8);
  it("gives 7.032 pu for the three-phase fault", () => {
    const r = solveFault(net, { kind: "bus", bus: "F" }, "3ph");
    expect(r.ikss_kA / iBase_kA).toBeCloseTo(7.032, 3); // handbook figure 4.8 example
  });
  it("gives I0 = I1 = I2 = -j3.034 pu and Ia = -j9.102 pu for the line-to-ground fault", () => {
    const r = solveFault(net, { kind: "bus", bus: "F" }, "LG");
    for (const s of r.faultSeq_kA) {
      expect(s.mag / iBase_kA).toBeCloseTo(3.034, 3); // handbook figure 4.8 example
      expect(s.ang_deg).toBeCloseTo(-90, 6); // -j
    }
    expect(r.faultPhase_kA[0].mag / iBase_kA).toBeCloseTo(9.102, 2); // handbook: Ia = -j9.102
    expect(r.faultPhase_kA[0].ang_deg).toBeCloseTo(-90, 6);
    expect(r.faultPhase_kA[1].mag).toBeLessThan(1e-9); // healthy phases carry nothing (LG boundary condition)
    expect(r.ikss_kA / iBase_kA).toBeCloseTo(9.102, 2); // I"k for LG is 3 I0
  });
  it("gives sqrt(3)/2 of the three-phase current for the two-phase fault when Z1 = Z2", () => {
    const i3 = solveFault(net, { kind: "bus", bus: "F" }, "3ph").ikss_kA;
    const i2 = solveFault(net, { kind: "bus", bus: "F" }, "LL").ikss_kA;
    expect(i2 / i3).toBeCloseTo(Math.sqrt(3) / 2, 12); // textbook relation I"k2 = (sqrt3/2) I"k3
  });
  it("takes a fault resistance into account per phase to earth for LG", () => {
    // LG with Rf: I0 = 1 / (j0.1422*2 + j0.0452 + 3 Rf); with Rf = 0.1 pu = 0.1 * 13.8^2/100 ohm (hand calculation).
    const rf_ohm = (0.1 * 13.8 * 13.8) / 100;
    const r = solveFault(net, { kind: "bus", bus: "F" }, "LG", { faultR_ohm: rf_ohm });
    const expected = 3 / Math.hypot(0.3, 0.1422 * 2 + 0.0452);
    expect(r.ikss_kA / iBase_kA).toBeCloseTo(expected, 9);
  });
});
