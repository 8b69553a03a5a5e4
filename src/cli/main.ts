// Entry of the `islet` command: dispatches to one module per sub-command.
// Exit codes: 0 ok, 1 the checked thing failed (invalid file, failing verdict), 2 usage or internal error,
// 130 stopped by Ctrl+C.
import { CAUTION_TEXT } from "../model/caution.ts";
// bundled into the packaged CLI, so the version travels with it
import packageJson from "../../package.json" with { type: "json" };
import { validateCommand } from "./commands/validate.ts";
import { summaryCommand } from "./commands/summary.ts";
import { studyCommand } from "./commands/study.ts";
import { checkCommand } from "./commands/check.ts";
import { checkSpec } from "./commands/checkArgs.ts";
import { reportCommand } from "./commands/report.ts";
import { formatHelp, type CommandSpec } from "./args.ts";
import type { CliCommand } from "./command.ts";
import { terminalField } from "./terminalText.ts";
import { guardConsole } from "./safeConsole.ts";

const commands: CliCommand[] = [validateCommand, summaryCommand, studyCommand, checkCommand, reportCommand];

export const VERSION: string = packageJson.version;

/** A command's spec: its own, or (for check, whose module the spec sits beside) the one in checkArgs.ts. */
function specOf(command: CliCommand): CommandSpec | undefined {
  return command.spec ?? (command.name === "check" ? checkSpec : undefined);
}

export function usage(): string {
  const lines = ["Usage: islet <command> FILE [options]", "       islet help <command> | islet <command> --help | islet --version", "", "Commands:"];
  for (const c of commands) lines.push(`  ${c.name.padEnd(10)} ${c.summary}`);
  lines.push("", 'Run "islet help <command>" for its options and examples.', "", CAUTION_TEXT);
  return lines.join("\n");
}

/** `islet help NAME`: the command's help on stdout (exit 0), or the list of commands (exit 2 for an unknown one). */
function help(name: string | undefined): number {
  if (name === undefined) {
    console.log(usage());
    return 0;
  }
  const command = commands.find((c) => c.name === name);
  const spec = command && specOf(command);
  if (!spec) {
    console.error(`islet help: unknown command "${terminalField(name)}"\n\n${usage()}`);
    return 2;
  }
  console.log(formatHelp(spec));
  return 0;
}

/** True when the arguments ask for help (before a "--" that ends the options). */
function asksForHelp(args: readonly string[]): boolean {
  for (const a of args) {
    if (a === "--") return false;
    if (a === "--help" || a === "-h") return true;
  }
  return false;
}

export async function main(argv: string[]): Promise<number> {
  const [name, ...rest] = argv;
  if (!name) {
    console.log(usage());
    return 2;
  }
  if (name === "--version" || name === "-V" || name === "version") {
    console.log(`islet ${VERSION}`);
    return 0;
  }
  if (name === "--help" || name === "-h") return help(undefined);
  if (name === "help") return help(rest[0]);
  const command = commands.find((c) => c.name === name);
  if (!command) {
    console.error(`islet: unknown command "${terminalField(name)}"\n\n${usage()}`);
    return 2;
  }
  const spec = specOf(command);
  if (spec && asksForHelp(rest)) {
    console.log(formatHelp(spec));
    return 0;
  }
  const restoreConsole = guardConsole();
  try {
    return await command.run(rest);
  } catch (err) {
    console.error(`islet ${name}: internal error: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
    return 2;
  } finally {
    restoreConsole();
  }
}
