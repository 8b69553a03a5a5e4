// The time elements of any protective device, after refusing impossible settings.
import type { ProtectiveDevice } from "./types.ts";
import type { TimeElement } from "./timeElement.ts";
import { checkDeviceSettings } from "./checkDeviceSettings.ts";
import { SettingsError } from "./settingsError.ts";
import { relayElements } from "./relayElements.ts";
import { fuseElements } from "./fuseElements.ts";
import { lvBreakerElements } from "./lvBreakerElements.ts";

/** Throws SettingsError when the device has settings errors (warnings do not stop computing). */
export function deviceElements(device: ProtectiveDevice): TimeElement[] {
  const errors = checkDeviceSettings(device).filter((m) => m.severity === "error");
  if (errors.length > 0) throw new SettingsError(errors);
  if (device.kind === "relay") return relayElements(device);
  if (device.kind === "fuse") return fuseElements(device);
  return lvBreakerElements(device);
}
