// Transformer through-fault withstand (IEEE C57.109 style curves) and its category (IEEE C57.12.00).
import type { Polyline } from "../types.ts";

export type TransformerCategory = "I" | "II" | "III" | "IV";

/**
 * IEEE C57.12.00 categories by rated kVA: three-phase I 15-500, II 501-5000, III 5001-30000, IV above;
 * single-phase I 5-500, II 501-1667, III 1668-10000, IV above (single-phase limits // from memory).
 */
export function transformerCategory(sr_kVA: number, phases: 1 | 3 = 3): TransformerCategory {
  const [i, ii, iii] = phases === 3 ? [500, 5000, 30000] : [500, 1667, 10000];
  if (sr_kVA <= i) return "I";
  if (sr_kVA <= ii) return "II";
  if (sr_kVA <= iii) return "III";
  return "IV";
}

/** Thermal (infrequent-fault) points, I in per unit of rated current and t in s. // from memory (IEEE C57.109) */
export const THERMAL_POINTS_PU: readonly (readonly [number, number])[] = [
  [2, 1800],
  [3, 300],
  [4.75, 60],
  [6.3, 30],
  [11.3, 10],
  [25, 2],
];

/** Category I: t = 1250 / I^2 (I in pu), 2 s at 25 x. // from memory (IEEE C57.109) */
export const CATEGORY_I_K = 1250;

export interface TransformerWithstandInput {
  sr_kVA: number;
  /** Rated current on the side where the curve is drawn, A. */
  ratedCurrent_A: number;
  /** Transformer short-circuit impedance, pu of its rating. */
  z_pu: number;
  /** Source impedance on the transformer's base, pu (categories III and IV use transformer plus system). */
  zSystem_pu?: number;
  phases?: 1 | 3;
}

export interface TransformerWithstand {
  category: TransformerCategory;
  /** Highest through-fault current in A (the infinite-bus fault current, or 25 x for category I with z below 4 %). */
  iMax_A: number;
  /** Curve for faults that occur infrequently, [A, s]. */
  infrequent: Polyline;
  /** Curve for frequent faults (categories II-IV: mechanical part K/I^2 near the maximum current), [A, s]. */
  frequent: Polyline;
}

function thermal_s(x: number): number {
  const p = THERMAL_POINTS_PU;
  if (x <= p[0][0]) return p[0][1];
  for (let k = 1; k < p.length; k++) {
    if (x <= p[k][0]) {
      const [x1, t1] = p[k - 1];
      const [x2, t2] = p[k];
      return Math.exp(Math.log(t1) + (Math.log(x / x1) / Math.log(x2 / x1)) * Math.log(t2 / t1));
    }
  }
  const [xl, tl] = p[p.length - 1];
  return tl * (xl / x) ** 2;
}

/**
 * Through-fault withstand. Category I: one curve, the larger of the thermal points and 1250 / I^2 (the two
 * agree within 10 % from 4.75 to 25 x). Categories II-IV: the thermal points up to the maximum current
 * 1 / z (II: transformer impedance; III, IV: transformer plus system); the frequent-fault curve leaves the
 * thermal curve at 70 % (II) or 50 % (III, IV) of the maximum current and follows I^2 t = K with K set by
 * 2 s at the maximum current. // from memory (IEEE C57.109 figure construction)
 */
export function transformerWithstand(input: TransformerWithstandInput): TransformerWithstand {
  const { sr_kVA, ratedCurrent_A: ir, z_pu } = input;
  if (!(sr_kVA > 0) || !(ir > 0) || !(z_pu > 0)) {
    throw new RangeError(`transformer withstand needs sr_kVA, ratedCurrent_A and z_pu > 0 (got ${sr_kVA}, ${ir}, ${z_pu})`);
  }
  const category = transformerCategory(sr_kVA, input.phases ?? 3);
  const z = category === "III" || category === "IV" ? z_pu + (input.zSystem_pu ?? 0) : z_pu;
  const xMax = category === "I" ? Math.min(25, 1 / z) : 1 / z;
  const grid = (from: number, to: number, n: number) => Array.from({ length: n + 1 }, (_, j) => from * Math.pow(to / from, j / n));
  const xs = [...new Set([...grid(2, xMax, 40), ...THERMAL_POINTS_PU.map((p) => p[0]).filter((x) => x < xMax), xMax])].sort((a, b) => a - b);
  const toA = (pts: [number, number][]): Polyline => pts.map(([x, t]) => [x * ir, t] as const);
  if (category === "I") {
    const curve = toA(xs.map((x) => [x, Math.max(thermal_s(x), CATEGORY_I_K / (x * x))]));
    return { category, iMax_A: xMax * ir, infrequent: curve, frequent: curve };
  }
  const infrequent = toA(xs.map((x) => [x, thermal_s(x)]));
  const knee = (category === "II" ? 0.7 : 0.5) * xMax;
  const K = 2 * xMax * xMax;
  const frequentPts: [number, number][] = xs.filter((x) => x < knee).map((x) => [x, thermal_s(x)]);
  frequentPts.push([knee, thermal_s(knee)]);
  for (const x of grid(knee, xMax, 12)) frequentPts.push([x, K / (x * x)]);
  return { category, iMax_A: xMax * ir, infrequent, frequent: toA(frequentPts) };
}
