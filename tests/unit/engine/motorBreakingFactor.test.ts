import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault } from "../../../src/engine/index.ts";
import { motorFactorQ } from "../../../src/engine/iec60909/factors.ts";
import { buildProject, bus, type RawElement } from "./helpers/projectBuilder.ts";

describe("motor factor q", () => {
  // IEC 60909-0:2016, 9.1.1 (from memory): q = 1.03 + 0.12 ln m (tmin 0.02 s), 0.79 + 0.12 ln m (0.05 s),
  // 0.57 + 0.12 ln m (0.10 s), 0.26 + 0.10 ln m (>= 0.25 s), m in MW per pair of poles, q <= 1.
  it("follows the four formulas for m = 0.5 MW", () => {
    expect(motorFactorQ(0.5, 0.02)).toBeCloseTo(1.03 + 0.12 * Math.log(0.5), 12); // 0.946822
    expect(motorFactorQ(0.5, 0.05)).toBeCloseTo(0.79 + 0.12 * Math.log(0.5), 12); // 0.706822
    expect(motorFactorQ(0.5, 0.1)).toBeCloseTo(0.486822, 6); // 0.57 - 0.12 * 0.693147
    expect(motorFactorQ(0.5, 0.25)).toBeCloseTo(0.190685, 6); // 0.26 - 0.10 * 0.693147
    expect(motorFactorQ(0.5, 1)).toBeCloseTo(0.190685, 6); // beyond 0.25 s the 0.25 s curve
  });
  it("reads 0.57 at m = 1 MW and 0.1 s, as the standard's figure of q shows (from memory)", () => {
    expect(motorFactorQ(1, 0.1)).toBeCloseTo(0.57, 12);
  });
  it("is capped at 1 for large motors and short delays", () => {
    expect(motorFactorQ(5, 0.02)).toBe(1); // 1.03 + 0.12 ln 5 = 1.223 > 1, so q = 1 (IEC 60909-0:2016)
  });
  it("ends at 0 for very small motors at long delays", () => {
    expect(motorFactorQ(0.01, 0.25)).toBe(0); // 0.26 + 0.10 ln 0.01 = -0.20; the figure's curves end at q = 0 (from memory)
  });
  it("takes the next smaller tabulated delay between them (larger q, conservative)", () => {
    expect(motorFactorQ(0.5, 0.07)).toBeCloseTo(motorFactorQ(0.5, 0.05), 12);
    expect(motorFactorQ(0.5, 0.01)).toBeCloseTo(motorFactorQ(0.5, 0.02), 12);
    expect(motorFactorQ(0.5, 0.2)).toBeGreaterThan(motorFactorQ(0.5, 0.25));
  });
});

describe("breaking current of a motor beside a network feeder", () => {
  // 6.6 kV bus; feeder S"k 250 MVA; motor 1000 kW, 6.6 kV, eta 0.95, cos phi 0.88, ILR/IrM 5.5, 2 pairs of poles.
  // Both R/X 0.1, so the partial currents are in phase and add arithmetically. Hand calculation, IEC method, max:
  //   S_rM = 1 / (0.95 * 0.88) = 1.196172 MVA;  Z_M = 6.6^2 / (5.5 * 1.196172) = 6.62112 ohm (IEC 60909-0:2016, 6.8)
  //   I"kM = 1.1 * 6.6 / (sqrt3 * 6.62112) = 0.633060 kA;  I_rM = 1.196172 / (sqrt3 * 6.6) = 0.104638 kA
  //   I"kM / I_rM = 1.1 * 5.5 = 6.05;  mu (tmin 0.1 s) = 0.62 + 0.72 exp(-0.32 * 6.05) = 0.72388 (9.1.1, from memory)
  //   m = 1 MW / 2 = 0.5 MW;  q (0.1 s) = 0.57 + 0.12 ln 0.5 = 0.48682
  //   Z_Q = 1.1 * 6.6^2 / 250 = 0.191664 ohm;  I"kQ = 1.1 * 6.6 / (sqrt3 * 0.191664) = 21.8693 kA (6.2), far from
  //   generators so I_bQ = I"kQ; I_b = I"kQ + mu q I"kM = 22.0924 kA (9.1.1: the breaking currents of the sources add)
  const srM = 1 / (0.95 * 0.88);
  const zM = (6.6 * 6.6) / (5.5 * srM);
  const ikM = (1.1 * 6.6) / (Math.sqrt(3) * zM);
  const ikQ = (1.1 * 6.6) / (Math.sqrt(3) * ((1.1 * 6.6 * 6.6) / 250));
  const mu = 0.62 + 0.72 * Math.exp(-0.32 * 1.1 * 5.5);
  const q = 0.57 + 0.12 * Math.log(0.5);
  const elements = (polePairs?: number): RawElement[] => [
    bus("B", 6.6),
    { kind: "grid", id: "NET", bus: "B", skMax_MVA: 250, skMin_MVA: 200, rx: 0.1 },
    { kind: "motor", id: "M1", name: "Pump", bus: "B", pr_kW: 1000, ur_kV: 6.6, eta: 0.95, cosPhi: 0.88, ilrIr: 5.5, rx: 0.1, ...(polePairs ? { polePairs } : {}) },
  ];
  const compiled = (els: RawElement[]) => {
    const r = compileNetwork(buildProject(els), { limit: "max" });
    if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
    return r.network;
  };

  it("gives I\"k as the arithmetic sum of the in-phase partial currents", () => {
    const r = solveFault(compiled(elements(2)), { kind: "bus", bus: "B" }, "3ph");
    expect(r.ikss_kA).toBeCloseTo(ikQ + ikM, 9);
    expect(ikM).toBeCloseTo(0.63306, 5);
  });
  it("reduces the motor's share by mu q: I_b = I\"kQ + mu q I\"kM", () => {
    const r = solveFault(compiled(elements(2)), { kind: "bus", bus: "B" }, "3ph");
    expect(mu).toBeCloseTo(0.72388, 5);
    expect(r.ib_kA).toBeCloseTo(ikQ + mu * q * ikM, 9);
    expect(r.ib_kA).toBeCloseTo(22.0924, 4);
    const motor = r.shunts.find((s) => s.element === "M1")!;
    expect(motor.seq_A[1].mag / 1000).toBeCloseTo(ikM, 9); // the engine's partial current is the hand I"kM
  });
  it("takes q = 1 without pole pairs and says so", () => {
    const net = compiled(elements());
    expect(net.messages).toContainEqual(expect.objectContaining({ level: "info", code: "motor-q", element: "M1" }));
    expect(compiled(elements(2)).messages.some((m) => m.code === "motor-q")).toBe(false);
    const r = solveFault(net, { kind: "bus", bus: "B" }, "3ph");
    expect(r.ib_kA).toBeCloseTo(ikQ + mu * ikM, 9);
  });
  it("uses the study's minimum time delay for q as for mu", () => {
    const r = compileNetwork(buildProject(elements(2), { breakingTime_s: 0.05 }), { limit: "max" });
    if (!r.ok) throw new Error("compile");
    const mu05 = 0.71 + 0.51 * Math.exp(-0.3 * 1.1 * 5.5); // 9.1.1, tmin 0.05 s (from memory)
    const q05 = 0.79 + 0.12 * Math.log(0.5);
    expect(solveFault(r.network, { kind: "bus", bus: "B" }, "3ph").ib_kA).toBeCloseTo(ikQ + mu05 * q05 * ikM, 9);
  });
});
