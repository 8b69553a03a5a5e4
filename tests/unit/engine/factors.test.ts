import { describe, expect, it } from "vitest";
import { voltageFactor, transformerKT, generatorKG, peakFactor, breakingFactorMu, thermalFactorM } from "../../../src/engine/index.ts";

describe("IEC 60909-0:2016 voltage factor c", () => {
  it("takes LV cmax 1.05 for +6 % systems and 1.10 for +10 %, cmin 0.95", () => {
    expect(voltageFactor(0.4, "max", 6)).toBe(1.05); // IEC 60909-0:2016, Table 1
    expect(voltageFactor(0.4, "max", 10)).toBe(1.1); // IEC 60909-0:2016, Table 1
    expect(voltageFactor(0.4, "min", 10)).toBe(0.95); // IEC 60909-0:2016, Table 1
  });
  it("takes cmax 1.10 and cmin 1.00 above 1 kV", () => {
    expect(voltageFactor(11, "max", 6)).toBe(1.1); // IEC 60909-0:2016, Table 1
    expect(voltageFactor(11, "min", 6)).toBe(1.0); // IEC 60909-0:2016, Table 1
    expect(voltageFactor(132, "max", 10)).toBe(1.1); // IEC 60909-0:2016, Table 1 (HV from memory)
  });
});

describe("network transformer correction KT", () => {
  it("matches 0.95 cmax / (1 + 0.6 xT) at 4, 6 and 10 %", () => {
    expect(transformerKT(0.04, 1.1)).toBeCloseTo(1.0205, 4); // reference-checks.md, recomputed from IEC 60909-0:2016 KT formula
    expect(transformerKT(0.06, 1.1)).toBeCloseTo(1.0087, 4); // same source
    expect(transformerKT(0.1, 1.1)).toBeCloseTo(0.9858, 4); // same source
  });
});

describe("generator correction KG", () => {
  it("is (Un/UrG) cmax / (1 + x\"d sin phi)", () => {
    // x"d 0.15, cos phi 0.8 (sin 0.6), cmax 1.1, Un = UrG: 1.1 / 1.09 (IEC 60909-0 KG formula, from memory)
    expect(generatorKG(11, 11, 1.1, 0.15, 0.8)).toBeCloseTo(1.1 / 1.09, 12);
    expect(generatorKG(10, 10.5, 1.1, 0.15, 0.8)).toBeCloseTo(((10 / 10.5) * 1.1) / 1.09, 12);
  });
});

describe("peak factor kappa", () => {
  it("is 1.7460 at R/X 0.1 and 1.4184 at R/X 0.3", () => {
    expect(peakFactor(0.1)).toBeCloseTo(1.746, 4); // reference-checks.md (from memory): 1.02 + 0.98 e^(-3 R/X)
    expect(peakFactor(0.3)).toBeCloseTo(1.4184, 4); // same
  });
  it("tends to 2 for a purely reactive circuit", () => {
    expect(peakFactor(0)).toBeCloseTo(2, 12); // 1.02 + 0.98 (formula limit)
  });
});

describe("breaking-current factor mu", () => {
  it("is 1 up to I\"kG/IrG = 2", () => {
    expect(breakingFactorMu(2, 0.1)).toBe(1); // reference-checks.md (from memory)
  });
  it("follows the four tabulated delays", () => {
    const x = 5;
    expect(breakingFactorMu(x, 0.02)).toBeCloseTo(0.84 + 0.26 * Math.exp(-0.26 * x), 12); // reference-checks.md (from memory)
    expect(breakingFactorMu(x, 0.05)).toBeCloseTo(0.71 + 0.51 * Math.exp(-0.3 * x), 12);
    expect(breakingFactorMu(x, 0.1)).toBeCloseTo(0.62 + 0.72 * Math.exp(-0.32 * x), 12);
    expect(breakingFactorMu(x, 0.25)).toBeCloseTo(0.56 + 0.94 * Math.exp(-0.38 * x), 12);
  });
  it("falls as the generator is loaded harder", () => {
    expect(breakingFactorMu(8, 0.1)).toBeLessThan(breakingFactorMu(3, 0.1)); // common practice: deeper faults decay more
  });
});

describe("thermal factor m", () => {
  it("is 0.0448 for kappa 1.8 at 50 Hz and Tk 1 s", () => {
    expect(thermalFactorM(1.8, 1, 50)).toBeCloseTo(0.0448, 4); // reference-checks.md (from memory)
  });
});
