// Arguments and help of `islet check`, read with node:util parseArgs through the shared CommandSpec (args.ts).
// check.ts (the command itself) uses parseCheckArgs and checkSpec; main.ts shows checkSpec for `islet help check`.
import { FAULT_TYPES, type FaultType } from "../../study/types.ts";
import { flag, oneFile, parseCommandArgs, QUIET_OPTION, texts, type CommandSpec } from "../args.ts";

export const checkSpec: CommandSpec = {
  name: "check",
  summary: "run the protection study and list its verdicts; exit 1 when one fails",
  synopsis: "FILE [--scenario ID] [--bus ID] [--fault 3ph|LL|LG|LLG] [--json] [--quiet]",
  about: [
    "Every bus and the points along every line or cable, the four fault types, each scenario at the limits it lists;",
    "prints every failing and warning verdict with its numbers, the totals and the clearing timelines.",
    "While it runs, stderr shows the progress when it is a terminal; stdout holds only the verdicts.",
  ],
  options: {
    scenario: { type: "string", multiple: true, value: "ID", help: "only this scenario" },
    bus: { type: "string", multiple: true, value: "ID", help: "only faults at this bus" },
    fault: { type: "string", multiple: true, value: "TYPE", help: `only this fault type: ${FAULT_TYPES.join(", ")}` },
    json: { type: "boolean", help: "print JSON on stdout (shape in README.md)" },
    quiet: QUIET_OPTION,
  },
  examples: [
    { command: "islet check site.islet", does: "every verdict that fails or warns, with the totals" },
    { command: "islet check site.islet --scenario island --fault LG --json", does: "earth faults in one scenario, as JSON" },
    { command: "islet check site.islet --quiet || echo 'a verdict fails'", does: "in a review pipeline: exit 1 when a verdict fails" },
  ],
  exits: ["0  no verdict fails", "1  a verdict fails", "2  bad options, or a file that cannot be read or is not a valid project", "130  stopped by Ctrl+C"],
};

export interface CheckArgs {
  file: string;
  json: boolean;
  scenarios: string[];
  buses: string[];
  faults: FaultType[];
  /** No progress line on stderr. */
  quiet: boolean;
}

export type CheckArgsResult = { ok: true; value: CheckArgs } | { ok: false; message: string };

/** Reads check's arguments; `--help` is answered before this (see runCommand.ts and main.ts). */
export function parseCheckArgs(args: readonly string[]): CheckArgsResult {
  const parsed = parseCommandArgs(checkSpec, args);
  if (!parsed.ok) return parsed;
  const v = parsed.values;
  const faults: FaultType[] = [];
  for (const given of texts(v, "fault")) {
    const t = FAULT_TYPES.find((x) => x.toLowerCase() === given.toLowerCase());
    if (!t) return { ok: false, message: `--fault must be one of ${FAULT_TYPES.join(", ")} (got ${given})` };
    faults.push(t);
  }
  const file = oneFile(parsed.positionals);
  if (!file.ok) return file;
  return { ok: true, value: { file: file.file, json: flag(v, "json"), scenarios: texts(v, "scenario"), buses: texts(v, "bus"), faults, quiet: flag(v, "quiet") } };
}
