// The common shape of everything that times out inside a device: a relay function, an LV trip-unit
// region, a fuse element. operatingTime, accumulate, currentForTime and sampleCurve all work on these.
import type { Band, Measurement } from "./types.ts";

export type ElementQuantity = "phase" | "residual" | "negative";

export interface GateResult {
  /** False when the element must not operate for this measurement (wrong direction, no polarising voltage). */
  ok: boolean;
  /** Pickup multiplier (51V restraint); 1 otherwise. */
  pickupScale: number;
  /** Text for the reason line, empty when nothing to say. */
  note: string;
}

export interface TimeElement {
  id: string;
  /** E.g. "51 IEC standard inverse" or "short-time". */
  title: string;
  quantity: ElementQuantity;
  /** Lowest operating current on a band, A. */
  pickup_A(band: Band): number;
  /** Operating time at a measured magnitude on a band, s; Infinity below pickup. */
  time_s(current_A: number, band: Band): number;
  /** Time to reset from full travel at a current below pickup, s: 0 instantaneous, Infinity never. */
  reset_s(current_A: number, band: Band): number;
  /** Currents where the curve has a corner or a step, for exact sampling. */
  breakpoints_A(band: Band): number[];
  /** Time added to the trip time for total clearing (breaker, mechanism). */
  added_s: number;
  /** Total clearing time when it is not trip + added_s (fuses). */
  clear_s?(current_A: number, band: Band): number;
  /** Measurement-dependent conditions (direction, voltage restraint). */
  gate?(m: Measurement, ignoreDirection: boolean): GateResult;
  /** The same decision as `gate` without its text: the pickup multiplier, or NaN when blocked (for hot loops). */
  gateScale?(m: Measurement, ignoreDirection: boolean): number;
}

/** The magnitude an element measures. */
export function measuredCurrent(m: Measurement, q: ElementQuantity): number {
  if (q === "residual") return m.residual_A;
  if (q === "negative") return m.negative_A;
  return Math.max(m.phase_A[0], m.phase_A[1], m.phase_A[2]);
}
