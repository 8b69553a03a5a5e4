import type { Project } from "../../model/schema.ts";
import type { CompileOptions, CompileResult } from "../types.ts";

/** Builds the sequence networks of one scenario for one limit (max/min). */
export function compileNetwork(_project: Project, _options: CompileOptions): CompileResult {
  return { ok: false, errors: [{ level: "error", code: "not-ready", text: "compileNetwork: not implemented yet" }] };
}
