// Equipment withstand time at a through-fault current, for the speed check: how long the element the
// primary device looks into can carry the fault current (damage curves from src/protection).
// Infinity where no limit applies (elements without a damage curve, overload region).
import type { Element, Line, Transformer } from "../model/schema.ts";
import { cableK, cableWithstand_s, logLogInterpolate, transformerWithstand, type Polyline } from "../protection/index.ts";

/** Cable: adiabatic I^2 t = k^2 S^2 per run (k from IEC 60364-5-54 via src/protection). */
export function lineWithstand_s(line: Line, current_A: number): number {
  if (!(current_A > 0)) return Infinity;
  return cableWithstand_s(cableK(line.material, line.insulation, line.csa_mm2), line.csa_mm2, current_A, line.parallel);
}

/** Rated current of a transformer winding at the given end, A. */
export function transformerRated_A(t: Transformer, end: "from" | "to"): number {
  const kV = end === "from" ? t.urHv_kV : t.urLv_kV;
  return (t.sr_MVA * 1000) / (Math.sqrt(3) * kV);
}

/** Transformer through-fault withstand (IEEE C57.109 shape): the frequent-fault curve, the stricter one. */
export function transformerWithstand_s(t: Transformer, end: "from" | "to", current_A: number): number {
  const curve = transformerWithstand({ sr_kVA: t.sr_MVA * 1000, ratedCurrent_A: transformerRated_A(t, end), z_pu: t.uk_pct / 100 });
  return logLogInterpolate(curve.frequent, current_A);
}

/** Withstand of `element` at `current_A` seen at `end`; Infinity for elements without a damage curve. */
export function withstand_s(element: Element | undefined, end: "from" | "to" | "terminal", current_A: number): number {
  if (element?.kind === "line") return lineWithstand_s(element, current_A);
  if (element?.kind === "transformer" && end !== "terminal") return transformerWithstand_s(element, end, current_A);
  return Infinity;
}

export type WithstandFn = typeof withstand_s;

/** withstand_s with each transformer's damage curve built once (a study asks thousands of times). */
export function memoWithstand(): WithstandFn {
  const curves = new Map<string, Polyline>();
  return (element, end, current_A) => {
    if (element?.kind !== "transformer" || end === "terminal") return withstand_s(element, end, current_A);
    const key = `${element.id}|${end}`;
    let curve = curves.get(key);
    if (!curve) {
      curve = transformerWithstand({ sr_kVA: element.sr_MVA * 1000, ratedCurrent_A: transformerRated_A(element, end), z_pu: element.uk_pct / 100 }).frequent;
      curves.set(key, curve);
    }
    return logLogInterpolate(curve, current_A);
  };
}
