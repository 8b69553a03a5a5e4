import { describe, expect, it } from "vitest";
import { log10 } from "mathjs";
import { decadeDomain, logTicks, tickLabel } from "../../../renderer/panes/tcc/logTicks.ts";

describe("decade ticks of a log axis", () => {
  it("puts a major tick on every power of ten from 0.01 s to 1000 s", () => {
    const t = logTicks(0.01, 1000);
    // a decade is a factor of ten: log10(1000 / 0.01) = 5 decades, so 6 bounding powers (definition)
    expect(t.major).toEqual([0.01, 0.1, 1, 10, 100, 1000]);
    // every major tick is an exact power of ten (independent check with mathjs log10)
    for (const v of t.major) expect(Number(log10(v))).toBeCloseTo(Math.round(Number(log10(v))), 12);
  });

  it("puts eight minor ticks (2..9 times the power) in each full decade", () => {
    const t = logTicks(0.01, 1000);
    // 5 decades x 8 intermediate multiples (definition of the 1-2-...-9 log grid)
    expect(t.minor).toHaveLength(40);
    expect(t.minor.slice(0, 8)).toEqual([0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08, 0.09]);
  });

  it("keeps only ticks inside a domain that does not start on a decade", () => {
    const t = logTicks(35, 420);
    // by hand: powers of ten in [35, 420] are 100 only; multiples 40..90 and 200..400
    expect(t.major).toEqual([100]);
    expect(t.minor).toEqual([40, 50, 60, 70, 80, 90, 200, 300, 400]);
  });

  it("refuses a domain that is not positive", () => {
    expect(() => logTicks(0, 10)).toThrow(/positive/);
  });
});

describe("decade domain around the data", () => {
  it("widens 37 A .. 12.5 kA to whole decades 10 A .. 100 kA", () => {
    // floor(log10 37) = 1, ceil(log10 12500) = 5 (hand calculation)
    expect(decadeDomain([37, 12500])).toEqual([10, 100000]);
  });

  it("is at least the requested number of decades wide", () => {
    // 150 .. 180 lies within one decade (100..1000); two decades asked for -> 100..10000 (hand calculation)
    expect(decadeDomain([150, 180], 2)).toEqual([100, 10000]);
  });

  it("falls back when no value is positive", () => {
    expect(decadeDomain([0, -3, Number.NaN], 1, [1, 100])).toEqual([1, 100]);
  });
});

describe("tick labels", () => {
  it("writes kilo-amperes with a k and small times as decimals", () => {
    // SI prefix k = 10^3 (ISO 80000-1)
    expect(tickLabel(1000)).toBe("1k");
    expect(tickLabel(20000)).toBe("20k");
    expect(tickLabel(0.01)).toBe("0.01");
    expect(tickLabel(100)).toBe("100");
  });
});
