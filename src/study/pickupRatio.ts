// How far above its lowest pickup a device's measurement lies: the largest ratio of measured current
// to pickup over the quantities the device has elements for (phase, residual, negative sequence).
import type { DevicePickups } from "./deviceModel.ts";
import type { DeviceResponse } from "./types.ts";

export interface PickupRatio {
  ratio: number;
  quantity: "phase" | "residual" | "negative" | null;
  current_A: number;
  pickup_A: number;
}

/** `pickupRatio(r, p).ratio` alone, with the same comparisons, for the per-device screen of every fault case. */
export function pickupRatioValue(r: Pick<DeviceResponse, "iPhase_A" | "iResidual_A" | "iNegative_A">, p: DevicePickups): number {
  let ratio = 0;
  let any = false;
  if (p.phase_A !== null && p.phase_A > 0) {
    ratio = r.iPhase_A / p.phase_A;
    any = true;
  }
  if (p.residual_A !== null && p.residual_A > 0 && (!any || r.iResidual_A / p.residual_A > ratio)) {
    ratio = r.iResidual_A / p.residual_A;
    any = true;
  }
  if (p.negative_A !== null && p.negative_A > 0 && (!any || r.iNegative_A / p.negative_A > ratio)) ratio = r.iNegative_A / p.negative_A;
  return ratio;
}

export function pickupRatio(r: Pick<DeviceResponse, "iPhase_A" | "iResidual_A" | "iNegative_A">, p: DevicePickups): PickupRatio {
  // written out without closures: this runs for every device in every fault case
  let ratio = 0;
  let quantity: PickupRatio["quantity"] = null;
  let current_A = r.iPhase_A;
  let pickup_A = p.phase_A ?? NaN;
  if (p.phase_A !== null && p.phase_A > 0) {
    ratio = r.iPhase_A / p.phase_A;
    quantity = "phase";
  }
  if (p.residual_A !== null && p.residual_A > 0 && (quantity === null || r.iResidual_A / p.residual_A > ratio)) {
    ratio = r.iResidual_A / p.residual_A;
    quantity = "residual";
    current_A = r.iResidual_A;
    pickup_A = p.residual_A;
  }
  if (p.negative_A !== null && p.negative_A > 0 && (quantity === null || r.iNegative_A / p.negative_A > ratio)) {
    ratio = r.iNegative_A / p.negative_A;
    quantity = "negative";
    current_A = r.iNegative_A;
    pickup_A = p.negative_A;
  }
  return { ratio, quantity, current_A, pickup_A };
}
