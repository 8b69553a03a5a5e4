// When the engine cannot compute a result: an error that names the elements and buses involved, so that no
// caller turns it into a current. Thrown by the solvers (a network whose equations cannot be factorised in
// floating point); compileNetwork reports the same situations it can see beforehand as errors instead.
import type { EngineMessage } from "./types.ts";

/** Stable message codes: a stamp outside the range the arithmetic handles; a network or result not solved. */
export const OUT_OF_RANGE = "out-of-range";
export const NOT_SOLVED = "not-solved";

export class EngineFailure extends Error {
  readonly code: string;
  /** Bus ids where the failure showed. */
  readonly buses: readonly string[];
  /** Element ids involved (connected at those buses). */
  readonly elements: readonly string[];
  constructor(text: string, buses: readonly string[], elements: readonly string[], code = NOT_SOLVED) {
    super(text);
    this.name = "EngineFailure";
    this.code = code;
    this.buses = buses;
    this.elements = elements;
  }
}

/** The message for an engine failure (an EngineFailure, or any other error thrown by the solvers). */
export function failureMessage(err: unknown): EngineMessage {
  if (err instanceof EngineFailure) return { level: "error", code: err.code, text: err.message, ...(err.elements[0] ? { element: err.elements[0] } : {}) };
  return { level: "error", code: NOT_SOLVED, text: `The network could not be solved: ${err instanceof Error ? err.message : String(err)}` };
}
