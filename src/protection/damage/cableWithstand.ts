// Adiabatic short-circuit withstand of a cable conductor: I^2 t = k^2 S^2 (valid up to about 5 s).
import type { Polyline } from "../types.ts";

export type ConductorMaterial = "Cu" | "Al";
export type CableInsulation = "PVC" | "XLPE" | "EPR";

/** Adiabatic limit valid up to 5 s (IEC 60364-4-43, // from memory). */
export const ADIABATIC_LIMIT_S = 5;

/** IEC 60949 material constants: K (A s^0.5 / mm2) and beta (K, reciprocal temperature coefficient at 0 C). // from memory */
export const IEC60949_MATERIAL: Readonly<Record<ConductorMaterial, { K: number; beta: number }>> = {
  Cu: { K: 226, beta: 234.5 },
  Al: { K: 148, beta: 228 },
};

/** Initial (maximum operating) and final (short-circuit) conductor temperatures, C. PVC above 300 mm2 ends at 140 C. */
export function insulationTemperatures(insulation: CableInsulation, csa_mm2: number): { initial_C: number; final_C: number } {
  if (insulation === "PVC") return { initial_C: 70, final_C: csa_mm2 > 300 ? 140 : 160 };
  return { initial_C: 90, final_C: 250 };
}

/** IEC 60949: k = K * sqrt(ln((theta_f + beta) / (theta_i + beta))). */
export function cableKFromTemperatures(material: ConductorMaterial, initial_C: number, final_C: number): number {
  const { K, beta } = IEC60949_MATERIAL[material];
  if (!(final_C > initial_C)) throw new RangeError(`final temperature ${final_C} C must exceed initial ${initial_C} C`);
  return K * Math.sqrt(Math.log((final_C + beta) / (initial_C + beta)));
}

/**
 * Tabulated k (IEC 60364-5-54 / 60364-4-43 values): PVC 70 C Cu 115 (above 300 mm2: 103), Al 76 (68);
 * XLPE/EPR 90 C Cu 143, Al 94.
 */
export function cableK(material: ConductorMaterial, insulation: CableInsulation, csa_mm2: number): number {
  const big = csa_mm2 > 300;
  if (insulation === "PVC") return material === "Cu" ? (big ? 103 : 115) : big ? 68 : 76;
  return material === "Cu" ? 143 : 94;
}

/** Time in s the conductor withstands current_A: (k S)^2 / I^2, with `parallel` equal runs sharing the current. */
export function cableWithstand_s(k: number, csa_mm2: number, current_A: number, parallel = 1): number {
  const kS = k * csa_mm2 * parallel;
  return (kS * kS) / (current_A * current_A);
}

/** The withstand line from tMax_s (default 5 s, the adiabatic limit) down to tMin_s (default 0.01 s), [A, s]. */
export function cableWithstandCurve(k: number, csa_mm2: number, parallel = 1, tMin_s = 0.01, tMax_s = ADIABATIC_LIMIT_S): Polyline {
  if (!(k > 0) || !(csa_mm2 > 0) || !(parallel >= 1)) throw new RangeError(`cable withstand needs k > 0, csa_mm2 > 0, parallel >= 1 (got ${k}, ${csa_mm2}, ${parallel})`);
  const kS = k * csa_mm2 * parallel;
  const out: Polyline = [];
  const n = 8;
  for (let j = 0; j <= n; j++) {
    const t = tMax_s * Math.pow(tMin_s / tMax_s, j / n);
    out.push([kS / Math.sqrt(t), t]);
  }
  return out;
}
