import { describe, it, expect } from "vitest";
import { cableK, cableKFromTemperatures, cableWithstand_s, cableWithstandCurve, insulationTemperatures, transformerCategory, transformerWithstand, inrushPoint, motorStarting, THERMAL_POINTS_PU } from "../../../src/protection/index.ts";

describe("cable adiabatic withstand", () => {
  it("recomputes the tabulated k from the IEC 60949 formula", () => {
    // k = K sqrt(ln((theta_f + beta)/(theta_i + beta))), K 226 / 148, beta 234.5 / 228 // from memory; results [recomputed] in reference-checks
    expect(cableKFromTemperatures("Cu", 70, 160)).toBeCloseTo(115.0, 1);
    expect(cableKFromTemperatures("Cu", 70, 140)).toBeCloseTo(102.8, 1);
    expect(cableKFromTemperatures("Cu", 90, 250)).toBeCloseTo(143.1, 1);
    expect(cableKFromTemperatures("Al", 70, 160)).toBeCloseTo(76.0, 1);
    expect(cableKFromTemperatures("Al", 70, 140)).toBeCloseTo(68.0, 1);
    expect(cableKFromTemperatures("Al", 90, 250)).toBeCloseTo(94.5, 1);
  });

  it("gives the tabulated k by material, insulation and size", () => {
    // IEC 60364-5-54 / 60364-4-43 values [published in reference-checks]
    expect(cableK("Cu", "PVC", 240)).toBe(115);
    expect(cableK("Cu", "PVC", 400)).toBe(103);
    expect(cableK("Al", "PVC", 240)).toBe(76);
    expect(cableK("Al", "PVC", 400)).toBe(68);
    expect(cableK("Cu", "XLPE", 400)).toBe(143);
    expect(cableK("Al", "EPR", 95)).toBe(94);
  });

  it("agrees between table and formula within the table's rounding", () => {
    for (const mat of ["Cu", "Al"] as const) {
      for (const ins of ["PVC", "XLPE"] as const) {
        for (const s of [95, 400]) {
          const { initial_C, final_C } = insulationTemperatures(ins, s);
          expect(Math.abs(cableK(mat, ins, s) - cableKFromTemperatures(mat, initial_C, final_C))).toBeLessThan(0.6); // independent computation
        }
      }
    }
  });

  it("gives t = (k S)^2 / I^2, shared by parallel runs", () => {
    expect(cableWithstand_s(115, 95, 10000)).toBeCloseTo((115 * 95) ** 2 / 1e8, 9); // 1.1935 s (hand calc)
    expect(cableWithstand_s(115, 95, 20000, 2)).toBeCloseTo((115 * 95) ** 2 / 1e8, 9); // two runs, twice the current (hand calc)
    const line = cableWithstandCurve(143, 240);
    for (const [i, t] of line) expect(i * i * t).toBeCloseTo((143 * 240) ** 2, 0); // constant I^2 t along the line
  });
});

describe("transformer through-fault withstand", () => {
  it("classifies three-phase transformers by kVA (IEEE C57.12.00)", () => {
    // IEEE C57.12.00 [published in reference-checks]: I 15-500, II 501-5000, III 5001-30000, IV above
    expect(transformerCategory(500)).toBe("I");
    expect(transformerCategory(501)).toBe("II");
    expect(transformerCategory(5000)).toBe("II");
    expect(transformerCategory(5001)).toBe("III");
    expect(transformerCategory(30000)).toBe("III");
    expect(transformerCategory(30001)).toBe("IV");
  });

  it("follows 1250 / I^2 for category I, 2 s at 25 x", () => {
    // IEEE C57.109 category I, t = 1250 / I^2 // from memory
    const w = transformerWithstand({ sr_kVA: 300, ratedCurrent_A: 433, z_pu: 0.04 });
    expect(w.category).toBe("I");
    const last = w.infrequent[w.infrequent.length - 1];
    expect(last[0]).toBeCloseTo(25 * 433, 6);
    expect(last[1]).toBeCloseTo(2, 9);
    const at = (x: number) => w.infrequent.find((p) => Math.abs(p[0] / 433 - x) < 1e-9)?.[1];
    expect(at(11.3)).toBeCloseTo(10, 0); // thermal point 11.3x / 10 s // from memory
    expect(at(2)).toBeCloseTo(1800, 6); // thermal point 2x / 1800 s // from memory
  });

  it("passes through the thermal points for category II and drops to the frequent-fault curve at 70 % of the maximum current", () => {
    // IEEE C57.109 thermal points and category II construction // from memory
    const w = transformerWithstand({ sr_kVA: 2000, ratedCurrent_A: 100, z_pu: 0.05 });
    expect(w.category).toBe("II");
    for (const [x, t] of THERMAL_POINTS_PU.filter(([x]) => x < 20)) {
      const p = w.infrequent.find((q) => Math.abs(q[0] - x * 100) < 1e-9);
      expect(p?.[1]).toBeCloseTo(t, 9);
    }
    expect(w.iMax_A).toBeCloseTo(2000, 9); // 1 / 0.05 = 20 x rated (hand calc)
    const end = w.frequent[w.frequent.length - 1];
    expect(end[1]).toBeCloseTo(2, 9); // 2 s at the maximum current // from memory
    const knee = w.frequent.filter((p) => Math.abs(p[0] - 1400) < 1e-9);
    expect(knee.length).toBe(2); // vertical drop at 0.7 x 20 = 14 x rated
    expect(knee[1][1]).toBeCloseTo((2 * 20 * 20) / (14 * 14), 9); // K / I^2 with K = 2 * 20^2 (hand calc)
  });
});

describe("reference points", () => {
  it("puts the inrush point at 12 x rated for 0.1 s", () => {
    expect(inrushPoint(100)).toEqual([1200, 0.1]); // common practice
  });

  it("draws the motor start at locked-rotor current for the start time, with the hot-stall point", () => {
    const m = motorStarting({ ratedCurrent_A: 50, ilrIr: 6, start_s: 8, hotStall_s: 15 });
    expect(m.curve).toContainEqual([300, 8]); // 6 x 50 A for 8 s (hand calc)
    expect(m.curve).toContainEqual([50, 8]);
    expect(m.hotStall).toEqual([300, 15]);
    expect(motorStarting({ ratedCurrent_A: 50, ilrIr: 6, start_s: 8, hotStall_s: 6 }).warning).toMatch(/not above the starting time/);
  });
});
