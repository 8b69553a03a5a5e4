import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { logLogInterpolate, logLogCurrentForTime, operatingTime, balancedMeasurement, checkDeviceSettings, SettingsError, FUSE_FAMILY_LAWS, familyMelt_s, familyClear_s, familyMeltMultiple, FUSE_LET_THROUGH_NOTE } from "../../../src/protection/index.ts";
import type { CurvePoint } from "../../../src/protection/index.ts";
import { fuse } from "./devices.ts";

/** Random point tables with current strictly increasing and time strictly decreasing. */
const table = fc
  .array(fc.tuple(fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true })), { minLength: 2, maxLength: 12 })
  .map((steps) => {
    let i = 100;
    let t = 5000;
    return steps.map(([di, dt]) => {
      i *= 1 + di;
      t *= 1 - 0.9 * dt;
      return [i, t] as CurvePoint;
    });
  });

describe("point-table fuse curves", () => {
  it("are exact at their points", () => {
    fc.assert(
      fc.property(table, (pts) => {
        // definition of interpolation: the table's own points come back
        for (const [i, t] of pts) expect(logLogInterpolate(pts, i)).toBeCloseTo(t, 9);
      }),
    );
  });

  it("are monotone between points (time never rises with current)", () => {
    fc.assert(
      fc.property(table, fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 2, maxLength: 20 }), (pts, fs) => {
        const lo = pts[0][0];
        const hi = pts[pts.length - 1][0] * 2;
        const currents = fs.map((f) => lo * Math.pow(hi / lo, f)).sort((a, b) => a - b);
        for (let k = 1; k < currents.length; k++) expect(logLogInterpolate(pts, currents[k])).toBeLessThanOrEqual(logLogInterpolate(pts, currents[k - 1]) * (1 + 1e-12));
      }),
    );
  });

  it("interpolate on log-log axes: the midpoint in log current gives the geometric mean time", () => {
    const pts: CurvePoint[] = [
      [100, 100],
      [400, 1],
    ];
    expect(logLogInterpolate(pts, 200)).toBeCloseTo(10, 9); // hand calc: log-linear, sqrt(100*1) at sqrt(100*400)
  });

  it("do not operate below the first point and extend above the last at constant I^2 t", () => {
    const pts: CurvePoint[] = [
      [100, 100],
      [400, 1],
    ];
    expect(logLogInterpolate(pts, 99)).toBe(Infinity);
    expect(logLogInterpolate(pts, 800)).toBeCloseTo(0.25, 12); // 1 s * (400/800)^2, the stated adiabatic extension (hand calc)
  });

  it("invert: the current for a time returns to the same time", () => {
    fc.assert(
      fc.property(table, fc.double({ min: 0, max: 1, noNaN: true }), (pts, f) => {
        const t = pts[pts.length - 1][1] * Math.pow(pts[0][1] / pts[pts.length - 1][1], f);
        expect(logLogInterpolate(pts, logLogCurrentForTime(pts, t))).toBeCloseTo(t, 6);
      }),
    );
  });

  it("are refused when time does not fall as current rises, naming fuse and field", () => {
    const f = fuse({ kind: "points", melt: [[100, 10], [200, 20], [400, 1]], clear: [[110, 20], [400, 2]] });
    const msgs = checkDeviceSettings(f);
    expect(msgs[0].severity).toBe("error");
    expect(msgs[0].field).toBe("curve.melt[1]");
    expect(msgs[0].text).toContain('Fuse FU1 "Pump fuse": curve.melt[1] time must strictly decrease');
    expect(() => operatingTime(f, balancedMeasurement(300))).toThrow(SettingsError);
  });

  it("warn when the total-clearing curve is faster than the melting curve", () => {
    const f = fuse({ kind: "points", melt: [[100, 100], [1000, 0.02]], clear: [[120, 100], [1000, 0.01]] });
    const m = checkDeviceSettings(f);
    expect(m.map((x) => [x.severity, x.field])).toEqual([["warning", "curve.clear"]]);
    expect(m[0].text).toContain("at 1000 A"); // clear 0.01 s < melt 0.02 s at the last point
  });

  it("give melting as trip time and total clearing as clearing time", () => {
    const f = fuse({ kind: "points", melt: [[100, 100], [1000, 0.01]], clear: [[120, 100], [1000, 0.02]] });
    const r = operatingTime(f, balancedMeasurement(1000));
    expect(r.trip_s).toBeCloseTo(0.01, 12); // table point
    expect(r.clearing_s).toBeCloseTo(0.02, 12); // table point
    expect(r.functionId).toBe("fuse");
  });
});

describe("parametric fuse families (illustrative, our own law)", () => {
  const families = Object.keys(FUSE_FAMILY_LAWS) as (keyof typeof FUSE_FAMILY_LAWS)[];

  it("never melt at the conventional non-fusing current 1.25 x and do clear at the conventional fusing current 1.6 x", () => {
    // IEC 60269-1 conventional currents Inf 1.25 In / If 1.6 In for gG fuses, conventional time 1-4 h // from memory
    for (const fam of families) {
      const law = FUSE_FAMILY_LAWS[fam];
      expect(familyMelt_s(law, 1.25)).toBe(Infinity);
      expect(familyClear_s(law, 1.6)).toBeLessThan(3600);
    }
  });

  it("follow the thermal-element law t = tau ln(1 / (1 - (m/x)^n)) with t10 at 10 x", () => {
    // independent recomputation of the stated law for the general-purpose family
    const law = FUSE_FAMILY_LAWS["general-purpose"];
    const tau = law.t10_s / Math.log(1 / (1 - Math.pow(law.m / 10, law.n)));
    for (const x of [1.6, 2, 5, 20]) expect(familyMelt_s(law, x)).toBeCloseTo(tau * Math.log(1 / (1 - Math.pow(law.m / x, law.n))), 9);
    expect(familyMelt_s(law, 10)).toBeCloseTo(law.t10_s, 12);
  });

  it("clear no sooner than they melt, and both fall as current rises", () => {
    fc.assert(
      fc.property(fc.constantFrom(...families), fc.double({ min: 1.3, max: 100, noNaN: true }), fc.double({ min: 1.0001, max: 2, noNaN: true }), (fam, x, k) => {
        const law = FUSE_FAMILY_LAWS[fam];
        expect(familyClear_s(law, x)).toBeGreaterThanOrEqual(familyMelt_s(law, x));
        expect(familyMelt_s(law, x * k)).toBeLessThanOrEqual(familyMelt_s(law, x));
        expect(familyClear_s(law, x * k)).toBeLessThanOrEqual(familyClear_s(law, x));
      }),
    );
  });

  it("invert the melting law exactly", () => {
    fc.assert(
      fc.property(fc.constantFrom(...families), fc.double({ min: 1.5, max: 100, noNaN: true }), (fam, x) => {
        const law = FUSE_FAMILY_LAWS[fam];
        expect(familyMeltMultiple(law, familyMelt_s(law, x))).toBeCloseTo(x, 6);
      }),
    );
  });

  it("scale with the rating", () => {
    const a = operatingTime(fuse(undefined, 100), balancedMeasurement(500));
    const b = operatingTime(fuse(undefined, 200), balancedMeasurement(1000));
    expect(a.trip_s).toBeCloseTo(b.trip_s, 12); // same multiple of rating, same time (law in x = I / rating)
  });

  it("come with a note that current limitation is not modelled", () => {
    expect(FUSE_LET_THROUGH_NOTE).toMatch(/not modelled/);
  });
});
