// Generic parametric fuse families of this project (illustrative, not any manufacturer's data).
//
// Melting follows a first-order thermal element with heat loss, t = tau * ln(1 / (1 - (m / x)^n)),
// x = I / rating: an asymptote at m x rating (below it the element never melts) and, at high currents,
// t -> tau * (m / x)^n. m sits between the conventional non-fusing (1.25 x) and fusing (1.6 x) currents
// (IEC 60269-1 style conventional zone, // from memory). The total-clearing curve is the melting curve
// shifted up in current by `clearShift` (manufacturing spread) plus an arcing time; its asymptote
// m * clearShift stays at or below 1.6 x so the fuse is sure to operate at the conventional fusing current.
export type FuseFamily = "general-purpose" | "fast" | "time-delay";

export interface FuseFamilyLaw {
  /** Melting asymptote as a multiple of rating. */
  m: number;
  /** Exponent of the thermal law. */
  n: number;
  /** Melting time at 10 x rating, s (sets tau). */
  t10_s: number;
  /** Current shift from melting to clearing curve. */
  clearShift: number;
  /** Arcing time added to the clearing curve, s (half a cycle at 50 Hz, // common practice). */
  arc_s: number;
}

export const FUSE_FAMILY_LAWS: Readonly<Record<FuseFamily, FuseFamilyLaw>> = {
  "general-purpose": { m: 1.45, n: 3.5, t10_s: 0.1, clearShift: 1.1, arc_s: 0.01 },
  fast: { m: 1.35, n: 4, t10_s: 0.01, clearShift: 1.1, arc_s: 0.005 },
  "time-delay": { m: 1.45, n: 3, t10_s: 1, clearShift: 1.1, arc_s: 0.01 },
};

export const FUSE_FAMILY_TITLES: Readonly<Record<FuseFamily, string>> = {
  "general-purpose": "General-purpose (illustrative family)",
  fast: "Fast-acting (illustrative family)",
  "time-delay": "Time-delay (illustrative family)",
};

function tau_s(law: FuseFamilyLaw): number {
  return law.t10_s / -Math.log(1 - Math.pow(law.m / 10, law.n));
}

/** Melting time in s at multiple x of rating; Infinity at or below the asymptote. */
export function familyMelt_s(law: FuseFamilyLaw, x: number): number {
  if (!(x > law.m)) return Infinity;
  // -log1p(-u) keeps precision when (m/x)^n is tiny at high currents
  return -tau_s(law) * Math.log1p(-Math.pow(law.m / x, law.n));
}

/** Total clearing time in s at multiple x of rating; Infinity at or below its asymptote. */
export function familyClear_s(law: FuseFamilyLaw, x: number): number {
  const melt = familyMelt_s(law, x / law.clearShift);
  return Number.isFinite(melt) ? melt + law.arc_s : Infinity;
}

/** The multiple x at which the melting curve takes t_s (inverse of familyMelt_s). */
export function familyMeltMultiple(law: FuseFamilyLaw, t_s: number): number {
  if (!(t_s > 0)) return Infinity;
  return law.m / Math.pow(-Math.expm1(-t_s / tau_s(law)), 1 / law.n);
}
