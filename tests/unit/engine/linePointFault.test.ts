import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault } from "../../../src/engine/index.ts";
import { buildProject, bus } from "./helpers/projectBuilder.ts";

// Grid 11 kV, S"k max 100 MVA, R/X 0.1, cQ = 1.1; overhead line 4 km, r1 0.3, x1 0.4 ohm/km (20 C), two parallel runs.
// Hand calculation (IEC 60909-0:2016): ZQ = 1.1 * 11^2 / 100 ohm; ZL = (0.3 + j0.4) * 4 / 2 ohm;
// fault at 50 %: I"k = c Un / (sqrt3 |ZQ + 0.5 ZL|). Minimum: cmin 1.0, S"k min 60 MVA, R at 160 C: R (1 + 0.004 * 140).
const p = buildProject([
  bus("S", 11), bus("R", 11),
  { kind: "grid", id: "Q", bus: "S", skMax_MVA: 100, skMin_MVA: 60, rx: 0.1 },
  { kind: "line", id: "OHL", name: "Hill line", construction: "overhead", fromBus: "S", toBus: "R", length_km: 4, r1_ohmPerKm: 0.3, x1_ohmPerKm: 0.4, r0_ohmPerKm: 0.6, x0_ohmPerKm: 1.2, parallel: 2, csa_mm2: 120, ampacity_A: 300 },
]);
const zq = (c: number, sk: number) => {
  const z = (c * 121) / sk;
  const x = z / Math.sqrt(1.01);
  return { re: 0.1 * x, im: x };
};

describe("a fault part-way along a line", () => {
  it("gives the hand-calculated current at 50 %", () => {
    const c = compileNetwork(p, { limit: "max" });
    if (!c.ok) throw new Error("compile");
    const r = solveFault(c.network, { kind: "line", line: "OHL", pct: 50 }, "3ph");
    const q = zq(1.1, 100);
    const z = Math.hypot(q.re + 0.5 * 0.6, q.im + 0.5 * 0.8);
    expect(r.ikss_kA).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * z), 9);
    // Both halves report their outer ends only: the sending end carries the fault current.
    const from = r.branchEnds.find((e) => e.element === "OHL" && e.end === "from")!;
    expect(from.phase_A[0].mag).toBeCloseTo(r.ikss_kA * 1000, 6);
    expect(r.branchEnds.filter((e) => e.element === "OHL").length).toBe(2);
  });
  it("uses the end-of-fault conductor temperature for the minimum current", () => {
    const c = compileNetwork(p, { limit: "min" });
    if (!c.ok) throw new Error("compile");
    const r = solveFault(c.network, { kind: "line", line: "OHL", pct: 50 }, "3ph");
    const q = zq(1.0, 60);
    const rl = 0.5 * 0.6 * (1 + 0.004 * (160 - 20)); // IEC 60909-0:2016 resistance at the end temperature, alpha 0.004/K
    const z = Math.hypot(q.re + rl, q.im + 0.5 * 0.8);
    expect(r.ikss_kA).toBeCloseTo((1.0 * 11) / (Math.sqrt(3) * z), 9);
  });
  it("meets the bus results at 0 % and 100 % and falls in between", () => {
    const c = compileNetwork(p, { limit: "max" });
    if (!c.ok) throw new Error("compile");
    const at = (pct: number) => solveFault(c.network, { kind: "line", line: "OHL", pct }, "LG").ikss_kA;
    expect(at(0)).toBeCloseTo(solveFault(c.network, { kind: "bus", bus: "S" }, "LG").ikss_kA, 12);
    expect(at(100)).toBeCloseTo(solveFault(c.network, { kind: "bus", bus: "R" }, "LG").ikss_kA, 12);
    const points = [0, 10, 30, 50, 70, 90, 100].map(at);
    for (let i = 1; i < points.length; i++) expect(points[i]).toBeLessThan(points[i - 1]); // radial feed: current falls with distance
  });
  it("rejects a position outside 0-100 % naming the line", () => {
    const c = compileNetwork(p, { limit: "max" });
    if (!c.ok) throw new Error("compile");
    expect(() => solveFault(c.network, { kind: "line", line: "OHL", pct: 120 }, "3ph")).toThrow(/Overhead line OHL "Hill line".*pct/);
  });
});
