// Directional decision of a 67 / 67N / directional 46 function from sequence quantities.
//
// Polarisation (the project's choice, stated so users can set rca_deg):
//  - phase functions (67): operating I1, polarising -j V1, i.e. the positive-sequence form of the
//    quadrature (90 degree) connection; a forward fault current lagging V1 by 45 degrees sits at rca_deg 45.
//    No voltage memory: a close-in three-phase fault with |V1| below the threshold is undetermined.
//  - residual functions (67N): operating 3 I0, polarising -3 V0; when |V0| is below the threshold,
//    negative-sequence polarisation takes over: operating I2, polarising -V2.
//  - negative-sequence functions (46/51Q directional): operating I2, polarising -V2.
// Forward when the operating current leads the polarising voltage by rca_deg +/- less than 90 degrees.
import type { RelayFunction } from "../model/schema.ts";
import type { SequenceQuantities } from "./types.ts";
import { abs, arg_deg, mul, phasor, scale } from "./phasor.ts";
import type { Phasor } from "./types.ts";

/** Minimum polarising voltage, pu; below it the direction is undetermined. // common practice (1 % of nominal) */
export const POLARISING_MIN_PU = 0.01;
/** Minimum operating current, A, below which a direction is not computed. */
export const OPERATING_MIN_A = 1e-9;

export type Direction = "forward" | "reverse" | "undetermined";

export interface DirectionDecision {
  direction: Direction;
  /** Angle of the operating current relative to the polarising voltage, degrees, in (-180, 180]. */
  angle_deg: number;
  /** Which quantities were used, for the reason line. */
  polarisation: string;
}

function decide(op: Phasor, pol: Phasor, rca_deg: number, polarisation: string): DirectionDecision {
  if (abs(pol) < POLARISING_MIN_PU || abs(op) < OPERATING_MIN_A) return { direction: "undetermined", angle_deg: NaN, polarisation };
  let angle = arg_deg(op) - arg_deg(pol);
  angle = ((((angle + 180) % 360) + 360) % 360) - 180;
  // torque ~ cos(angle - rca): strictly positive is forward, strictly negative is reverse
  const torque = Math.cos(((angle - rca_deg) * Math.PI) / 180);
  const eps = 1e-12;
  const direction: Direction = torque > eps ? "forward" : torque < -eps ? "reverse" : "undetermined";
  return { direction, angle_deg: angle, polarisation };
}

export function directionOf(fn: Pick<RelayFunction, "quantity" | "rca_deg">, seq: SequenceQuantities): DirectionDecision {
  const minusJ = phasor(0, -1);
  if (fn.quantity === "phase") return decide(seq.i1_A, mul(minusJ, seq.v1_pu), fn.rca_deg, "I1 against -jV1");
  if (fn.quantity === "residual" && abs(seq.v0_pu) >= POLARISING_MIN_PU) {
    return decide(scale(seq.i0_A, 3), scale(seq.v0_pu, -3), fn.rca_deg, "3I0 against -3V0");
  }
  return decide(seq.i2_A, scale(seq.v2_pu, -1), fn.rca_deg, fn.quantity === "residual" ? "I2 against -V2 (V0 too small)" : "I2 against -V2");
}
