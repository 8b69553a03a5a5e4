// `islet study FILE [--scenario ID] [--json] [--threads N]`: every bus's initial short-circuit currents for the four
// fault types, peak current and X/R, per scenario and per limit (max/min, as each scenario asks). With --json stdout
// holds only JSON (shape in README.md). --threads shares each sweep among N threads (same figures, bit for bit).
// Exit 0 on success, 1 when the project is invalid or a network cannot be built, 2 on usage errors.
import type { CliCommand } from "../command.ts";
import { readTextFile } from "../fileIo.ts";
import { loadProject } from "../../model/projectFile.ts";
import { busFaultTable, busFaultTableWith, formatBusFaultTable, BUS_TABLE_SWEEP } from "../../engine/index.ts";
import { SweepPool } from "../parallel/sweepPool.ts";

const USAGE = "Usage: islet study FILE [--scenario ID] [--json] [--threads N]";

function parseArgs(args: string[]): { ok: true; file: string; scenario?: string; json: boolean; threads: number } | { ok: false; message: string } {
  let file: string | undefined;
  let scenario: string | undefined;
  let json = false;
  let threads = 1;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === "--json") json = true;
    else if (a === "--threads" || a.startsWith("--threads=")) {
      const v = a === "--threads" ? args[++i] : a.slice("--threads=".length);
      if (v === undefined || !/^[1-9][0-9]*$/.test(v) || Number(v) > 64) return { ok: false, message: `--threads needs a whole number from 1 to 64 (got ${v ?? "nothing"})` };
      threads = Number(v);
    }
    else if (a === "--scenario") {
      if (i + 1 >= args.length) return { ok: false, message: "--scenario needs an ID" };
      scenario = args[++i];
    } else if (a.startsWith("--scenario=")) scenario = a.slice("--scenario=".length);
    else if (a.startsWith("--")) return { ok: false, message: `unknown option ${a}` };
    else if (file === undefined) file = a;
    else return { ok: false, message: "expected one FILE" };
  }
  if (file === undefined) return { ok: false, message: "missing FILE" };
  return { ok: true, file, scenario, json, threads };
}

export const studyCommand: CliCommand = {
  name: "study",
  summary: 'every bus\'s I"k (3ph, LL, LG, LLG), ip and X/R per scenario and max/min limit',
  async run(args) {
    const parsed = parseArgs(args);
    if (!parsed.ok) {
      console.error(`islet study: ${parsed.message}\n${USAGE}`);
      return 2;
    }
    const file = readTextFile(parsed.file);
    if (!file.ok) {
      console.error(`islet study: ${file.message}`);
      return 2;
    }
    const loaded = loadProject(file.text);
    if (!loaded.ok) {
      if (parsed.json) console.log(JSON.stringify({ ok: false, file: parsed.file, error: loaded.error }, null, 2));
      else {
        console.error(`${parsed.file}: not a valid Islet project (${loaded.error.kind}):`);
        for (const m of loaded.error.messages) console.error(`  error: ${m}`);
      }
      return 1;
    }
    let report;
    try {
      if (parsed.threads > 1) {
        const project = loaded.project;
        // One network at a time, each under the same key so that the workers let the previous one go.
        const pool = new SweepPool(parsed.threads);
        try {
          report = await busFaultTableWith(project, parsed.scenario, (task, network) => pool.sweep(pool.load("table", project, task.compile, network), BUS_TABLE_SWEEP));
        } finally {
          await pool.close();
        }
      } else report = busFaultTable(loaded.project, parsed.scenario);
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      if (parsed.json) console.log(JSON.stringify({ ok: false, file: parsed.file, error: { kind: "usage", messages: [message] } }, null, 2));
      else console.error(`islet study: ${message}`);
      return 2;
    }
    const ok = report.runs.every((r) => r.ok);
    if (parsed.json) console.log(JSON.stringify({ ok, file: parsed.file, caution: report.caution, warnings: loaded.warnings, runs: report.runs }, null, 2));
    else {
      for (const w of loaded.warnings) console.log(`warning: ${w}`);
      console.log(formatBusFaultTable(report));
    }
    return ok ? 0 : 1;
  },
};
