/** One sub-command of the `islet` CLI. `run` returns the process exit code. */
export interface CliCommand {
  name: string;
  summary: string;
  run(args: string[]): Promise<number>;
}
