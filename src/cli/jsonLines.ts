// Writes JSON Lines to a stream one object at a time, waiting for the stream to drain when its buffer is
// full, so that a large study's output never piles up in memory.
import type { Writable } from "node:stream";
import { jsonForTerminal } from "./terminalText.ts";

export interface JsonLinesWriter {
  write(line: object): Promise<void>;
}

export function jsonLinesWriter(out: Writable = process.stdout): JsonLinesWriter {
  return {
    write(line) {
      // terminal-safe: C1 and bidi controls as \u escapes (JSON.stringify escapes only C0), the same value when parsed
      const ok = out.write(`${jsonForTerminal(JSON.stringify(line))}\n`);
      return ok ? Promise.resolve() : new Promise((resolve) => out.once("drain", () => resolve()));
    },
  };
}
