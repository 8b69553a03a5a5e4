// A numeric fast path for studies that time thousands of fault states: the device's settings are checked
// and its elements built once, and each measurement is timed on all three bands in one pass with no
// reason text. It gives exactly the numbers operatingTime gives (same elements, same arithmetic, same
// tie-breaking); use operatingTime where a person reads the reason.
import type { Band, Measurement, ProtectiveDevice } from "./types.ts";
import type { TimeElement } from "./timeElement.ts";
import { measuredCurrent } from "./timeElement.ts";
import { deviceElements } from "./deviceElements.ts";

/** Operating times of one measurement on the nominal curve and on both edges of the tolerance band. */
export interface BandTimes {
  /** Nominal band: true when an enabled function/region picks up (operatingTime's `picked`). */
  picked: boolean;
  /** Nominal band: the function or region that operates first, null when none does. */
  functionId: string | null;
  /** Nominal band trip and total clearing times, s; Infinity when nothing operates. */
  trip_s: number;
  clearing_s: number;
  /** Total clearing time on the fast ("min") and slow ("max") band edges, s; Infinity when nothing operates. */
  clearingMin_s: number;
  clearingMax_s: number;
}

export interface DeviceTimer {
  /** Times of `m` on every band; directional functions respect direction. */
  bands(m: Measurement): BandTimes;
}

/** Trip and clearing time of the fastest element on one band (operatingTime's choice: first strict minimum). */
function fastest(elements: readonly TimeElement[], effective_A: Float64Array, band: Band, out: { trip_s: number; clearing_s: number; index: number }): void {
  out.trip_s = Infinity;
  out.clearing_s = Infinity;
  out.index = -1;
  for (let k = 0; k < elements.length; k++) {
    const i = effective_A[k];
    if (Number.isNaN(i)) continue; // blocked by its gate
    const el = elements[k];
    const trip_s = el.time_s(i, band);
    if (!Number.isFinite(trip_s) || !(out.index < 0 || trip_s < out.trip_s)) continue;
    const clearing_s = el.clear_s ? el.clear_s(i, band) : trip_s + el.added_s;
    out.trip_s = trip_s;
    out.clearing_s = Math.max(clearing_s, trip_s);
    out.index = k;
  }
}

/** Throws SettingsError when the device has settings errors, once, here (warnings do not stop computing). */
export function deviceTimer(device: ProtectiveDevice): DeviceTimer {
  const elements = deviceElements(device);
  const effective_A = new Float64Array(elements.length);
  const best = { trip_s: Infinity, clearing_s: Infinity, index: -1 };
  return {
    bands(m: Measurement): BandTimes {
      // the gate does not depend on the band: the current each element reads its curve at, NaN when blocked
      for (let k = 0; k < elements.length; k++) {
        const el = elements[k];
        const scale = el.gateScale ? el.gateScale(m, false) : el.gate ? gateScaleOf(el, m) : 1;
        effective_A[k] = measuredCurrent(m, el.quantity) / scale;
      }
      fastest(elements, effective_A, "nominal", best);
      const picked = best.index >= 0;
      const functionId = picked ? elements[best.index].id : null;
      const trip_s = best.trip_s;
      const clearing_s = best.clearing_s;
      fastest(elements, effective_A, "min", best);
      const clearingMin_s = best.clearing_s;
      fastest(elements, effective_A, "max", best);
      return { picked, functionId, trip_s, clearing_s, clearingMin_s, clearingMax_s: best.clearing_s };
    },
  };
}

/** An element with only the explained gate (none in this project today): its decision as a multiplier. */
function gateScaleOf(el: TimeElement, m: Measurement): number {
  const g = el.gate!(m, false);
  return g.ok ? g.pickupScale : NaN;
}
