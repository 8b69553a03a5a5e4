import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { curveNames } from "../../../src/model/schema.ts";
import { deviceTimer, operatingTime, SettingsError, type Band, type Measurement, type SequenceQuantities } from "../../../src/protection/index.ts";
import type { ProtectiveDevice } from "../../../src/protection/types.ts";
import { breaker, fn51, fuse, relay } from "./devices.ts";

const BANDS: Band[] = ["nominal", "min", "max"];

/** The fast timer must give exactly the explained answer's numbers on every band (same function, bit for bit). */
function expectSameAsExplained(device: ProtectiveDevice, m: Measurement): void {
  const fast = deviceTimer(device).bands(m);
  const [nominal, min, max] = BANDS.map((band) => operatingTime(device, m, { band }));
  expect(fast.picked).toBe(nominal.picked);
  expect(fast.functionId).toBe(nominal.functionId ?? null);
  expect(Object.is(fast.trip_s, nominal.trip_s)).toBe(true);
  expect(Object.is(fast.clearing_s, nominal.clearing_s)).toBe(true);
  expect(Object.is(fast.clearingMin_s, min.clearing_s)).toBe(true);
  expect(Object.is(fast.clearingMax_s, max.clearing_s)).toBe(true);
}

const phasorArb = (max: number) => fc.record({ re: fc.double({ min: -max, max, noNaN: true }), im: fc.double({ min: -max, max, noNaN: true }) });

const sequenceArb: fc.Arbitrary<SequenceQuantities> = fc.record({
  i0_A: phasorArb(5000),
  i1_A: phasorArb(5000),
  i2_A: phasorArb(5000),
  v0_pu: phasorArb(0.5),
  v1_pu: phasorArb(1.1),
  v2_pu: phasorArb(0.5),
});

const measurementArb: fc.Arbitrary<Measurement> = fc
  .record({
    phase_A: fc.tuple(fc.double({ min: 0, max: 20000, noNaN: true }), fc.double({ min: 0, max: 20000, noNaN: true }), fc.double({ min: 0, max: 20000, noNaN: true })),
    residual_A: fc.double({ min: 0, max: 5000, noNaN: true }),
    negative_A: fc.double({ min: 0, max: 5000, noNaN: true }),
    sequence: fc.option(sequenceArb, { nil: undefined }),
  })
  .map((m) => (m.sequence ? m : { phase_A: m.phase_A, residual_A: m.residual_A, negative_A: m.negative_A }));

const functionArb = fc.record({
  ansi: fc.constantFrom("51", "50", "51N", "46", "67", "67N", "51V"),
  quantity: fc.constantFrom("phase", "residual", "negative"),
  curve: fc.constantFrom(...curveNames),
  pickup_A: fc.double({ min: 5, max: 3000, noNaN: true }),
  multiplier: fc.double({ min: 0.05, max: 1, noNaN: true }),
  delay_s: fc.double({ min: 0, max: 2, noNaN: true }),
  tMin_s: fc.constantFrom(0, 0.05),
  direction: fc.constantFrom("non-directional", "forward", "reverse"),
  rca_deg: fc.integer({ min: -90, max: 90 }),
  enabled: fc.boolean(),
});

const relayArb = fc
  .record({
    functions: fc.array(functionArb, { minLength: 1, maxLength: 4 }),
    pickup_pct: fc.double({ min: 0, max: 10, noNaN: true }),
    time_pct: fc.double({ min: 0, max: 10, noNaN: true }),
    breakerTime_s: fc.double({ min: 0, max: 0.1, noNaN: true }),
  })
  .map(({ functions, pickup_pct, time_pct, breakerTime_s }) =>
    relay(
      functions.map((f, k) => ({ ...f, id: `F${k}` })),
      { breakerTime_s, tolerance: { pickup_pct, time_pct, time_min_s: 0.02 } },
    ),
  );

const breakerArb = fc
  .record({ isd_x: fc.double({ min: 2, max: 10, noNaN: true }), i2t: fc.boolean(), ii_x: fc.double({ min: 8, max: 15, noNaN: true }), ground: fc.boolean() })
  .map(({ isd_x, i2t, ii_x, ground }) =>
    breaker({ shortTime: { isd_x, tsd_s: 0.2, i2t }, instantaneous: { ii_x }, ...(ground ? { groundFault: { ig_A: 200, tg_s: 0.3, i2t } } : {}) }),
  );

describe("device timer (numeric fast path)", () => {
  it("gives exactly operatingTime's numbers on all three bands for random relays and measurements", () => {
    // independent computation: the explained path (operatingTime) is the reference, checked against IEC 60255-151 in its own tests
    fc.assert(fc.property(relayArb, measurementArb, (r, m) => expectSameAsExplained(r, m)), { numRuns: 400 });
  });

  it("gives exactly operatingTime's numbers for random LV breakers and parametric fuses", () => {
    // independent computation: operatingTime, the explained path
    fc.assert(fc.property(breakerArb, measurementArb, (b, m) => expectSameAsExplained(b, m)), { numRuns: 200 });
    const fuses = (["general-purpose", "fast", "time-delay"] as const).map((family) => fuse({ kind: "parametric", family }));
    fc.assert(fc.property(fc.constantFrom(...fuses), measurementArb, (f, m) => expectSameAsExplained(f, m)), { numRuns: 200 });
  });

  it("times an IEC standard inverse relay on its band edges", () => {
    const r = relay([fn51()], { breakerTime_s: 0.05, tolerance: { pickup_pct: 5, time_pct: 5, time_min_s: 0.02 } });
    const t = deviceTimer(r).bands({ phase_A: [200, 200, 200], residual_A: 0, negative_A: 0 });
    // IEC 60255-151:2009 Table 1 (SI: k 0.14, a 0.02), TMS 0.1, M = 200/100 = 2: 0.014 / (2^0.02 - 1) = 1.0029 s
    expect(t.trip_s).toBeCloseTo(1.0029, 4);
    expect(t.clearing_s).toBeCloseTo(1.0529, 4); // plus the 0.05 s breaker time (definition of total clearing)
    // fast edge: pickup 95 A, M = 2.1053: 0.014 / (2.1053^0.02 - 1) = 0.93332 s, less 5 % = 0.88665 s, plus 0.05 s (hand calc)
    expect(t.clearingMin_s).toBeCloseTo(0.93665, 4);
    // slow edge: pickup 105 A, M = 1.9048: 0.014 / (1.9048^0.02 - 1) = 1.07937 s, plus 5 % = 1.13334 s, plus 0.05 s (hand calc)
    expect(t.clearingMax_s).toBeCloseTo(1.18334, 4);
    expect(t.functionId).toBe("F51");
  });

  it("leaves a directional function blocked when the current flows the other way", () => {
    const r = relay([fn51({ ansi: "67", direction: "forward" })]);
    // -jV1 = 0.5 pu at -90 deg, I1 = 500 A at +90 deg: I1 leads by 180 deg, torque cos(180 - 45) < 0 is reverse (directionOf.ts convention)
    const sequence: SequenceQuantities = { i0_A: { re: 0, im: 0 }, i1_A: { re: 0, im: 500 }, i2_A: { re: 0, im: 0 }, v0_pu: { re: 0, im: 0 }, v1_pu: { re: 0.5, im: 0 }, v2_pu: { re: 0, im: 0 } };
    const t = deviceTimer(r).bands({ phase_A: [500, 500, 500], residual_A: 0, negative_A: 0, sequence });
    expect(t.picked).toBe(false);
    expect(t.clearing_s).toBe(Infinity);
  });

  it("refuses impossible settings once, when it is built", () => {
    expect(() => deviceTimer(relay([fn51({ pickup_A: 100, tMin_s: 2, tMax_s: 1 })]))).toThrow(SettingsError);
  });
});
