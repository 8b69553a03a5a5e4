// Lines and cables: series impedance only (capacitances left out, IEC 60909-0:2016). Resistance at 20 C for
// maximum currents and at the end-of-fault temperature for minimum: R = R20 (1 + 0.004/K (theta - 20)).
import type { Line } from "../../model/schema.ts";
import type { Cx } from "../network/model.ts";

export const ALPHA_PER_K = 0.004;
/** Smallest series impedance kept, pu: a zero-impedance line would make the matrix singular. */
export const Z_FLOOR_PU = 1e-9;

export interface LineImpedance {
  z: [Cx, Cx, Cx];
  clamped: boolean;
}

export function lineImpedance(l: Line, zBase_ohm: number, endTemp_C: number | null): LineImpedance {
  const rf = endTemp_C === null ? 1 : 1 + ALPHA_PER_K * (endTemp_C - 20);
  const k = l.length_km / l.parallel / zBase_ohm;
  const z1 = { re: l.r1_ohmPerKm * rf * k, im: l.x1_ohmPerKm * k };
  const z0 = { re: l.r0_ohmPerKm * rf * k, im: l.x0_ohmPerKm * k };
  let clamped = false;
  for (const z of [z1, z0]) {
    if (Math.hypot(z.re, z.im) < Z_FLOOR_PU) {
      z.im = Math.max(z.im, Z_FLOOR_PU);
      clamped = true;
    }
  }
  return { z: [z0, z1, { ...z1 }], clamped };
}
