// IEC 60909-0:2016 correction and time-dependence factors, as pure functions.

const sinOf = (cosPhi: number) => Math.sqrt(Math.max(0, 1 - cosPhi * cosPhi));

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
  return ((un_kV / urG_kV) * cmax) / (1 + xdss_pu * sinOf(cosPhi));
}

/**
 * Power station unit with on-load tap changer, faults outside the unit (IEC 60909-0:2016, 6.7.1, eq. (22); numbering
 * from memory): K_S = (U_nQ^2 / U_rG^2) (U_rTLV^2 / U_rTHV^2) cmax / (1 + |x"d - xT| sin phi_rG), applied as
 * Z_S = K_S (t_r^2 Z_G + Z_THV) with t_r = U_rTHV / U_rTLV (eq. (21)). cmax of the HV side (U_nQ).
 */
export function unitKS(unQ_kV: number, urG_kV: number, urTLv_kV: number, urTHv_kV: number, cmax: number, xdss_pu: number, xT_pu: number, cosPhi: number): number {
  const ratio = (unQ_kV / urG_kV) * (urTLv_kV / urTHv_kV);
  return (ratio * ratio * cmax) / (1 + Math.abs(xdss_pu - xT_pu) * sinOf(cosPhi));
}

/**
 * Power station unit without on-load tap changer (IEC 60909-0:2016, 6.7.2; eq. (24) in the 2001 numbering, from
 * memory): K_SO = (U_nQ / (U_rG (1 + p_G))) (U_rTLV / U_rTHV) (1 +/- p_T) cmax / (1 + x"d sin phi_rG), applied as
 * Z_SO = K_SO (t_r^2 Z_G + Z_THV). pG: range of generator voltage regulation (fraction). pT: the permanently used
 * off-load tap as a signed fraction (+ raises the HV/LV ratio, giving the factor 1 + pT).
 */
export function unitKSO(unQ_kV: number, urG_kV: number, urTLv_kV: number, urTHv_kV: number, cmax: number, xdss_pu: number, cosPhi: number, pG: number, pT: number): number {
  return ((unQ_kV / (urG_kV * (1 + pG))) * (urTLv_kV / urTHv_kV) * (1 + pT) * cmax) / (1 + xdss_pu * sinOf(cosPhi));
}

/**
 * Faults inside a power station unit (between generator and unit transformer), the generator's share
 * (IEC 60909-0:2016, 6.7.1 and 6.7.2, K_G,S and K_G,SO; from memory): cmax / (1 + x"d sin phi_rG), divided by
 * (1 + p_G) for a unit without on-load tap changer (pass pG = 0 with one). cmax of the generator voltage level.
 */
export function unitGeneratorK(cmax: number, xdss_pu: number, cosPhi: number, pG: number): number {
  return cmax / ((1 + pG) * (1 + xdss_pu * sinOf(cosPhi)));
}

/**
 * Faults inside a power station unit, the unit transformer's share fed from the network (IEC 60909-0:2016, 6.7.1
 * and 6.7.2, K_T,S and K_T,SO; from memory): cmax / (1 - xT sin phi_rG), divided by (1 + p_G) without on-load tap
 * changer. The minus sign: before the fault the overexcited generator drives reactive power through the
 * transformer, so the network-side source behind it is lower by about xT sin phi_rG.
 */
export function unitTransformerK(cmax: number, xT_pu: number, cosPhi: number, pG: number): number {
  return cmax / ((1 + pG) * (1 - xT_pu * sinOf(cosPhi)));
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

/**
 * Factor q for the breaking current of an asynchronous motor, I_b = mu q I"kM (IEC 60909-0:2016, 9.1.1; from memory),
 * from m, the rated active power per pair of poles in MW, at minimum time delay tmin:
 *   0.02 s: 1.03 + 0.12 ln m;  0.05 s: 0.79 + 0.12 ln m;  0.10 s: 0.57 + 0.12 ln m;  >= 0.25 s: 0.26 + 0.10 ln m.
 * q is at most 1; below the smallest tabulated delay the 0.02 s curve applies and between delays the next smaller
 * one (larger q, conservative, as for mu). The curves end at q = 0 for very small motors, so q is kept >= 0.
 */
export function motorFactorQ(m_MW: number, tmin_s: number): number {
  if (!(m_MW > 0)) return 1;
  const ln = Math.log(m_MW);
  let q: number;
  if (tmin_s < 0.05) q = 1.03 + 0.12 * ln;
  else if (tmin_s < 0.1) q = 0.79 + 0.12 * ln;
  else if (tmin_s < 0.25) q = 0.57 + 0.12 * ln;
  else q = 0.26 + 0.1 * ln;
  return Math.min(1, Math.max(0, q));
}

/** Heat-effect factor m of the d.c. component (IEC 60909-0:2016, formula for m). */
export function thermalFactorM(kappa: number, tk_s: number, f_Hz: number): number {
  const k = Math.max(kappa, 1.0000001);
  const lnk = Math.log(k - 1);
  return (1 / (2 * f_Hz * tk_s * lnk)) * (Math.exp(4 * f_Hz * tk_s * lnk) - 1);
}
