import { describe, it, expect } from "vitest";
import { operatingTime, balancedMeasurement, checkDeviceSettings, SettingsError, LT_NO_TRIP_X, LT_TRIP_X } from "../../../src/protection/index.ts";
import type { Band } from "../../../src/protection/index.ts";
import { breaker } from "./devices.ts";

const at = (b: ReturnType<typeof breaker>, i: number, band: Band = "nominal") => operatingTime(b, balancedMeasurement(i), { band });

describe("LV trip unit, long-time region", () => {
  const b = breaker({ shortTime: undefined, instantaneous: undefined });

  it("trips in tr_s at ref_x times Ir and follows I^2 t = constant", () => {
    expect(at(b, 6 * 630).trip_s).toBeCloseTo(10, 9); // band definition: tr_s at ref_x * Ir
    expect(at(b, 3 * 630).trip_s).toBeCloseTo(40, 9); // 10 * 6^2 / 3^2 (hand calc)
    expect(at(b, 12 * 630).trip_s).toBeCloseTo(2.5, 9); // 10 * 36 / 144 (hand calc)
  });

  it("stays in the conventional zone: no trip at 1.05 Ir, trip at 1.30 Ir, in every band", () => {
    // IEC 60947-2 conventional non-tripping 1.05 Ir and tripping 1.30 Ir // from memory
    for (const band of ["nominal", "min", "max"] as const) {
      expect(at(b, LT_NO_TRIP_X * 630, band).picked).toBe(false);
      expect(at(b, LT_TRIP_X * 630 * 1.0001, band).picked).toBe(true);
    }
    expect(LT_NO_TRIP_X).toBe(1.05);
    expect(LT_TRIP_X).toBe(1.3);
  });

  it("uses Ir = ir_x * In", () => {
    const half = breaker({ longTime: { ir_x: 0.5, tr_s: 10, ref_x: 6 }, shortTime: undefined, instantaneous: undefined });
    expect(at(half, 6 * 315).trip_s).toBeCloseTo(10, 9); // Ir 315 A, 6x -> tr_s (definition)
  });
});

describe("LV trip unit, region boundaries", () => {
  const b = breaker(); // Ir 630 A, Isd 6 x Ir = 3780 A at 0.2 s, Ii 12 x In = 7560 A
  it("hands over from long time to short time at Isd", () => {
    const below = at(b, 3780 * 0.999);
    const above = at(b, 3780 * 1.001);
    expect(below.functionId).toBe("long-time");
    expect(below.trip_s).toBeCloseTo((10 * 36) / (6 * 0.999) ** 2, 6); // I^2 t law just below Isd (hand calc)
    expect(above.functionId).toBe("short-time");
    expect(above.trip_s).toBe(0.2);
  });

  it("hands over from short time to instantaneous at Ii", () => {
    expect(at(b, 7560 * 0.999).functionId).toBe("short-time");
    const inst = at(b, 7560 * 1.001);
    expect(inst.functionId).toBe("instantaneous");
    expect(inst.trip_s).toBe(0);
    expect(inst.clearing_s).toBeCloseTo(0.03, 12); // clearing_s default 0.03 s added (schema default)
  });

  it("ramps the short-time delay as I^2 t below 10 x Ir when i2t is on", () => {
    const r = breaker({ shortTime: { isd_x: 3, tsd_s: 0.2, i2t: true }, instantaneous: undefined });
    expect(at(r, 5 * 630).trip_s).toBeCloseTo(0.2 * (10 / 5) ** 2, 9); // constant I^2 t through (10 Ir, tsd) (hand calc 0.8 s)
    expect(at(r, 10 * 630).trip_s).toBeCloseTo(0.2, 9);
    expect(at(r, 20 * 630).trip_s).toBeCloseTo(0.2, 9); // flat above 10 x Ir
  });

  it("runs the ground-fault region on the residual current", () => {
    const g = breaker({ groundFault: { ig_A: 300, tg_s: 0.3, i2t: false } });
    const r = operatingTime(g, { phase_A: [400, 0, 0], residual_A: 400, negative_A: 0 });
    expect(r.functionId).toBe("ground-fault");
    expect(r.trip_s).toBe(0.3);
    expect(operatingTime(g, { phase_A: [400, 0, 0], residual_A: 250, negative_A: 0 }).picked).toBe(false); // below 300 A and below 1.05 Ir
  });
});

describe("impossible LV trip-unit settings", () => {
  it("refuse Isd at or below Ir, naming the breaker and field", () => {
    const b = breaker({ shortTime: { isd_x: 0.8, tsd_s: 0.1, i2t: false } });
    const m = checkDeviceSettings(b).find((x) => x.field === "shortTime.isd_x");
    expect(m?.severity).toBe("error");
    expect(m?.text).toContain('LV breaker Q1 "Main incomer": shortTime.isd_x must be > 1');
    expect(() => at(b, 1000)).toThrow(SettingsError);
  });

  it("warn when Ii is at or below Isd", () => {
    const b = breaker({ instantaneous: { ii_x: 5 } });
    expect(checkDeviceSettings(b).some((x) => x.field === "instantaneous.ii_x" && x.severity === "warning")).toBe(true);
  });
});
