// Building a device measurement from sequence quantities.
import type { Measurement, SequenceQuantities } from "./types.ts";
import { A2_OP, A_OP, abs, add, mul } from "./phasor.ts";

/** Phase currents Ia = I0 + I1 + I2, Ib = I0 + a^2 I1 + a I2, Ic = I0 + a I1 + a^2 I2; residual |3 I0|; negative |I2|. */
export function measurementFromSequence(seq: SequenceQuantities): Measurement {
  const { i0_A: i0, i1_A: i1, i2_A: i2 } = seq;
  const ia = add(add(i0, i1), i2);
  const ib = add(add(i0, mul(A2_OP, i1)), mul(A_OP, i2));
  const ic = add(add(i0, mul(A_OP, i1)), mul(A2_OP, i2));
  return { phase_A: [abs(ia), abs(ib), abs(ic)], residual_A: 3 * abs(i0), negative_A: abs(i2), sequence: seq };
}

/** A balanced measurement of `current_A` in each phase (no residual, no negative sequence), for curve plotting. */
export function balancedMeasurement(current_A: number): Measurement {
  return { phase_A: [current_A, current_A, current_A], residual_A: 0, negative_A: 0 };
}
