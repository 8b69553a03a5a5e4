// How a device is named in messages: `Relay R1 "Dock feeder"`.
import type { ProtectiveDevice } from "./types.ts";

const KIND_WORD: Record<ProtectiveDevice["kind"], string> = { relay: "Relay", fuse: "Fuse", lvbreaker: "LV breaker" };

export function deviceLabel(device: Pick<ProtectiveDevice, "kind" | "id" | "name">): string {
  const word = KIND_WORD[device.kind] ?? "Device";
  return device.name ? `${word} ${device.id} "${device.name}"` : `${word} ${device.id}`;
}
