// Keyboard change of a curve's setting on the focused plot: Left/Right lower/raise the pickup,
// Down/Up lower/raise the time multiplier, by 5 % a press (25 % with Shift), rounded like a drag.
import type { TccBand, TccSettingPatch } from "./tccTypes.ts";
import { roundSignificant, type DragLimits } from "./dragSetting.ts";

export type NudgeKey = "ArrowLeft" | "ArrowRight" | "ArrowUp" | "ArrowDown";

export function isNudgeKey(key: string): key is NudgeKey {
  return key === "ArrowLeft" || key === "ArrowRight" || key === "ArrowUp" || key === "ArrowDown";
}

/** The new setting for one key press, or null when the band cannot change that way. */
export function nudgeSetting(band: TccBand, key: NudgeKey, large: boolean, limits: DragLimits = {}): TccSettingPatch | null {
  const step = large ? 1.25 : 1.05;
  const sig = limits.significant ?? 3;
  if (key === "ArrowLeft" || key === "ArrowRight") {
    if (!band.draggable?.pickup) return null;
    const raw = key === "ArrowRight" ? band.pickup_A * step : band.pickup_A / step;
    const v = Math.min(limits.pickupMax_A ?? 1e7, Math.max(limits.pickupMin_A ?? 1e-3, raw));
    return { pickup_A: roundSignificant(v, sig) };
  }
  if (!band.draggable?.multiplier || band.multiplier === undefined) return null;
  const raw = key === "ArrowUp" ? band.multiplier * step : band.multiplier / step;
  const v = Math.min(limits.multiplierMax ?? 100, Math.max(limits.multiplierMin ?? 0.01, raw));
  return { multiplier: roundSignificant(v, sig) };
}
