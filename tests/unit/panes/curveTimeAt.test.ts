import { describe, expect, it } from "vitest";
import { evaluate } from "mathjs";
import { curveTimeAt } from "../../../renderer/panes/tcc/curveTimeAt.ts";
import type { CurvePoint } from "../../../renderer/panes/tcc/tccTypes.ts";

// IEC 60255-151:2009, Table 1: standard inverse t = TMS * 0.14 / ((I/Is)^0.02 - 1), evaluated with mathjs.
function iecStandardInverse(pickup_A: number, tms: number, pointsPerDecade: number): CurvePoint[] {
  const out: CurvePoint[] = [];
  for (let k = 0; ; k++) {
    const m = 1.05 * 10 ** (k / pointsPerDecade);
    if (m > 30) break;
    out.push([m * pickup_A, evaluate("tms * 0.14 / (m ^ 0.02 - 1)", { tms, m }) as number]);
  }
  return out;
}

describe("time of a sampled curve at the pointer's current", () => {
  const curve = iecStandardInverse(100, 0.1, 60);

  it("reads the IEC standard inverse curve at 2x pickup as 1.003 s (TMS 0.1)", () => {
    // reference-checks: IEC SI, TMS 0.10, multiple 2 -> 1.003 s [recomputed from IEC 60255-151 Table 1]
    expect(curveTimeAt(curve, 200)).toBeCloseTo(1.003, 2);
  });

  it("reads it at 10x pickup as 0.297 s", () => {
    // reference-checks: IEC SI, TMS 0.10, multiple 10 -> 0.297 s [recomputed]
    expect(curveTimeAt(curve, 1000)).toBeCloseTo(0.297, 3);
  });

  it("interpolates along a straight line of the log-log plot", () => {
    // t = 1000 / I passes through (100, 10) and (1000, 1); at I = sqrt(100 * 1000) it gives 1000 / 316.23 = 3.1623 (hand calculation)
    const line: CurvePoint[] = [
      [100, 10],
      [1000, 1],
    ];
    expect(curveTimeAt(line, Math.sqrt(1e5))).toBeCloseTo(evaluate("1000 / sqrt(1e5)") as number, 9);
  });

  it("gives no time below the first point (no pickup) or above the last", () => {
    expect(curveTimeAt(curve, 90)).toBeNull();
    expect(curveTimeAt(curve, 1e5)).toBeNull();
  });

  it("takes the faster side of a vertical step (instantaneous element)", () => {
    // common practice: at the instantaneous pickup the faster element operates
    const stepped: CurvePoint[] = [
      [100, 10],
      [1000, 1],
      [1000, 0.05],
      [10000, 0.05],
    ];
    expect(curveTimeAt(stepped, 1000)).toBe(0.05);
    expect(curveTimeAt(stepped, 999)).toBeGreaterThan(1);
  });
});
