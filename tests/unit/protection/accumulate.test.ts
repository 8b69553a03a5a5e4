import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { accumulate, initialTravel, timeToOperate, operatingTime, balancedMeasurement } from "../../../src/protection/index.ts";
import type { TravelState } from "../../../src/protection/index.ts";
import { breaker, fn51, fuse, relay } from "./devices.ts";

const curves = ["iec-standard-inverse", "iec-very-inverse", "iec-extremely-inverse", "ieee-moderately-inverse", "ieee-very-inverse", "ieee-extremely-inverse", "definite-time"] as const;

describe("time accumulation (integral of dt / t(I))", () => {
  it("operates at the fixed-current time when the current is constant, whatever the steps", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...curves),
        fc.double({ min: 1.2, max: 30, noNaN: true }),
        fc.array(fc.double({ min: 0.01, max: 1, noNaN: true }), { minLength: 1, maxLength: 30 }),
        (curve, multiple, weights) => {
          const r = relay([fn51({ curve, delay_s: 0.4, multiplier: 0.2 })]);
          const m = balancedMeasurement(100 * multiple);
          const t = operatingTime(r, m).trip_s;
          // split 1.5 t into random steps: the integral reaches 1 at exactly t (independent of step sizes)
          const total = weights.reduce((a, b) => a + b, 0);
          let s: TravelState = initialTravel();
          for (const w of weights) s = accumulate(s, r, m, (1.5 * t * w) / total);
          expect(s.operated?.functionId).toBe("F51");
          expect(s.operated?.at_s).toBeCloseTo(t, 9);
        },
      ),
    );
  });

  it("operates at the fixed-current time for LV trip units and fuses too", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(breaker({ shortTime: { isd_x: 4, tsd_s: 0.2, i2t: true } }), fuse(), fuse({ kind: "parametric", family: "time-delay" })),
        fc.double({ min: 1.7, max: 40, noNaN: true }),
        fc.integer({ min: 1, max: 25 }),
        (dev, x, steps) => {
          const m = balancedMeasurement((dev.kind === "fuse" ? dev.rating_A : 630) * x);
          const t = operatingTime(dev, m).trip_s;
          let s: TravelState = initialTravel();
          for (let k = 0; k < steps; k++) s = accumulate(s, dev, m, (1.2 * t) / steps);
          expect(s.operated?.at_s).toBeCloseTo(t, 9); // integral of dt / t over constant current (definition)
        },
      ),
    );
  });

  it("adds up partial travel across a current change (two-step hand calculation)", () => {
    const r = relay([fn51({ curve: "iec-very-inverse", multiplier: 0.1 })]);
    // VI TMS 0.1: 2x -> 1.35 s, 10x -> 0.15 s (IEC 60255-151 Table 1, recomputed). 0.675 s at 2x is half the travel;
    // the other half at 10x takes 0.075 s: total 0.75 s (hand calc).
    let s = accumulate(initialTravel(), r, balancedMeasurement(200), 0.675);
    expect(s.travel.F51).toBeCloseTo(0.5, 12);
    const rest = timeToOperate(s, r, balancedMeasurement(1000));
    expect(rest.trip_s).toBeCloseTo(0.075, 12);
    s = accumulate(s, r, balancedMeasurement(1000), 0.1);
    expect(s.operated?.at_s).toBeCloseTo(0.75, 12);
  });

  it("resets instantaneously when set so", () => {
    const r = relay([fn51()]);
    let s = accumulate(initialTravel(), r, balancedMeasurement(200), 0.5);
    expect(s.travel.F51).toBeGreaterThan(0);
    s = accumulate(s, r, balancedMeasurement(50), 0.001);
    expect(s.travel.F51).toBe(0);
  });

  it("resets by the IEEE law TD * tr / (1 - M^2)", () => {
    const r = relay([fn51({ curve: "ieee-very-inverse", multiplier: 1, reset: "ieee" })]);
    // half travel, then M = 0.5: full reset takes 21.6 / 0.75 = 28.8 s (IEEE C37.112 reset, recomputed),
    // so 7.2 s removes a quarter of the travel (hand calc)
    const t2 = operatingTime(r, balancedMeasurement(200)).trip_s;
    let s = accumulate(initialTravel(), r, balancedMeasurement(200), t2 / 2);
    s = accumulate(s, r, balancedMeasurement(50), 7.2);
    expect(s.travel.F51).toBeCloseTo(0.25, 12);
  });

  it("resets a directional element blocked by a reversed fault", () => {
    const r = relay([fn51({ curve: "ieee-very-inverse", multiplier: 1, reset: "ieee", direction: "forward", rca_deg: 0, ansi: "67" })]);
    const seq = (sign: number) => ({
      i0_A: { re: 0, im: 0 },
      i1_A: { re: 0, im: -200 * sign }, // lags V1 by 90 deg: on the -jV1 reference for sign +1 (forward)
      i2_A: { re: 0, im: 0 },
      v0_pu: { re: 0, im: 0 },
      v1_pu: { re: 0.5, im: 0 },
      v2_pu: { re: 0, im: 0 },
    });
    const m = (sign: number) => ({ phase_A: [200, 200, 200] as const, residual_A: 0, negative_A: 0, sequence: seq(sign) });
    const t2 = operatingTime(r, m(1)).trip_s;
    let s = accumulate(initialTravel(), r, m(1), t2 / 2);
    expect(s.travel.F51).toBeCloseTo(0.5, 12);
    s = accumulate(s, r, m(-1), 21.6 / 4);
    // IEEE reset at M = 0: TD * tr = 21.6 s for full travel (IEEE C37.112 VI, recomputed): a quarter in 5.4 s
    expect(s.travel.F51).toBeCloseTo(0.25, 12);
  });

  it("keeps a fuse's travel between steps (no cooling)", () => {
    const f = fuse();
    let s = accumulate(initialTravel(), f, balancedMeasurement(500), 0.5);
    const before = s.travel.fuse;
    s = accumulate(s, f, balancedMeasurement(10), 10);
    expect(s.travel.fuse).toBe(before); // project choice: fuses do not reset
  });

  it("gives the remaining time and clearing time from the present travel", () => {
    const b = breaker();
    const m = balancedMeasurement(3 * 630);
    const s = accumulate(initialTravel(), b, m, 10);
    const r = timeToOperate(s, b, m);
    expect(r.trip_s).toBeCloseTo(40 - 10, 9); // long time at 3 Ir: 10 * 36 / 9 = 40 s (hand calc)
    expect(r.clearing_s).toBeCloseTo(30 + 0.03, 9); // plus clearing_s
  });
});
