import type { CompiledNetwork, FaultLocation, FaultOptions, FaultResult, FaultType } from "../types.ts";

/** Solves one fault at a bus or along a line. */
export function solveFault(_network: CompiledNetwork, _location: FaultLocation, _type: FaultType, _options: FaultOptions = {}): FaultResult {
  throw new Error("solveFault: not implemented yet");
}
