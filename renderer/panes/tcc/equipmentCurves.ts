// Adapter from network elements to the pane's equipment curves: transformer through-fault withstand
// (IEEE C57.109) with its inrush point, cable adiabatic withstand (I^2 t = k^2 S^2), motor starting.
// All currents are referred to the plot voltage: I_ref = I * kV_side / kV_ref.
import type { Line, Motor, Transformer } from "../../../src/model/schema.ts";
import { cableK, cableWithstandCurve, inrushPoint, motorStarting, referScale, transformerWithstand } from "../../../src/protection/index.ts";
import type { CurvePoint, TccEquipmentCurve, TccMarkerPoint } from "./tccTypes.ts";

const refer = (points: readonly CurvePoint[], k: number): CurvePoint[] => points.map(([i, t]) => [i * k, t] as const);

/** Rated current of a three-phase winding in A: S / (sqrt(3) U). */
export function ratedCurrent_A(s_MVA: number, u_kV: number): number {
  return (s_MVA * 1000) / (Math.sqrt(3) * u_kV);
}

/** Withstand curve and inrush point of a transformer, drawn for its `side` winding and referred to `reference_kV`. */
export function transformerCurves(tr: Transformer, side: "hv" | "lv", reference_kV: number): { curve: TccEquipmentCurve; inrush: TccMarkerPoint } {
  const u_kV = side === "hv" ? tr.urHv_kV : tr.urLv_kV;
  const ir = ratedCurrent_A(tr.sr_MVA, u_kV);
  const k = referScale(u_kV, reference_kV);
  const w = transformerWithstand({ sr_kVA: tr.sr_MVA * 1000, ratedCurrent_A: ir, z_pu: tr.uk_pct / 100 });
  const [iInrush, tInrush] = inrushPoint(ir);
  const name = tr.name || tr.id;
  return {
    curve: {
      id: `${tr.id}:withstand`,
      name: `${name} withstand`,
      detail: `through-fault, IEEE C57.109 category ${w.category}`,
      kind: "transformer-damage",
      points: refer(w.infrequent, k),
    },
    inrush: { id: `${tr.id}:inrush`, name: `${name} inrush`, kind: "inrush", current_A: iInrush * k, time_s: tInrush },
  };
}

/** Adiabatic withstand of a cable (all parallel runs), referred to `reference_kV`. */
export function cableCurve(line: Line, line_kV: number, reference_kV: number): TccEquipmentCurve {
  const k = cableK(line.material, line.insulation, line.csa_mm2);
  const pts = cableWithstandCurve(k, line.csa_mm2, line.parallel);
  const name = line.name || line.id;
  return {
    id: `${line.id}:withstand`,
    name: `${name} withstand`,
    detail: `I²t = k²S², k ${Math.round(k)}, ${line.parallel > 1 ? `${line.parallel} x ` : ""}${line.csa_mm2} mm² ${line.material}`,
    kind: "cable-damage",
    points: refer(pts, referScale(line_kV, reference_kV)),
  };
}

/** Starting curve of a motor (locked-rotor current for the starting time, then rated current), referred to `reference_kV`. */
export function motorCurve(motor: Motor, reference_kV: number): TccEquipmentCurve {
  const ir = (motor.pr_kW / (motor.eta * motor.cosPhi)) / (Math.sqrt(3) * motor.ur_kV);
  const start = motorStarting({ ratedCurrent_A: ir, ilrIr: motor.ilrIr, start_s: motor.start_s });
  const name = motor.name || motor.id;
  return { id: `${motor.id}:start`, name: `${name} starting`, kind: "motor-start", points: refer(start.curve, referScale(motor.ur_kV, reference_kV)) };
}
