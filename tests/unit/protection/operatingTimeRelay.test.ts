import { describe, it, expect } from "vitest";
import { operatingTime, balancedMeasurement, toSecondary_A, toPrimary_A, toCtMultiple, SettingsError } from "../../../src/protection/index.ts";
import type { Measurement } from "../../../src/protection/index.ts";
import { fn51, relay } from "./devices.ts";

const earth = (phase_A: number, residual_A: number, negative_A = 0): Measurement => ({ phase_A: [phase_A, 0, 0], residual_A, negative_A });

describe("relay operating time", () => {
  it("is the fastest enabled function that picks up, and names it", () => {
    const r = relay([fn51(), { id: "F50", ansi: "50", quantity: "phase", pickup_A: 2000, delay_s: 0.05 }]);
    const low = operatingTime(r, balancedMeasurement(200));
    expect(low.functionId).toBe("F51");
    expect(low.trip_s).toBeCloseTo(1.003, 3); // IEC SI, TMS 0.1, 2x pickup = 1.003 s (reference-checks, IEC 60255-151 Table 1)
    const high = operatingTime(r, balancedMeasurement(2500));
    expect(high.functionId).toBe("F50");
    expect(high.trip_s).toBe(0.05); // definite time 50 element: its delay (hand calc; SI at 25x would be 0.214 s)
  });

  it("adds the breaker time to give the total clearing time", () => {
    const r = relay([fn51()], { breakerTime_s: 0.08 });
    const res = operatingTime(r, balancedMeasurement(1000));
    expect(res.clearing_s - res.trip_s).toBeCloseTo(0.08, 12); // definition: clearing = relay + breaker
    expect(res.trip_s).toBeCloseTo(0.297, 3); // IEC SI TMS 0.1 at 10x (reference-checks)
  });

  it("does not operate below every pickup and says so", () => {
    const res = operatingTime(relay([fn51()]), balancedMeasurement(90));
    expect(res.picked).toBe(false);
    expect(res.trip_s).toBe(Infinity);
    expect(res.reason).toContain("below every pickup");
  });

  it("ignores a disabled function", () => {
    const r = relay([fn51(), { id: "F50", ansi: "50", quantity: "phase", pickup_A: 2000, delay_s: 0, enabled: false }]);
    expect(operatingTime(r, balancedMeasurement(5000)).functionId).toBe("F51"); // the only enabled function
  });

  it("holds the time between tMin_s and tMax_s", () => {
    const r = relay([fn51({ curve: "iec-very-inverse", tMin_s: 0.2, tMax_s: 1 })]);
    expect(operatingTime(r, balancedMeasurement(150)).trip_s).toBe(1); // VI at 1.5x = 2.7 s, capped at 1 s (hand calc 0.1*13.5/0.5)
    expect(operatingTime(r, balancedMeasurement(5000)).trip_s).toBe(0.2); // VI at 50x = 0.0276 s, held at 0.2 s (hand calc)
  });

  it("runs 51N on the residual current and 46 on the negative-sequence current", () => {
    const r = relay([
      { id: "G", ansi: "51N", quantity: "residual", curve: "iec-standard-inverse", pickup_A: 20, multiplier: 0.1 },
      { id: "Q", ansi: "46", quantity: "negative", curve: "definite-time", pickup_A: 50, delay_s: 0.4 },
    ]);
    const g = operatingTime(r, earth(40, 40));
    expect(g.functionId).toBe("G");
    expect(g.trip_s).toBeCloseTo(1.003, 3); // IEC SI 2x, TMS 0.1 (reference-checks)
    const q = operatingTime(r, { phase_A: [100, 100, 0], residual_A: 0, negative_A: 60 });
    expect(q.functionId).toBe("Q");
    expect(q.trip_s).toBe(0.4); // definite-time delay
  });

  it("uses the largest phase current for phase functions", () => {
    const res = operatingTime(relay([fn51()]), { phase_A: [50, 200, 120], residual_A: 0, negative_A: 0 });
    expect(res.trip_s).toBeCloseTo(1.003, 3); // 200 A = 2x pickup, IEC SI TMS 0.1 (reference-checks)
  });

  it("lowers a 51V pickup in proportion to the restraint voltage, down to kMin", () => {
    const r = relay([fn51({ id: "V", ansi: "51V", pickup_A: 400, restraint: { vFull_pu: 1, kMin: 0.25 } })]);
    const seq = (v: number) => ({
      i0_A: { re: 0, im: 0 },
      i1_A: { re: 200, im: 0 },
      i2_A: { re: 0, im: 0 },
      v0_pu: { re: 0, im: 0 },
      v1_pu: { re: v, im: 0 },
      v2_pu: { re: 0, im: 0 },
    });
    const m = (v: number): Measurement => ({ phase_A: [200, 200, 200], residual_A: 0, negative_A: 0, sequence: seq(v) });
    expect(operatingTime(r, m(1)).picked).toBe(false); // 200 A < 400 A pickup, no restraint at 1 pu
    expect(operatingTime(r, m(0.5)).trip_s).toBe(Infinity); // pickup 0.5*400 = 200 A: not above it
    expect(operatingTime(r, m(0.25)).trip_s).toBeCloseTo(1.003, 3); // pickup 100 A, 2x -> IEC SI 1.003 s (reference-checks)
    expect(operatingTime(r, m(0.05)).trip_s).toBeCloseTo(1.003, 3); // floored at kMin 0.25: same 100 A pickup (hand calc)
  });
});

describe("CT conversion", () => {
  it("converts primary amperes to secondary and back", () => {
    const r = relay([fn51()], { ctPrimary_A: 400, ctSecondary_A: 5 });
    expect(toSecondary_A(r, 100)).toBeCloseTo(1.25, 12); // 100 * 5/400 (hand calc)
    expect(toPrimary_A(r, 1.25)).toBeCloseTo(100, 12); // 1.25 * 400/5 (hand calc)
    expect(toCtMultiple(r, 100)).toBeCloseTo(0.25, 12); // 100/400 (hand calc)
  });
});

describe("impossible relay settings", () => {
  it("throw a SettingsError naming the relay, its name and the field", () => {
    const r = relay([fn51()]);
    r.functions[0].pickup_A = -3;
    try {
      operatingTime(r, balancedMeasurement(100));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(SettingsError);
      expect((e as Error).message).toContain('Relay R1 "Dock feeder": functions[0].pickup_A');
      expect((e as Error).message).toContain("(got -3)");
    }
  });
});
