import type { Project } from "../../model/schema.ts";
import type { LoadFlowResult } from "../types.ts";

/** Balanced load flow of one scenario. */
export function runLoadFlow(_project: Project, _options: { scenario?: string } = {}): LoadFlowResult {
  throw new Error("runLoadFlow: not implemented yet");
}
