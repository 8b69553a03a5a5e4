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

export function pickupRatio(r: Pick<DeviceResponse, "iPhase_A" | "iResidual_A" | "iNegative_A">, p: DevicePickups): PickupRatio {
  let best: PickupRatio = { ratio: 0, quantity: null, current_A: r.iPhase_A, pickup_A: p.phase_A ?? NaN };
  const consider = (quantity: PickupRatio["quantity"], current_A: number, pickup_A: number | null) => {
    if (pickup_A === null || !(pickup_A > 0)) return;
    const ratio = current_A / pickup_A;
    if (ratio > best.ratio || best.quantity === null) best = { ratio, quantity, current_A, pickup_A };
  };
  consider("phase", r.iPhase_A, p.phase_A);
  consider("residual", r.iResidual_A, p.residual_A);
  consider("negative", r.iNegative_A, p.negative_A);
  return best;
}
