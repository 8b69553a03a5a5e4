import type { SweepDeviceCurrents, SweepResult } from "../types.ts";

/** Reads one device location's currents for one fault of a sweep. */
export function sweepDeviceCurrents(_sweep: SweepResult, _d: number, _b: number, _t: number): SweepDeviceCurrents {
  throw new Error("sweepDeviceCurrents: not implemented yet");
}
