import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { pickupRatio, pickupRatioValue } from "../../../src/study/pickupRatio.ts";

const current = fc.double({ min: 0, max: 1e5, noNaN: true });
const pickup = fc.option(fc.double({ min: 0, max: 1e4, noNaN: true }), { nil: null });

describe("the pickup-ratio screen", () => {
  it("gives exactly the ratio of the full pickup ratio for any currents and pickups", () => {
    // independent computation: pickupRatio, whose choice of quantity is tested through the study's sensitivity verdicts
    fc.assert(
      fc.property(current, current, current, pickup, pickup, pickup, (iPhase_A, iResidual_A, iNegative_A, phase_A, residual_A, negative_A) => {
        const r = { iPhase_A, iResidual_A, iNegative_A };
        const p = { phase_A, residual_A, negative_A, overload_A: phase_A };
        expect(Object.is(pickupRatioValue(r, p), pickupRatio(r, p).ratio)).toBe(true);
      }),
      { numRuns: 1000 },
    );
  });

  it("is the largest current-to-pickup ratio over the quantities the device measures", () => {
    const r = { iPhase_A: 300, iResidual_A: 90, iNegative_A: 10 };
    // 300 / 200 = 1.5 on phase, 90 / 30 = 3 on residual, no negative-sequence element (hand calc)
    expect(pickupRatioValue(r, { phase_A: 200, residual_A: 30, negative_A: null, overload_A: 200 })).toBe(3);
  });
});
