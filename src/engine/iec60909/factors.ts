// IEC 60909-0:2016 correction and time-dependence factors, as pure functions.

/** Voltage factor c (IEC 60909-0:2016, Table 1). LV is un <= 1 kV. */
export function voltageFactor(un_kV: number, limit: "max" | "min", lvTolerance_pct: 6 | 10): number {
  if (un_kV <= 1) return limit === "max" ? (lvTolerance_pct === 6 ? 1.05 : 1.1) : 0.95;
  return limit === "max" ? 1.1 : 1.0;
}

/** Network transformer correction KT = 0.95 cmax / (1 + 0.6 xT), xT in pu of the transformer rating. */
export function transformerKT(xT_pu: number, cmax: number): number {
  return (0.95 * cmax) / (1 + 0.6 * xT_pu);
}

/** Generator correction KG = (Un/UrG) cmax / (1 + x"d sin(phi_rG)). */
export function generatorKG(un_kV: number, urG_kV: number, cmax: number, xdss_pu: number, cosPhi: number): number {
  const sinPhi = Math.sqrt(Math.max(0, 1 - cosPhi * cosPhi));
  return ((un_kV / urG_kV) * cmax) / (1 + xdss_pu * sinPhi);
}

/** Peak factor kappa = 1.02 + 0.98 exp(-3 R/X). */
export function peakFactor(rx: number): number {
  return 1.02 + 0.98 * Math.exp(-3 * rx);
}

/**
 * Breaking-current factor mu for a generator with x = I"kG / IrG at minimum time delay tmin (s).
 * Between the tabulated delays the next smaller one is used (conservative: larger mu); mu = 1 for x <= 2.
 */
export function breakingFactorMu(x: number, tmin_s: number): number {
  if (!(x > 2)) return 1;
  let mu: number;
  if (tmin_s < 0.05) mu = 0.84 + 0.26 * Math.exp(-0.26 * x);
  else if (tmin_s < 0.1) mu = 0.71 + 0.51 * Math.exp(-0.3 * x);
  else if (tmin_s < 0.25) mu = 0.62 + 0.72 * Math.exp(-0.32 * x);
  else mu = 0.56 + 0.94 * Math.exp(-0.38 * x);
  return Math.min(1, mu);
}

/** Heat-effect factor m of the d.c. component (IEC 60909-0:2016, formula for m). */
export function thermalFactorM(kappa: number, tk_s: number, f_Hz: number): number {
  const k = Math.max(kappa, 1.0000001);
  const lnk = Math.log(k - 1);
  return (1 / (2 * f_Hz * tk_s * lnk)) * (Math.exp(4 * f_Hz * tk_s * lnk) - 1);
}
