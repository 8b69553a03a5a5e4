// Drag-to-set on a log-log plot. A horizontal drag slides the curve along the current axis: every
// inverse-time curve depends on I / pickup only, so moving the grabbed point from I0 to I1 means
// pickup * (I1 / I0). A vertical drag slides it along the time axis: IEC 60255-151 and IEEE C37.112
// times are proportional to the multiplier, so moving from t0 to t1 means multiplier * (t1 / t0).
import type { TccSettingPatch } from "./tccTypes.ts";

export type DragAxis = "pickup" | "multiplier";

/** Which setting a drag changes, decided once the pointer has moved `threshold_px` from where it
 * went down: the dominant direction, restricted to what the curve allows. null: not decided yet, or nothing allowed. */
export function dragAxis(
  dx_px: number,
  dy_px: number,
  allowed: { pickup?: boolean; multiplier?: boolean },
  threshold_px = 4,
): DragAxis | null {
  if (Math.hypot(dx_px, dy_px) < threshold_px) return null;
  const horizontal = Math.abs(dx_px) >= Math.abs(dy_px);
  if (horizontal && allowed.pickup) return "pickup";
  if (!horizontal && allowed.multiplier) return "multiplier";
  if (allowed.pickup && !allowed.multiplier) return "pickup";
  if (allowed.multiplier && !allowed.pickup) return "multiplier";
  return null;
}

export interface DragStart {
  pickup_A: number;
  multiplier?: number;
  /** Current and time (plot coordinates) where the pointer went down. */
  current0_A: number;
  time0_s: number;
}

export interface DragLimits {
  pickupMin_A?: number;
  pickupMax_A?: number;
  multiplierMin?: number;
  multiplierMax?: number;
  /** Significant digits the new value is rounded to. */
  significant?: number;
}

/** The setting that puts the grabbed point of the curve under the pointer at (current1_A, time1_s). */
export function settingFromDrag(
  axis: DragAxis,
  start: DragStart,
  current1_A: number,
  time1_s: number,
  limits: DragLimits = {},
): TccSettingPatch {
  const sig = limits.significant ?? 3;
  if (axis === "pickup") {
    const raw = start.pickup_A * (current1_A / start.current0_A);
    return { pickup_A: roundSignificant(clamp(raw, limits.pickupMin_A ?? 1e-3, limits.pickupMax_A ?? 1e7), sig) };
  }
  const m0 = start.multiplier ?? 1;
  const raw = m0 * (time1_s / start.time0_s);
  return { multiplier: roundSignificant(clamp(raw, limits.multiplierMin ?? 0.01, limits.multiplierMax ?? 100), sig) };
}

/** x rounded to `significant` significant digits. */
export function roundSignificant(x: number, significant: number): number {
  if (x === 0 || !Number.isFinite(x)) return x;
  return Number(x.toPrecision(significant));
}

function clamp(x: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, x));
}
