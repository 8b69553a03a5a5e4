import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { currentForTime, operatingTime, balancedMeasurement } from "../../../src/protection/index.ts";
import { breaker, fn51, fuse, relay } from "./devices.ts";

describe("current for a time (the inverse of a device curve)", () => {
  const r = relay([fn51({ curve: "ieee-extremely-inverse", multiplier: 2 }), { id: "F50", ansi: "50", quantity: "phase", pickup_A: 3000, delay_s: 0.05 }]);
  const tAt = (dev: Parameters<typeof operatingTime>[0], i: number) => operatingTime(dev, balancedMeasurement(i)).trip_s;

  it("gives the lowest current operating within the time, steps included (definition of the inverse)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 100, noNaN: true }), (t) => {
        const i = currentForTime(r, t);
        expect(tAt(r, i)).toBeLessThanOrEqual(t * (1 + 1e-9));
        expect(tAt(r, i * (1 - 1e-9))).toBeGreaterThan(t * (1 - 1e-6));
      }),
    );
  });

  it("round-trips exactly where the curve is continuous", () => {
    // EI TD 2 reaches 0.306 s at the 50 pickup (30x); above that time only the inverse curve acts
    fc.assert(
      fc.property(fc.double({ min: 0.31, max: 100, noNaN: true }), (t) => {
        expect(tAt(r, currentForTime(r, t))).toBeCloseTo(t, 6);
      }),
    );
  });

  it("returns the step current for a time between the definite-time delay and the inverse curve", () => {
    // EI TD 2 at 30x = 2 * (28.2 / 899 + 0.1217) = 0.306 s (hand calc); any time 0.05..0.306 s is first reached at the 50 pickup
    expect(currentForTime(r, 0.1)).toBeCloseTo(3000, 6);
  });

  it("round-trips on a parametric fuse and an LV breaker", () => {
    const f = fuse();
    const b = breaker({ instantaneous: undefined });
    fc.assert(
      fc.property(fc.double({ min: 0.02, max: 1000, noNaN: true }), (t) => {
        expect(operatingTime(f, balancedMeasurement(currentForTime(f, t))).trip_s / t).toBeCloseTo(1, 6); // relative: steep near the asymptote
      }),
    );
    fc.assert(
      // long time takes 10 * 36 / 36 = 10 s at Isd = 6 Ir and 10 * 36 / 1.15^2 = 272 s at its pickup 1.15 Ir:
      // between them only the continuous long-time part acts (hand calc)
      fc.property(fc.double({ min: 10.01, max: 270, noNaN: true }), (t) => {
        expect(operatingTime(b, balancedMeasurement(currentForTime(b, t))).trip_s / t).toBeCloseTo(1, 6);
      }),
    );
  });

  it("is Infinity when the device is never that fast", () => {
    const r = relay([fn51({ curve: "ieee-very-inverse", multiplier: 1 })]);
    expect(currentForTime(r, 0.3)).toBe(Infinity); // IEEE VI floor TD * B = 0.491 s (IEEE C37.112 Table 1)
  });
});
