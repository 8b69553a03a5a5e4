// The time elements of any protective device, after refusing impossible settings.
import type { ProtectiveDevice } from "./types.ts";
import type { TimeElement } from "./timeElement.ts";
import { checkDeviceSettings } from "./checkDeviceSettings.ts";
import { SettingsError } from "./settingsError.ts";
import { relayElements } from "./relayElements.ts";
import { fuseElements } from "./fuseElements.ts";
import { lvBreakerElements } from "./lvBreakerElements.ts";
import { sameKey, settingsKey } from "./settingsKey.ts";

// A memo only: studies ask for the same device thousands of times. Keyed by the record object and checked
// against its settings key, so a record edited in place is never served stale; results never depend on it.
const memo = new WeakMap<object, { key: unknown[]; elements: TimeElement[] }>();

function build(device: ProtectiveDevice): TimeElement[] {
  const errors = checkDeviceSettings(device).filter((m) => m.severity === "error");
  if (errors.length > 0) throw new SettingsError(errors);
  if (device.kind === "relay") return relayElements(device);
  if (device.kind === "fuse") return fuseElements(device);
  return lvBreakerElements(device);
}

/** Throws SettingsError when the device has settings errors (warnings do not stop computing). */
export function deviceElements(device: ProtectiveDevice): TimeElement[] {
  const key = settingsKey(device);
  const hit = memo.get(device);
  if (hit && sameKey(hit.key, key)) return hit.elements;
  const elements = build(device);
  memo.set(device, { key, elements });
  return elements;
}
