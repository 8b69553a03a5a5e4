import type { CommandSpec } from "./args.ts";

/** One sub-command of the `islet` CLI. `run` returns the process exit code. */
export interface CliCommand {
  name: string;
  summary: string;
  /** Options, examples and exit codes, for `islet help NAME` and `islet NAME --help`. */
  spec?: CommandSpec;
  run(args: string[]): Promise<number>;
}
