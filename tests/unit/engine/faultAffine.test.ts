import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { FaultAffine, faultMagnitudesOf } from "../../../src/engine/fault/faultAffine.ts";
import { faultEquations, type SeqView } from "../../../src/engine/fault/faultEquations.ts";
import { faultMagnitudes } from "../../../src/engine/fault/faultCurrentMagnitude.ts";
import { FAULT_TYPES, type FaultType } from "../../../src/engine/types.ts";
import type { Cx } from "../../../src/engine/network/model.ts";

const cxArb = (lo: number, hi: number) => fc.record({ re: fc.double({ min: lo, max: hi, noNaN: true }), im: fc.double({ min: lo, max: hi, noNaN: true }) });
const zArb = fc.record({ re: fc.double({ min: 0.001, max: 2, noNaN: true }), im: fc.double({ min: 0.01, max: 5, noNaN: true }) });

describe("the fault point as a linear map of the open-circuit voltages", () => {
  it("agrees with the connection of the sequence networks for every fault type, to rounding", () => {
    // Reference: faultEquations, the series (LG, LL) and parallel (LLG) connections of the sequence networks at the
    // fault (symmetrical components; e.g. Grainger & Stevenson, Power System Analysis, ch. 12). Zero sequence
    // either a Thevenin impedance with no source or floating (no path to earth).
    fc.assert(
      fc.property(zArb, zArb, zArb, fc.boolean(), cxArb(0, 0.5), cxArb(-1.5, 1.5), cxArb(-0.5, 0.5), (z0, z1, z2, zeroFloats, zf, e1, e2) => {
        const aff = new FaultAffine();
        const out = new Float64Array(6);
        for (const type of FAULT_TYPES) {
          aff.load(type, zeroFloats ? null : z0, z1, z2, zf);
          aff.apply(e1.re, e1.im, e2.re, e2.im, out);
          const zeroView: SeqView = zeroFloats ? { floating: true, j: { re: 0, im: 0 } } : { floating: false, e: { re: 0, im: 0 }, z: z0 };
          const ref = faultEquations(type, [zeroView, { floating: false, e: e1, z: z1 }, { floating: false, e: e2, z: z2 }], zf).i;
          const scale = 1 + Math.max(...ref.map((i) => Math.hypot(i.re, i.im)));
          for (let s = 0; s < 3; s++) {
            expect(Math.abs(out[2 * s] - ref[s].re) / scale).toBeLessThan(1e-13);
            expect(Math.abs(out[2 * s + 1] - ref[s].im) / scale).toBeLessThan(1e-13);
          }
          const m = { ikss: 0, maxPhase: 0 };
          faultMagnitudesOf(type, out, m);
          const mr = faultMagnitudes(type, ref);
          expect(Math.abs(m.ikss - mr.ikss) / scale).toBeLessThan(1e-13);
          expect(Math.abs(m.maxPhase - mr.maxPhase) / scale).toBeLessThan(1e-13);
        }
      }),
      { numRuns: 300 },
    );
  });

  it("gives the textbook currents of a bolted fault with equal sequence impedances", () => {
    // Hand values, Z1 = Z2 = j0.1, Z0 = j0.3, E1 = 1, zf = 0 (symmetrical components, textbook formulas):
    // 3ph I1 = E/Z1 = -j10; LL I1 = E/(Z1 + Z2) = -j5, |Ib| = sqrt(3) 5; LG I0 = E/(Z0 + Z1 + Z2) = -j2, 3 I0 = 6;
    // LLG V = E Y1 / (Y1 + Y2 + Y0) with Y1 = Y2 = -j10, Y0 = -j10/3: V = 3/7, 3 |I0| = 3 (3/7)/0.3 = 30/7.
    const aff = new FaultAffine();
    const out = new Float64Array(6);
    const m = { ikss: 0, maxPhase: 0 };
    const z1: Cx = { re: 0, im: 0.1 };
    const z0: Cx = { re: 0, im: 0.3 };
    const expected: Record<FaultType, number> = { "3ph": 10, LL: 5 * Math.sqrt(3), LG: 6, LLG: 30 / 7 };
    for (const type of FAULT_TYPES) {
      aff.load(type, z0, z1, z1, { re: 0, im: 0 });
      aff.apply(1, 0, 0, 0, out);
      faultMagnitudesOf(type, out, m);
      expect(m.ikss).toBeCloseTo(expected[type], 12);
    }
    // No zero-sequence path: no earth-fault current.
    aff.load("LG", null, z1, z1, { re: 0, im: 0 });
    aff.apply(1, 0, 0, 0, out);
    expect([...out]).toEqual([0, 0, 0, 0, 0, 0]);
  });
});
