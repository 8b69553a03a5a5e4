// Building a device measurement from sequence quantities.
import type { Measurement, SequenceQuantities } from "./types.ts";
import { A2_OP, A_OP } from "./phasor.ts";

/**
 * Phase currents Ia = I0 + I1 + I2, Ib = I0 + a^2 I1 + a I2, Ic = I0 + a I1 + a^2 I2; residual |3 I0|; negative |I2|.
 * Written out in scalars (the same operations, in the same order, as add/mul in phasor.ts): a study builds one
 * measurement per device and fault state, and the temporaries dominated its memory traffic.
 */
export function measurementFromSequence(seq: SequenceQuantities): Measurement {
  const { i0_A: i0, i1_A: i1, i2_A: i2 } = seq;
  const ia = Math.hypot(i0.re + i1.re + i2.re, i0.im + i1.im + i2.im);
  // a^2 I1 and a I2 (Ib), a I1 and a^2 I2 (Ic): (x + jy)(u + jv) = (xu - yv) + j(xv + yu)
  const b1re = A2_OP.re * i1.re - A2_OP.im * i1.im;
  const b1im = A2_OP.re * i1.im + A2_OP.im * i1.re;
  const b2re = A_OP.re * i2.re - A_OP.im * i2.im;
  const b2im = A_OP.re * i2.im + A_OP.im * i2.re;
  const c1re = A_OP.re * i1.re - A_OP.im * i1.im;
  const c1im = A_OP.re * i1.im + A_OP.im * i1.re;
  const c2re = A2_OP.re * i2.re - A2_OP.im * i2.im;
  const c2im = A2_OP.re * i2.im + A2_OP.im * i2.re;
  const ib = Math.hypot(i0.re + b1re + b2re, i0.im + b1im + b2im);
  const ic = Math.hypot(i0.re + c1re + c2re, i0.im + c1im + c2im);
  return { phase_A: [ia, ib, ic], residual_A: 3 * Math.hypot(i0.re, i0.im), negative_A: Math.hypot(i2.re, i2.im), sequence: seq };
}

/** A balanced measurement of `current_A` in each phase (no residual, no negative sequence), for curve plotting. */
export function balancedMeasurement(current_A: number): Measurement {
  return { phase_A: [current_A, current_A, current_A], residual_A: 0, negative_A: 0 };
}
