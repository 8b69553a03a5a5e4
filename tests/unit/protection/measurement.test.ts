import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { complex, add as cAdd, multiply, abs as cAbs, exp, pi, type Complex } from "mathjs";
import { measurementFromSequence, type Phasor, type SequenceQuantities } from "../../../src/protection/index.ts";
import { A2_OP, A_OP, abs, add, mul } from "../../../src/protection/phasor.ts";

const phasorArb = fc.record({ re: fc.double({ min: -1e4, max: 1e4, noNaN: true }), im: fc.double({ min: -1e4, max: 1e4, noNaN: true }) });
const zero: Phasor = { re: 0, im: 0 };
const seqOf = (i0_A: Phasor, i1_A: Phasor, i2_A: Phasor): SequenceQuantities => ({ i0_A, i1_A, i2_A, v0_pu: zero, v1_pu: zero, v2_pu: zero });

describe("measurement from sequence currents", () => {
  it("gives bit for bit what the defining phasor sums give", () => {
    // IEC 60909-0:2016, 6.1 (symmetrical components): Ia = I0 + I1 + I2, Ib = I0 + a^2 I1 + a I2, Ic = I0 + a I1 + a^2 I2
    fc.assert(
      fc.property(phasorArb, phasorArb, phasorArb, (i0, i1, i2) => {
        const m = measurementFromSequence(seqOf(i0, i1, i2));
        const ia = abs(add(add(i0, i1), i2));
        const ib = abs(add(add(i0, mul(A2_OP, i1)), mul(A_OP, i2)));
        const ic = abs(add(add(i0, mul(A_OP, i1)), mul(A2_OP, i2)));
        expect(m.phase_A).toEqual([ia, ib, ic]);
        expect(m.residual_A).toBe(3 * abs(i0));
        expect(m.negative_A).toBe(abs(i2));
      }),
      { numRuns: 500 },
    );
  });

  it("agrees with an independent complex computation (mathjs)", () => {
    const a = exp(multiply(complex(0, 1), (2 * pi) / 3) as Complex) as Complex; // a = e^(j 120 deg)
    const a2 = multiply(a, a) as Complex;
    const c = (p: Phasor) => complex(p.re, p.im);
    fc.assert(
      fc.property(phasorArb, phasorArb, phasorArb, (i0, i1, i2) => {
        const m = measurementFromSequence(seqOf(i0, i1, i2));
        const ref = [
          cAdd(cAdd(c(i0), c(i1)), c(i2)),
          cAdd(cAdd(c(i0), multiply(a2, c(i1))), multiply(a, c(i2))),
          cAdd(cAdd(c(i0), multiply(a, c(i1))), multiply(a2, c(i2))),
        ].map((x) => cAbs(x as Complex) as unknown as number);
        ref.forEach((r, k) => expect(Math.abs(m.phase_A[k] - r)).toBeLessThan(1e-9 * (1 + r + abs(i0) + abs(i1) + abs(i2))));
      }),
      { numRuns: 200 },
    );
  });

  it("reads a balanced positive-sequence current as equal phase currents", () => {
    const m = measurementFromSequence(seqOf(zero, { re: 100, im: 0 }, zero));
    // IEC 60909-0:2016, 6.1: a balanced system has only a positive-sequence component, |Ia| = |Ib| = |Ic| = |I1|
    m.phase_A.forEach((i) => expect(i).toBeCloseTo(100, 9));
    expect(m.residual_A).toBe(0);
    expect(m.negative_A).toBe(0);
  });
});
