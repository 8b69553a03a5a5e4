// The first step every file command shares: read FILE, load it as a project, and on failure print why (each
// problem naming the element and the field) and give the exit code. User text is printed terminal-safe.
import { loadProject } from "../model/projectFile.ts";
import type { Project } from "../model/schema.ts";
import { readFileBytes } from "./fileIo.ts";
import type { CliOutput } from "./session.ts";
import { terminalField } from "./terminalText.ts";

export interface LoadStepOptions {
  /** With --json the loader's error goes to stdout as JSON (the command's own JSON shape). */
  json: boolean;
  /** Also an unreadable file as JSON on stdout (validate); otherwise it is a usage error on stderr. */
  unreadableAsJson?: boolean;
  /** Exit code for a file that is not a valid project. */
  invalidExit: number;
  /** Added to the heading of the problems, e.g. "no report written". */
  note?: string;
}

export type LoadStep = { ok: true; project: Project; warnings: string[]; bytes: Buffer } | { ok: false; code: number };

/** Exit code for a file that cannot be read. */
export const EXIT_UNREADABLE = 2;

export function loadStep(out: CliOutput, command: string, path: string, options: LoadStepOptions): LoadStep {
  const file = readFileBytes(path);
  if (!file.ok) {
    if (options.json && options.unreadableAsJson) out.json({ ok: false, file: path, error: { kind: "unreadable", messages: [file.message] } });
    else out.error(`islet ${command}: ${terminalField(file.message)}`);
    return { ok: false, code: EXIT_UNREADABLE };
  }
  const loaded = loadProject(file.bytes.toString("utf8"));
  if (!loaded.ok) {
    if (options.json) out.json({ ok: false, file: path, error: loaded.error });
    else {
      const n = loaded.error.messages.length;
      const lines = [`${terminalField(path)}: not a valid Islet project (${loaded.error.kind}), ${n} problem(s)${options.note ? `; ${options.note}` : ""}:`];
      for (const m of loaded.error.messages) lines.push(`  error: ${terminalField(m)}`);
      out.error(lines.join("\n"));
    }
    return { ok: false, code: options.invalidExit };
  }
  return { ok: true, project: loaded.project, warnings: loaded.warnings, bytes: file.bytes };
}
