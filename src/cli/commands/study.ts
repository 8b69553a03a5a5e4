// `islet study FILE [--scenario ID] [--json] [--threads N] [--quiet]`: every bus's initial short-circuit currents for
// the four fault types, peak current and X/R, per scenario and per limit (max/min, as each scenario asks). With --json
// stdout holds only JSON (shape in README.md). --threads shares each sweep among N threads (same figures, bit for bit).
// Progress goes to stderr when it is a terminal. Exit 0 on success, 1 when the project is invalid or a network cannot
// be built, 2 on usage errors, 130 when stopped by Ctrl+C.
import type { CliCommand } from "../command.ts";
import { busFaultTableWith, formatBusFaultTable, sweepFaultsAsync, BUS_TABLE_SWEEP, FAULT_TYPES, type BusFaultTable } from "../../engine/index.ts";
import { busFaultTasks } from "../../engine/table/busFaultTable.ts";
import type { Project } from "../../model/schema.ts";
import { SweepPool } from "../parallel/sweepPool.ts";
import { EXIT_INTERRUPTED, flag, oneFile, QUIET_OPTION, text, type CommandSpec } from "../args.ts";
import { loadStep } from "../loadStep.ts";
import { runCommand, type CommandSession } from "../runCommand.ts";
import { terminalField, terminalLines } from "../terminalText.ts";

export const studySpec: CommandSpec = {
  name: "study",
  summary: 'every bus\'s I"k (3ph, LL, LG, LLG), ip and X/R per scenario and max/min limit',
  synopsis: "FILE [--scenario ID] [--json] [--threads N] [--quiet]",
  about: [
    "Per scenario (or the one given) and per limit it lists, the IEC 60909 short-circuit currents at every bus.",
    "While it runs, stderr shows the progress when it is a terminal; stdout holds only the table or the JSON.",
  ],
  options: {
    scenario: { type: "string", value: "ID", help: "only this scenario" },
    json: { type: "boolean", help: "print only JSON on stdout (shape in README.md)" },
    threads: { type: "string", value: "N", help: "share each sweep among N threads, 1 to 64 (default 1; same figures, bit for bit)" },
    quiet: QUIET_OPTION,
  },
  examples: [
    { command: "islet study site.islet", does: "the table for every scenario and limit" },
    { command: "islet study site.islet --scenario island --json > island.json", does: "one scenario as JSON, for scripts" },
    { command: "islet study big.islet --threads 2", does: "a large network, each sweep on two threads" },
  ],
  exits: ["0  every run computed", "1  an invalid project, or a network that cannot be built", "2  bad options or the file cannot be read", "130  stopped by Ctrl+C"],
};

/** Thrown from a sweep callback to leave busFaultTableWith at Ctrl+C. */
class Interrupted extends Error {}

/** The table, its progress counted in bus faults (buses x fault types x runs). */
async function studyTable(session: CommandSession, project: Project, scenario: string | undefined, threads: number): Promise<BusFaultTable> {
  const tasks = busFaultTasks(project, scenario);
  const perRun = project.elements.filter((e) => e.kind === "bus").length * FAULT_TYPES.length;
  const total = tasks.length * perRun;
  let finished = 0;
  session.progress.update("bus faults", 0, total);
  const afterRun = () => {
    finished++;
    session.progress.update("bus faults", finished * perRun, total);
    if (session.signal.aborted) throw new Interrupted();
  };
  if (threads <= 1)
    return busFaultTableWith(project, scenario, async (_task, network) => {
      const onProgress = (fraction: number) => {
        session.progress.update("bus faults", (finished + fraction) * perRun, total);
        return !session.signal.aborted;
      };
      const sw = await sweepFaultsAsync(network, { ...BUS_TABLE_SWEEP, onProgress }, session.yieldNow);
      afterRun();
      return sw;
    });
  // One network at a time, each under the same key so that the workers let the previous one go.
  const pool = new SweepPool(threads);
  const dropStop = session.onForcedStop(() => void pool.close());
  try {
    return await busFaultTableWith(project, scenario, async (task, network) => {
      const sw = await pool.sweep(pool.load("table", project, task.compile, network), BUS_TABLE_SWEEP);
      afterRun();
      return sw;
    });
  } finally {
    dropStop();
    await pool.close();
  }
}

export const studyCommand: CliCommand = {
  name: "study",
  summary: studySpec.summary,
  spec: studySpec,
  run: (args) =>
    runCommand(studySpec, args, async (session, values, positionals) => {
      const file = oneFile(positionals);
      if (!file.ok) return session.usage(file.message);
      const threadsText = text(values, "threads") ?? "1";
      if (!/^[1-9][0-9]*$/.test(threadsText) || Number(threadsText) > 64) return session.usage(`--threads needs a whole number from 1 to 64 (got ${threadsText})`);
      const json = flag(values, "json");
      const scenario = text(values, "scenario");
      const loaded = loadStep(session.out, "study", file.file, { json, invalidExit: 1 });
      if (!loaded.ok) return loaded.code;
      let report: BusFaultTable;
      try {
        report = await studyTable(session, loaded.project, scenario, Number(threadsText));
      } catch (err) {
        if (session.signal.aborted) return EXIT_INTERRUPTED;
        const message = err instanceof Error ? err.message : String(err);
        if (json) session.out.json({ ok: false, file: file.file, error: { kind: "usage", messages: [message] } });
        else session.out.error(`islet study: ${terminalField(message)}`);
        return 2;
      }
      if (session.signal.aborted) return EXIT_INTERRUPTED;
      const ok = report.runs.every((r) => r.ok);
      if (json) session.out.json({ ok, file: file.file, caution: report.caution, warnings: loaded.warnings, runs: report.runs });
      else {
        const lines = loaded.warnings.map((w) => `warning: ${terminalField(w)}`);
        // the engine composes the table's lines; names and ids inside it are made safe by terminalLines
        lines.push(terminalLines(formatBusFaultTable(report)));
        session.out.print(lines.join("\n"));
      }
      return ok ? 0 : 1;
    }),
};
