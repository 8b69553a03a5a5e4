// Entry of the `islet` command: dispatches to one module per sub-command.
// Exit codes: 0 ok, 1 the checked thing failed (invalid file, failing verdict), 2 usage or internal error.
import { CAUTION_TEXT } from "../model/caution.ts";
import { validateCommand } from "./commands/validate.ts";
import { summaryCommand } from "./commands/summary.ts";
import { studyCommand } from "./commands/study.ts";
import { checkCommand } from "./commands/check.ts";
import { reportCommand } from "./commands/report.ts";
import type { CliCommand } from "./command.ts";

const commands: CliCommand[] = [validateCommand, summaryCommand, studyCommand, checkCommand, reportCommand];

function usage(): string {
  const lines = ["Usage: islet <command> FILE [options]", "", "Commands:"];
  for (const c of commands) lines.push(`  ${c.name.padEnd(10)} ${c.summary}`);
  lines.push("", CAUTION_TEXT);
  return lines.join("\n");
}

export async function main(argv: string[]): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === "--help" || name === "-h" || name === "help") {
    console.log(usage());
    return name ? 0 : 2;
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    console.error(`islet: unknown command "${name}"\n\n${usage()}`);
    return 2;
  }
  try {
    return await command.run(rest);
  } catch (err) {
    console.error(`islet ${name}: internal error: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
    return 2;
  }
}
