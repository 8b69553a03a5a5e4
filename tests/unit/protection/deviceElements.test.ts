import { describe, it, expect } from "vitest";
import { operatingTime, balancedMeasurement, SettingsError, devicePickups, sampleCurve, currentForTime } from "../../../src/protection/index.ts";
import { breaker, fn51, fuse, relay } from "./devices.ts";

describe("device models of an edited record", () => {
  it("follow a relay edited in place (the memo never serves stale settings)", () => {
    const r = relay([fn51()]);
    expect(operatingTime(r, balancedMeasurement(200)).trip_s).toBeCloseTo(1.003, 3); // IEC SI 2x TMS 0.1 (reference-checks)
    r.functions[0].multiplier = 0.05;
    expect(operatingTime(r, balancedMeasurement(200)).trip_s).toBeCloseTo(1.003 / 2, 3); // half at TMS 0.05 (reference-checks)
    r.functions[0].pickup_A = -1;
    expect(() => operatingTime(r, balancedMeasurement(200))).toThrow(SettingsError);
  });

  it("follow a breaker and a fuse edited in place", () => {
    const b = breaker();
    const before = operatingTime(b, balancedMeasurement(5000)).trip_s;
    b.shortTime!.tsd_s = 0.4;
    expect(operatingTime(b, balancedMeasurement(5000)).trip_s).not.toBe(before);
    const f = fuse({ kind: "points", melt: [[100, 100], [1000, 0.01]], clear: [[120, 100], [1000, 0.02]] });
    expect(operatingTime(f, balancedMeasurement(1000)).trip_s).toBeCloseTo(0.01, 12);
    if (f.curve.kind === "points") f.curve.melt[1][1] = 0.005;
    expect(operatingTime(f, balancedMeasurement(1000)).trip_s).toBeCloseTo(0.005, 12);
  });
});

describe("device pickups and devices without a curve on a quantity", () => {
  it("give the lowest pickup per quantity, null where nothing measures it", () => {
    const r = relay([fn51(), { id: "F50", ansi: "50", quantity: "phase", pickup_A: 2000, delay_s: 0 }, { id: "G", ansi: "51N", quantity: "residual", curve: "definite-time", pickup_A: 40, delay_s: 0.5 }]);
    expect(devicePickups(r)).toEqual({ phase_A: 100, residual_A: 40, negative_A: null });
    expect(devicePickups(r, "min").phase_A).toBeCloseTo(95, 12); // -5 % schema default tolerance (hand calc)
  });

  it("draw nothing and invert to Infinity when a relay has no function on the quantity or its fallback", () => {
    const r = relay([{ id: "G", ansi: "51N", quantity: "residual", curve: "definite-time", pickup_A: 40, delay_s: 0.5 }]);
    expect(sampleCurve(r, { quantity: "phase" })).toEqual({ nominal: [], min: [], max: [] });
    expect(currentForTime(r, 1, { quantity: "phase" })).toBe(Infinity);
    expect(currentForTime(r, 1, { quantity: "ground" })).toBeCloseTo(40, 9); // definite-time pickup
  });
});
