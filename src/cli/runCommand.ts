// The frame every sub-command runs in: its arguments read against its CommandSpec (node:util parseArgs),
// --help answered, usage errors reported the same way, then its body run in a session (terminal-safe output,
// progress, Ctrl+C).
import { flag, formatHelp, parseCommandArgs, usageLine, type CommandSpec, type OptionValues } from "./args.ts";
import { runSession, type CliSession, type SessionOptions } from "./session.ts";
import { terminalField } from "./terminalText.ts";

/** Exit code of a usage error. */
export const EXIT_USAGE = 2;

export interface CommandSession extends CliSession {
  /** Prints "islet NAME: message" and the usage line on stderr; returns the usage exit code. */
  usage(message: string): number;
}

export type CommandBody = (session: CommandSession, values: OptionValues, positionals: string[]) => Promise<number>;

/** Prints a usage error for `spec` (outside a session: before the arguments are known to be good). */
export function printUsageError(spec: CommandSpec, message: string): number {
  console.error(`islet ${spec.name}: ${terminalField(message)}\n${usageLine(spec)}\nRun "islet help ${spec.name}" for the options.`);
  return EXIT_USAGE;
}

export async function runCommand(spec: CommandSpec, args: readonly string[], body: CommandBody, options: SessionOptions = {}): Promise<number> {
  const parsed = parseCommandArgs(spec, args);
  if (!parsed.ok) return printUsageError(spec, parsed.message);
  if (parsed.help) {
    console.log(formatHelp(spec));
    return 0;
  }
  const quiet = flag(parsed.values, "quiet");
  return runSession(spec.name, { ...options, quiet: options.quiet === true || quiet }, (session) => {
    const commandSession: CommandSession = Object.assign(session, {
      usage: (message: string) => {
        session.out.error(`islet ${spec.name}: ${terminalField(message)}\n${usageLine(spec)}`);
        return EXIT_USAGE;
      },
    });
    return body(commandSession, parsed.values, parsed.positionals);
  });
}
