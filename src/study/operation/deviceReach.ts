// What a protective device can detect by design: which fault types its enabled elements respond to, and
// on which side of its location. A directional element set forward looks into the element the device
// sits at; set reverse, towards the bus. The expected isolation asks this, not the currents: a relay
// that restrains by direction is doing its job, and the zone grows past it to the devices that should act.
import type { ProtectiveDevice } from "../../model/schema.ts";
import type { FaultType } from "../types.ts";

export type FaultSide = "element" | "bus";
type Quantity = "phase" | "residual" | "negative";
type Looks = "both" | FaultSide;

/** Quantities a fault type produces: zero sequence only with earth, negative sequence only when unbalanced. */
const PRODUCES: Record<FaultType, readonly Quantity[]> = {
  "3ph": ["phase"],
  LL: ["phase", "negative"],
  LG: ["phase", "residual", "negative"],
  LLG: ["phase", "residual", "negative"],
};

/** Each enabled element of a device as (quantity, side it looks at). */
function elementsOf(device: ProtectiveDevice): { quantity: Quantity; looks: Looks }[] {
  if (device.kind === "fuse") return [{ quantity: "phase", looks: "both" }];
  if (device.kind === "lvbreaker") {
    const out: { quantity: Quantity; looks: Looks }[] = [{ quantity: "phase", looks: "both" }];
    if (device.groundFault) out.push({ quantity: "residual", looks: "both" });
    return out;
  }
  return device.functions
    .filter((f) => f.enabled)
    .map((f) => ({ quantity: f.quantity, looks: f.direction === "forward" ? "element" : f.direction === "reverse" ? "bus" : "both" }));
}

/** True when some enabled element of the device responds to this fault type on this side of its location. */
export function canDetect(device: ProtectiveDevice, faultType: FaultType, faultSide: FaultSide): boolean {
  const produced = PRODUCES[faultType];
  for (const el of elementsOf(device)) if (produced.includes(el.quantity) && (el.looks === "both" || el.looks === faultSide)) return true;
  return false;
}

/** True when the device trips anything at all (a relay with every function disabled does not). */
export function canTrip(device: ProtectiveDevice): boolean {
  return elementsOf(device).length > 0;
}

/** True when every element the device has for this fault type is directional and looks away from the fault. */
export function restrainsByDirection(device: ProtectiveDevice, faultType: FaultType, faultSide: FaultSide): boolean {
  const produced = PRODUCES[faultType];
  const relevant = elementsOf(device).filter((el) => produced.includes(el.quantity));
  return relevant.length > 0 && relevant.every((el) => el.looks !== "both" && el.looks !== faultSide);
}
