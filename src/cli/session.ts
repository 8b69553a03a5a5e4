// One run of a sub-command: where it prints (stdout and stderr, made terminal-safe), its progress line, and how
// Ctrl+C reaches it. The first Ctrl+C aborts `signal`: the command stops at its next check, ends its worker
// threads, removes what it had half written and exits 130. A second Ctrl+C stops at once, after the synchronous
// clean-ups registered with onForcedStop (the command may be inside a long computation that cannot look).
import { EXIT_INTERRUPTED } from "./args.ts";
import { jsonForTerminal, terminalLines } from "./terminalText.ts";
import { progressFor, type ProgressSink, type ProgressStream } from "./progress/progressLine.ts";

/** Printing for a command: every line is terminal-safe, and the progress line is erased before it. */
export interface CliOutput {
  /** Lines on stdout (joined by line feeds; other controls escaped). */
  print(text: string): void;
  /** A value as indented JSON on stdout (terminal-safe, same value when parsed). */
  json(value: unknown): void;
  /** A value as one line of JSON on stdout (JSON Lines; terminal-safe, same value when parsed). */
  jsonLine(value: unknown): void;
  /** Lines on stderr. */
  error(text: string): void;
}

/** Where Ctrl+C comes from: process SIGINT, or a stand-in in tests. */
export interface InterruptSource {
  /** Calls `handler` on each interrupt until the returned function is called. */
  listen(handler: () => void): () => void;
}

export const processInterrupts: InterruptSource = {
  listen(handler) {
    process.on("SIGINT", handler);
    return () => void process.off("SIGINT", handler);
  },
};

export interface SessionOptions {
  quiet?: boolean;
  /** Progress goes here when it is a terminal (default process.stderr). */
  progressStream?: ProgressStream;
  interrupts?: InterruptSource;
  /** Ends the process at a second Ctrl+C (default process.exit). */
  exit?: (code: number) => void;
  now?: () => number;
}

export interface CliSession {
  readonly name: string;
  readonly out: CliOutput;
  readonly progress: ProgressSink;
  /** Aborted at the first Ctrl+C. */
  readonly signal: AbortSignal;
  /** Gives the event loop a turn, so that a Ctrl+C can be seen during a long computation. */
  yieldNow(): Promise<void>;
  /** A synchronous clean-up run if a second Ctrl+C ends the process at once; call the result to drop it. */
  onForcedStop(cleanup: () => void): () => void;
  /** What the one-line message after an interrupt adds, e.g. "no report written". */
  interruptNote: string;
}

/** console.log and console.error, so that output captured in tests and piped output are the same text. */
export function consoleOutput(progress: ProgressSink = { update() {}, clear() {} }): CliOutput {
  return {
    print(text) {
      progress.clear();
      console.log(terminalLines(text));
    },
    json(value) {
      progress.clear();
      console.log(jsonForTerminal(JSON.stringify(value, null, 2)));
    },
    jsonLine(value) {
      progress.clear();
      console.log(jsonForTerminal(JSON.stringify(value)));
    },
    error(text) {
      progress.clear();
      console.error(terminalLines(text));
    },
  };
}

const yieldNow = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Runs a command's body in a session. The body returns its exit code; when it throws after a Ctrl+C (a study
 * cancelled, a browser closed under it) the exit code is 130. After an interrupt one line on stderr says so.
 */
export async function runSession(name: string, options: SessionOptions, body: (session: CliSession) => Promise<number>): Promise<number> {
  const controller = new AbortController();
  const line = progressFor(`islet ${name}`, options.progressStream ?? process.stderr, options.quiet === true, options.now);
  // after Ctrl+C the line stays erased: the run is stopping, its count no longer matters
  const progress: ProgressSink = {
    update: (phase, done, total) => void (controller.signal.aborted || line.update(phase, done, total)),
    clear: () => line.clear(),
  };
  const out = consoleOutput(progress);
  const cleanups = new Set<() => void>();
  const session: CliSession = {
    name,
    out,
    progress,
    signal: controller.signal,
    yieldNow,
    onForcedStop(cleanup) {
      cleanups.add(cleanup);
      return () => void cleanups.delete(cleanup);
    },
    interruptNote: "",
  };
  const exit = options.exit ?? ((code: number) => process.exit(code));
  const stopListening = (options.interrupts ?? processInterrupts).listen(() => {
    if (!controller.signal.aborted) {
      controller.abort();
      progress.clear();
      return;
    }
    for (const c of cleanups) {
      try {
        c();
      } catch {
        // stopping at once: a clean-up that fails must not keep the process alive
      }
    }
    progress.clear();
    console.error(`islet ${name}: stopped`);
    exit(EXIT_INTERRUPTED);
  });
  let code: number;
  try {
    code = await body(session);
  } catch (err) {
    if (!controller.signal.aborted) throw err;
    code = EXIT_INTERRUPTED;
  } finally {
    stopListening();
    progress.clear();
  }
  if (code === EXIT_INTERRUPTED) out.error(`islet ${name}: interrupted${session.interruptNote ? `; ${session.interruptNote}` : ""}`);
  return code;
}
