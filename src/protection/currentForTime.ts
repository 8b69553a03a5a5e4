// The inverse of a device curve: the lowest current at which the device operates within t_s.
import type { Band, CurveQuantity, ProtectiveDevice } from "./types.ts";
import { deviceCurve } from "./deviceCurve.ts";

export interface InverseOptions {
  band?: Band;
  quantity?: CurveQuantity;
  restraint_pu?: number;
  /** Invert only these functions/regions (e.g. the one being dragged). */
  elementIds?: readonly string[];
}

/**
 * Lowest device-side current in A whose curve time is <= t_s (curves never rise with current, so this is
 * well defined); Infinity when the device is never that fast. Found by bisection on log current to 1e-12.
 */
export function currentForTime(device: ProtectiveDevice, t_s: number, opts: InverseOptions = {}): number {
  const band = opts.band ?? "nominal";
  const curve = deviceCurve(device, opts.quantity ?? "phase", opts.restraint_pu ?? 1, opts.elementIds);
  const p = curve.pickup_A(band);
  if (!(p > 0) || !Number.isFinite(p) || !(t_s >= 0)) return Infinity;
  let lo = p * (1 - 1e-12);
  let hi = p * 1.0001;
  while (curve.time_s(hi, band) > t_s) {
    lo = hi;
    hi *= 2;
    if (hi > p * 1e9) return Infinity;
  }
  for (let k = 0; k < 200 && hi / lo > 1 + 1e-13; k++) {
    const mid = Math.sqrt(lo * hi);
    if (curve.time_s(mid, band) > t_s) lo = mid;
    else hi = mid;
  }
  return hi;
}
