// Argument parsing shared by the file commands: exactly one FILE and a set of known flags.

export type FileArgs = { ok: true; file: string; flags: Set<string> } | { ok: false; message: string };

export function parseFileArgs(args: readonly string[], knownFlags: readonly string[]): FileArgs {
  const flags = new Set<string>();
  const files: string[] = [];
  for (const a of args) {
    if (a.startsWith("--")) {
      if (!knownFlags.includes(a)) return { ok: false, message: `unknown option ${a}` };
      flags.add(a);
    } else files.push(a);
  }
  if (files.length !== 1) return { ok: false, message: files.length === 0 ? "missing FILE" : `expected one FILE, got ${files.length}` };
  return { ok: true, file: files[0], flags };
}
