// A device's time-current curve for one measured quantity: the fastest of its elements that measure it.
// Directional functions are drawn as if the fault were in their set direction; 51V at a stated restraint voltage.
import type { Band, CurveQuantity, ProtectiveDevice } from "./types.ts";
import type { ElementQuantity, TimeElement } from "./timeElement.ts";
import { deviceElements } from "./deviceElements.ts";
import { restraintFactor } from "./relayElements.ts";

export interface DeviceCurve {
  /** The elements drawn. */
  elements: TimeElement[];
  /** Curve time in s at a device-side current in A (Infinity below every pickup). */
  time_s(current_A: number, band: Band): number;
  /** Lowest pickup of the drawn elements on a band. */
  pickup_A(band: Band): number;
  breakpoints_A(band: Band): number[];
  /** Clearing time (trip + breaker/mechanism, fuse total clearing) at a current. */
  clearing_s(current_A: number, band: Band): number;
}

const WANT: Record<CurveQuantity, ElementQuantity> = { phase: "phase", ground: "residual", negative: "negative" };

/**
 * The curve of `device` for `quantity`. When the device has no element on that quantity (a fuse, a breaker
 * without ground-fault region, a relay without 51N), its phase elements are drawn: they are what clears it.
 * `elementIds` narrows the drawing to some functions or regions (quantity still applies).
 */
export function deviceCurve(device: ProtectiveDevice, quantity: CurveQuantity = "phase", restraint_pu = 1, elementIds?: readonly string[]): DeviceCurve {
  const all = elementIds ? deviceElements(device).filter((e) => elementIds.includes(e.id)) : deviceElements(device);
  let elements = all.filter((e) => e.quantity === WANT[quantity]);
  if (elements.length === 0) elements = all.filter((e) => e.quantity === "phase");
  const scaleOf = new Map<TimeElement, number>();
  if (device.kind === "relay") {
    const fns = device.functions.filter((f) => f.enabled);
    elements.forEach((e) => {
      const fn = fns.find((f) => f.id === e.id);
      scaleOf.set(e, fn && fn.ansi === "51V" ? restraintFactor(fn, restraint_pu) : 1);
    });
  }
  const sc = (e: TimeElement) => scaleOf.get(e) ?? 1;
  const time_s = (i: number, band: Band) => {
    let t = Infinity;
    for (const e of elements) t = Math.min(t, e.time_s(i / sc(e), band));
    return t;
  };
  return {
    elements,
    time_s,
    pickup_A: (band) => Math.min(Infinity, ...elements.map((e) => e.pickup_A(band) * sc(e))),
    breakpoints_A: (band) => elements.flatMap((e) => e.breakpoints_A(band).map((b) => b * sc(e))),
    clearing_s: (i, band) => {
      let best = Infinity;
      let clear = Infinity;
      for (const e of elements) {
        const t = e.time_s(i / sc(e), band);
        if (t < best) {
          best = t;
          clear = e.clear_s ? e.clear_s(i / sc(e), band) : t + e.added_s;
        }
      }
      return clear;
    },
  };
}
