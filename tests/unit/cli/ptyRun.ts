// Runs a shell command with a real terminal on its stdin and stderr (util-linux `script` gives it a pseudo
// terminal), optionally typing Ctrl+C into that terminal once its output shows a text: the terminal's line
// discipline then sends SIGINT, exactly as a key press would.
import { spawn } from "node:child_process";
import { existsSync } from "node:fs";

export const HAS_SCRIPT = existsSync("/usr/bin/script");

export interface PtyResult {
  code: number | null;
  /** Everything the command wrote to the terminal. */
  screen: string;
  /** Whether Ctrl+C was typed. */
  interrupted: boolean;
}

/** Shell quoting for one argument. */
export const sh = (s: string) => `'${s.replaceAll("'", "'\\''")}'`;

export function ptyRun(command: string, opts: { ctrlCWhen?: string } = {}): Promise<PtyResult> {
  return new Promise((resolve, reject) => {
    const child = spawn("script", ["-qfec", command, "/dev/null"], { stdio: ["pipe", "pipe", "pipe"] });
    let screen = "";
    let interrupted = false;
    child.stdout.on("data", (d: Buffer) => {
      screen += d.toString("utf8");
      if (opts.ctrlCWhen !== undefined && !interrupted && screen.includes(opts.ctrlCWhen)) {
        interrupted = true;
        child.stdin.write("\x03");
      }
    });
    child.on("error", reject);
    child.on("close", (code) => resolve({ code, screen, interrupted }));
  });
}
