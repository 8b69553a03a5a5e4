// While a command runs from the `islet` entry, console.log, console.info, console.warn and console.error print
// terminal-safe text (terminalLines: the line feeds kept, every other control escaped, JSON left valid). The
// commands print through their session's output, which is safe already (escaping twice changes nothing); this
// guard also covers any printing that does not go through it.
import { format } from "node:util";
import { terminalLines } from "./terminalText.ts";

type ConsoleMethod = "log" | "info" | "warn" | "error";
const METHODS: ConsoleMethod[] = ["log", "info", "warn", "error"];

/** Installs the guard; call the result to restore the console as it was. */
export function guardConsole(target: Pick<Console, ConsoleMethod> = console): () => void {
  const saved = METHODS.map((m) => [m, target[m]] as const);
  for (const [m, original] of saved) target[m] = (...args: unknown[]) => original.call(target, terminalLines(format(...args)));
  return () => {
    for (const [m, original] of saved) target[m] = original;
  };
}
