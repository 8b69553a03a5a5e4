// Every finite number formats (a pickup of 1e-300 A used to throw inside toFixed, which accepts 0 to 100
// decimals, ECMA-262 Number.prototype.toFixed step 4); missing and non-finite values print as an en dash.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { formatNumber, formatSignificant } from "../../../src/report/formatNumber.ts";

describe("report number formatting", () => {
  it("formats tiny values in exponent form with three significant figures", () => {
    expect(formatSignificant(1e-300)).toBe("1.00e-300");
    expect(formatSignificant(-2.346e-98)).toBe("-2.35e-98");
    expect(formatSignificant(Number.MIN_VALUE)).toBe("4.94e-324"); // the smallest double, 4.9406564584124654e-324 (IEEE 754 binary64)
  });

  it("keeps fixed notation down to 1e-9 and for large values", () => {
    expect(formatSignificant(0.000123456)).toBe("0.000123");
    expect(formatSignificant(1234.5)).toBe("1235");
    expect(formatSignificant(1.5e-9)).toBe("0.00000000150");
    expect(formatSignificant(0.3)).toBe("0.300");
  });

  it("clamps the decimals to what toFixed accepts", () => {
    expect(formatNumber(1e-300, 302)).toBe("0." + "0".repeat(100));
    expect(formatNumber(2.5, -3)).toBe("3");
  });

  it("prints an en dash for what was not computed", () => {
    for (const v of [NaN, Infinity, -Infinity, null, undefined]) {
      expect(formatNumber(v, 2)).toBe("–");
      expect(formatSignificant(v)).toBe("–");
    }
  });

  it("formats every finite double without throwing, as a number that reads back close to it", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        const text = formatSignificant(x);
        expect(text).toMatch(/^-?\d+(\.\d+)?(e[-+]\d+)?$/);
        // three significant figures: within half a unit in the third figure (relative 0.5 %)
        if (x !== 0) expect(Math.abs(Number(text) - x)).toBeLessThanOrEqual(Math.abs(x) * 0.005 + Number.MIN_VALUE);
      }),
      { numRuns: 2000 },
    );
  });
});
