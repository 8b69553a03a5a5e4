// Small three-phase conversions used across the model and the reports.

/** Short-circuit power to current: Ik = S"k / (sqrt(3) Un) (MVA / kV = kA). */
export function skToIk_kA(sk_MVA: number, un_kV: number): number {
  return sk_MVA / (Math.sqrt(3) * un_kV);
}

/** Short-circuit current to power: S"k = sqrt(3) Un Ik (kV * kA = MVA). */
export function ikToSk_MVA(ik_kA: number, un_kV: number): number {
  return Math.sqrt(3) * un_kV * ik_kA;
}

/** Rated line current of a three-phase apparatus: Ir = Sr / (sqrt(3) Ur), in A. */
export function ratedCurrent_A(sr_MVA: number, ur_kV: number): number {
  return (sr_MVA * 1000) / (Math.sqrt(3) * ur_kV);
}

/** Apparent power from active and reactive power: S = sqrt(P^2 + Q^2). */
export function apparentPower_kVA(p_kW: number, q_kvar: number): number {
  return Math.hypot(p_kW, q_kvar);
}

/** Electrical input of a motor: Sr = Pr / (eta cos phi), in kVA. */
export function motorInput_kVA(pr_kW: number, eta: number, cosPhi: number): number {
  return pr_kW / (eta * cosPhi);
}
