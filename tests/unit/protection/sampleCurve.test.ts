import { describe, it, expect } from "vitest";
import { sampleCurve, referScale, operatingTime, balancedMeasurement, currentForTime } from "../../../src/protection/index.ts";
import type { Polyline } from "../../../src/protection/index.ts";
import { breaker, fn51, fuse, relay } from "./devices.ts";

const hasPoint = (line: Polyline, i: number) => line.some((p) => Math.abs(p[0] / i - 1) < 1e-12);
const nonIncreasing = (line: Polyline) => line.every((p, k) => k === 0 || (p[0] >= line[k - 1][0] && p[1] <= line[k - 1][1] * (1 + 1e-12)));

describe("curve sampling for plotting", () => {
  it("includes every pickup and region boundary exactly, with vertical steps", () => {
    const b = breaker();
    const c = sampleCurve(b);
    // nominal Isd 3780 A and Ii 7560 A (6 x 630, 12 x 630)
    for (const i of [3780, 7560]) {
      const at = c.nominal.filter((p) => Math.abs(p[0] / i - 1) < 1e-12);
      expect(at.length).toBe(2); // a vertical segment: two points at one current
    }
    expect(hasPoint(c.min, 3780 * 0.9)).toBe(true); // min band pickup -10 % (schema default tolerance)
    expect(hasPoint(c.max, 7560 * 1.1)).toBe(true);
  });

  it("gives polylines whose time never rises with current", () => {
    for (const dev of [breaker(), fuse(), relay([fn51(), { id: "F50", ansi: "50", quantity: "phase", pickup_A: 2000, delay_s: 0.05 }])]) {
      const c = sampleCurve(dev);
      expect(nonIncreasing(c.nominal)).toBe(true);
      expect(nonIncreasing(c.min)).toBe(true);
      expect(nonIncreasing(c.max)).toBe(true);
    }
  });

  it("matches operatingTime at its sampled points", () => {
    const r = relay([fn51({ curve: "iec-very-inverse" })]);
    const c = sampleCurve(r, { tMin_s: 1e-6, tMax_s: 1e6 });
    for (const [i, t] of c.nominal.filter((p) => p[0] > 101)) expect(t).toBeCloseTo(operatingTime(r, balancedMeasurement(i)).trip_s, 9);
  });

  it("keeps the log steps of time small where the curve bends (near the asymptote)", () => {
    const c = sampleCurve(relay([fn51()]));
    for (let k = 1; k < c.nominal.length; k++) {
      const [i0, t0] = c.nominal[k - 1];
      const [i1, t1] = c.nominal[k];
      if (i1 > i0) expect(Math.abs(Math.log10(t1 / t0))).toBeLessThanOrEqual(0.05 + 1e-9);
    }
  });

  it("refers currents to the plot voltage by device kV / reference kV", () => {
    expect(referScale(0.4, 11)).toBeCloseTo(0.4 / 11, 15); // hand calc
    const f = fuse();
    const own = sampleCurve(f);
    const ref = sampleCurve(f, { device_kV: 0.4, reference_kV: 11 });
    expect(ref.nominal.length).toBe(own.nominal.length);
    ref.nominal.forEach((p, k) => {
      expect(p[0]).toBeCloseTo(own.nominal[k][0] * (0.4 / 11), 9);
      expect(p[1]).toBe(own.nominal[k][1]);
    });
  });

  it("draws the ground curve from ground functions only, and the phase curve when there are none", () => {
    const r = relay([fn51(), { id: "G", ansi: "51N", quantity: "residual", curve: "definite-time", pickup_A: 40, delay_s: 0.5 }]);
    const g = sampleCurve(r, { quantity: "ground" });
    expect(hasPoint(g.nominal, 40)).toBe(true);
    expect(g.nominal[g.nominal.length - 1][1]).toBe(0.5);
    const f = sampleCurve(fuse(), { quantity: "ground" });
    expect(f.nominal).toEqual(sampleCurve(fuse()).nominal);
  });

  it("adds the breaker time when asked", () => {
    const r = relay([{ id: "F50", ansi: "50", quantity: "phase", pickup_A: 2000, delay_s: 0.05 }], { breakerTime_s: 0.06 });
    const c = sampleCurve(r, { includeClearing: true });
    expect(c.nominal[c.nominal.length - 1][1]).toBeCloseTo(0.11, 12); // 0.05 + 0.06 (hand calc)
  });

  it("draws and inverts a single function when asked (for dragging it)", () => {
    const r = relay([fn51(), { id: "F50", ansi: "50", quantity: "phase", pickup_A: 2000, delay_s: 0.05 }]);
    const only51 = sampleCurve(r, { elementIds: ["F51"], iMax_A: 5000 });
    const last = only51.nominal[only51.nominal.length - 1];
    expect(last[1]).toBeCloseTo(0.14 * 0.1 / (Math.pow(50, 0.02) - 1), 9); // IEC SI at 50x, TMS 0.1 (IEC 60255-151 Table 1, hand calc)
    expect(currentForTime(r, 0.1, { elementIds: ["F51"] })).toBeGreaterThan(2000); // the inverse curve alone is slower than 0.1 s at 20x
  });
});
