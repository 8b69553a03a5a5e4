import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { operatingTime, balancedMeasurement, bandTime, bandPickup } from "../../../src/protection/index.ts";
import { breaker, fn51, fuse, relay } from "./devices.ts";

const curves = ["iec-standard-inverse", "iec-very-inverse", "iec-extremely-inverse", "iec-long-time-inverse", "ieee-moderately-inverse", "ieee-very-inverse", "ieee-extremely-inverse", "definite-time"] as const;

describe("tolerance bands", () => {
  it("move a time by the larger of time_pct and the floor time_min_s", () => {
    const tol = { pickup_pct: 5, time_pct: 5, time_min_s: 0.02 };
    expect(bandTime(2, tol, "max")).toBeCloseTo(2.1, 12); // 5 % of 2 s = 0.1 s > 0.02 s (hand calc)
    expect(bandTime(0.1, tol, "min")).toBeCloseTo(0.08, 12); // 5 % of 0.1 s = 0.005 s < floor 0.02 s (hand calc)
    expect(bandTime(0.01, tol, "min")).toBe(0); // never below zero
    expect(bandPickup(100, tol, "min")).toBeCloseTo(95, 12); // -5 % (hand calc)
    expect(bandPickup(100, tol, "max")).toBeCloseTo(105, 12); // +5 % (hand calc)
  });

  it("contain the nominal relay curve at every current (min <= nominal <= max)", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...curves),
        fc.double({ min: 0.05, max: 1.2, noNaN: true }),
        fc.double({ min: 0, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: 0.5, max: 60, noNaN: true }),
        (curve, tms, delay_s, pickup_pct, multiple) => {
          const r = relay([fn51({ curve, multiplier: tms, delay_s })], { tolerance: { pickup_pct, time_pct: 7.5, time_min_s: 0.03 } });
          const m = balancedMeasurement(100 * multiple);
          const lo = operatingTime(r, m, { band: "min" }).trip_s;
          const mid = operatingTime(r, m, { band: "nominal" }).trip_s;
          const hi = operatingTime(r, m, { band: "max" }).trip_s;
          expect(lo).toBeLessThanOrEqual(mid);
          expect(mid).toBeLessThanOrEqual(hi);
        },
      ),
    );
  });

  it("contain the nominal LV trip-unit curve at every current", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 40, noNaN: true }), fc.boolean(), (x, i2t) => {
        const b = breaker({ shortTime: { isd_x: 4, tsd_s: 0.1, i2t } });
        const m = balancedMeasurement(630 * x);
        const [lo, mid, hi] = (["min", "nominal", "max"] as const).map((band) => operatingTime(b, m, { band }).trip_s);
        expect(lo).toBeLessThanOrEqual(mid);
        expect(mid).toBeLessThanOrEqual(hi);
      }),
    );
  });

  it("run from melting (min) to total clearing (max) for a fuse", () => {
    fc.assert(
      fc.property(fc.constantFrom("general-purpose", "fast", "time-delay"), fc.double({ min: 1, max: 80, noNaN: true }), (family, x) => {
        const f = fuse({ kind: "parametric", family });
        const m = balancedMeasurement(100 * x);
        const [lo, mid, hi] = (["min", "nominal", "max"] as const).map((band) => operatingTime(f, m, { band }).trip_s);
        expect(lo).toBeLessThanOrEqual(mid);
        expect(mid).toBeLessThanOrEqual(hi);
      }),
    );
  });
});
