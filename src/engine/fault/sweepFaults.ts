import type { CompiledNetwork, SweepOptions, SweepResult } from "../types.ts";

/** Faults every bus with every type, keeping currents only at device locations. */
export function sweepFaults(_network: CompiledNetwork, _options: SweepOptions = {}): SweepResult {
  throw new Error("sweepFaults: not implemented yet");
}
