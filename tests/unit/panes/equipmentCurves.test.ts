import { describe, expect, it } from "vitest";
import { evaluate } from "mathjs";
import { lineSchema, motorSchema, transformerSchema } from "../../../src/model/schema.ts";
import { cableCurve, motorCurve, ratedCurrent_A, transformerCurves } from "../../../renderer/panes/tcc/equipmentCurves.ts";
import { curveTimeAt } from "../../../renderer/panes/tcc/curveTimeAt.ts";

const tx = transformerSchema.parse({ kind: "transformer", id: "T1", name: "Unit", hvBus: "A", lvBus: "B", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 });

describe("transformer curves on the time-current pane", () => {
  it("uses the rated current S / (sqrt(3) U)", () => {
    // 1000 kVA at 400 V: 1000e3 / (sqrt(3) * 400) = 1443.4 A (three-phase power relation, mathjs)
    expect(ratedCurrent_A(1, 0.4)).toBeCloseTo(evaluate("1000e3 / (sqrt(3) * 400)") as number, 6);
  });

  it("puts the inrush point at 12 x rated current for 0.1 s, referred to the plot voltage", () => {
    const { inrush } = transformerCurves(tx, "lv", 11);
    // 12 x rated for 0.1 s (common practice); LV amperes referred to 11 kV by 0.4 / 11
    expect(inrush.current_A).toBeCloseTo(evaluate("12 * 1000e3 / (sqrt(3) * 400) * 0.4 / 11") as number, 6);
    expect(inrush.time_s).toBe(0.1);
  });

  it("draws the withstand of a 1000 kVA unit as category II", () => {
    const { curve } = transformerCurves(tx, "lv", 0.4);
    // IEEE C57.12.00: three-phase 501-5000 kVA is category II
    expect(curve.detail).toMatch(/category II\b/);
    expect(curve.kind).toBe("transformer-damage");
  });
});

describe("cable withstand on the time-current pane", () => {
  const cable = lineSchema.parse({
    kind: "line",
    id: "C1",
    fromBus: "A",
    toBus: "B",
    length_km: 0.1,
    r1_ohmPerKm: 0.15,
    x1_ohmPerKm: 0.08,
    r0_ohmPerKm: 0.6,
    x0_ohmPerKm: 0.3,
    csa_mm2: 120,
    ampacity_A: 300,
    material: "Cu",
    insulation: "XLPE",
  });

  it("follows I^2 t = k^2 S^2 with k = 143 for XLPE copper", () => {
    const c = cableCurve(cable, 0.4, 0.4);
    // IEC 60364-4-43 adiabatic equation, k = 143 (XLPE 90 C, Cu): t = (143 * 120 / 10000)^2 = 2.945 s at 10 kA
    const t = evaluate("(143 * 120 / 10000)^2") as number;
    expect(curveTimeAt(c.points, 10000)).toBeCloseTo(t, 2);
  });
});

describe("motor starting curve", () => {
  it("holds the locked-rotor current for the starting time", () => {
    const m = motorSchema.parse({ kind: "motor", id: "M1", bus: "B", pr_kW: 55, ur_kV: 0.4, start_s: 6 });
    const c = motorCurve(m, 0.4);
    // input kVA = P / (eta cos phi) = 55 / (0.94 * 0.86); I = S / (sqrt(3) U); locked rotor 6 x (schema defaults)
    const ilr = evaluate("6 * 55e3 / (0.94 * 0.86) / (sqrt(3) * 400)") as number;
    expect(c.points.some(([i, t]) => Math.abs(i - ilr) < 1e-6 * ilr && t === 6)).toBe(true);
  });
});
