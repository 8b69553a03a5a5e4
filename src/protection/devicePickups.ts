// The lowest pickup a device has on each measured quantity (for reach and sensitivity checks).
import type { Band, ProtectiveDevice } from "./types.ts";
import { deviceElements } from "./deviceElements.ts";

export interface DevicePickups {
  /** Lowest phase pickup in A, null when nothing measures phase current. 51V at full voltage (no restraint). */
  phase_A: number | null;
  residual_A: number | null;
  negative_A: number | null;
}

/** Throws SettingsError on impossible settings, like every computation. */
export function devicePickups(device: ProtectiveDevice, band: Band = "nominal"): DevicePickups {
  const out: DevicePickups = { phase_A: null, residual_A: null, negative_A: null };
  for (const el of deviceElements(device)) {
    const key = el.quantity === "phase" ? "phase_A" : el.quantity === "residual" ? "residual_A" : "negative_A";
    const a = el.pickup_A(band);
    const prev = out[key];
    if (Number.isFinite(a) && (prev === null || a < prev)) out[key] = a;
  }
  return out;
}
