// Each sub-command declares its options once (CommandSpec); node:util's parseArgs reads them, and the same
// declaration gives `islet help COMMAND` and `islet COMMAND --help`.
import { parseArgs } from "node:util";
import { terminalField } from "./terminalText.ts";

export interface OptionSpec {
  type: "boolean" | "string";
  /** May be given more than once (values collected in order). */
  multiple?: boolean;
  short?: string;
  /** Placeholder of the value in the help, e.g. "ID". */
  value?: string;
  help: string;
}

export interface CommandSpec {
  name: string;
  summary: string;
  /** Arguments after the command name, e.g. "FILE [options]". */
  synopsis: string;
  /** Paragraph lines shown under the synopsis. */
  about: string[];
  options: Record<string, OptionSpec>;
  /** Whole command lines, each followed by what it does. */
  examples: { command: string; does: string }[];
  /** Exit codes and what they mean. */
  exits: string[];
}

/** Options every command takes. */
export const HELP_OPTION: OptionSpec = { type: "boolean", short: "h", help: "show this help and exit" };
export const QUIET_OPTION: OptionSpec = { type: "boolean", short: "q", help: "no progress line on stderr (there is none anyway when stderr is not a terminal)" };

export type OptionValues = Record<string, string | boolean | string[] | undefined>;

export type ParsedArgs = { ok: true; help: boolean; values: OptionValues; positionals: string[] } | { ok: false; message: string };

/** parseArgs's message turned into ours: "unknown option --x", "option --out needs a value". */
function usageMessage(err: unknown): string {
  const e = err as { code?: string; message?: string };
  const message = e.message ?? String(err);
  const option = terminalField(/'(-[^' ]+)/.exec(message)?.[1] ?? "");
  if (e.code === "ERR_PARSE_ARGS_UNKNOWN_OPTION") return `unknown option ${option}`;
  if (e.code === "ERR_PARSE_ARGS_INVALID_OPTION_VALUE") {
    if (/does not take an argument/.test(message)) return `option ${option} takes no value`;
    return `option ${option} needs a value`;
  }
  return terminalField(message.split("\n")[0]);
}

export function parseCommandArgs(spec: CommandSpec, args: readonly string[]): ParsedArgs {
  const options: Record<string, { type: "boolean" | "string"; multiple?: boolean; short?: string }> = { help: { type: "boolean", short: "h" } };
  for (const [name, o] of Object.entries(spec.options)) options[name] = { type: o.type, ...(o.multiple ? { multiple: true } : {}), ...(o.short ? { short: o.short } : {}) };
  try {
    const { values, positionals } = parseArgs({ args: [...args], options, allowPositionals: true, strict: true });
    const v = values as OptionValues;
    return { ok: true, help: v.help === true, values: v, positionals };
  } catch (err) {
    return { ok: false, message: usageMessage(err) };
  }
}

/** Exactly one FILE among the positionals. */
export function oneFile(positionals: readonly string[]): { ok: true; file: string } | { ok: false; message: string } {
  if (positionals.length === 1) return { ok: true, file: positionals[0] };
  return { ok: false, message: positionals.length === 0 ? "missing FILE" : `expected one FILE, got ${positionals.length}` };
}

export const flag = (v: OptionValues, name: string): boolean => v[name] === true;
export const text = (v: OptionValues, name: string): string | undefined => (typeof v[name] === "string" ? (v[name] as string) : undefined);
export const texts = (v: OptionValues, name: string): string[] => (Array.isArray(v[name]) ? (v[name] as string[]) : typeof v[name] === "string" ? [v[name] as string] : []);

function optionLabel(name: string, o: OptionSpec): string {
  const long = `--${name}${o.type === "string" ? ` ${o.value ?? "VALUE"}` : ""}`;
  return o.short ? `-${o.short}, ${long}` : `    ${long}`;
}

/** One-line usage: "Usage: islet check FILE [options]". */
export function usageLine(spec: CommandSpec): string {
  return `Usage: islet ${spec.name} ${spec.synopsis}`;
}

/** The help of a command: usage, what it does, options, examples, exit codes. */
export function formatHelp(spec: CommandSpec): string {
  const all: [string, OptionSpec][] = [...Object.entries(spec.options), ["help", HELP_OPTION]];
  const labels = all.map(([n, o]) => optionLabel(n, o));
  const width = Math.max(...labels.map((l) => l.length)) + 2;
  const lines = [usageLine(spec), "", `${spec.summary[0].toUpperCase()}${spec.summary.slice(1)}.`, ...spec.about, "", "Options:"];
  all.forEach(([, o], i) => lines.push(`  ${labels[i].padEnd(width)}${o.help}${o.multiple ? " (may be repeated)" : ""}`));
  if (spec.examples.length) {
    lines.push("", "Examples:");
    for (const e of spec.examples) lines.push(`  ${e.command}`, `      ${e.does}`);
  }
  if (spec.exits.length) {
    // "130  stopped by Ctrl+C": the codes in one column
    const split = spec.exits.map((e) => /^(\S+)\s+(.*)$/.exec(e) ?? [e, e, ""]);
    const w = Math.max(...split.map((m) => m[1].length)) + 2;
    lines.push("", "Exit codes:", ...split.map((m) => `  ${m[1].padEnd(w)}${m[2]}`));
  }
  return lines.join("\n");
}

/** Exit code of a run stopped by Ctrl+C (128 + SIGINT's number 2, as shells report it). POSIX.1-2017, XCU 2.8.2. */
export const EXIT_INTERRUPTED = 130;
