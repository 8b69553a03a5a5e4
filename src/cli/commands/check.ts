// `islet check FILE [--scenario ID] [--bus ID] [--fault TYPE] [--json]`: runs the protection study and
// prints the verdicts with their numbers. Exit 0 when nothing fails, 1 when a verdict fails (for
// design-review pipelines), 2 on a bad file or bad options. The JSON shape is documented in README.md.
import type { CliCommand } from "../command.ts";
import { readTextFile } from "../fileIo.ts";
import { loadProject } from "../../model/projectFile.ts";
import { studyProject } from "../../study/studyProject.ts";
import { jsonLinesWriter } from "../jsonLines.ts";
import { caseLine, headerLine, summaryLine, verdictLine, VerdictTally } from "./checkLines.ts";
import { FAULT_TYPES, STUDY_CAUTION, VERDICT_KINDS, type FaultType, type StudyOptions, type StudyResult, type Verdict } from "../../study/types.ts";

const USAGE = "Usage: islet check FILE [--scenario ID] [--bus ID] [--fault 3ph|LL|LG|LLG] [--json]";

interface CheckArgs {
  file: string;
  json: boolean;
  scenarios: string[];
  buses: string[];
  faults: FaultType[];
}

export function parseCheckArgs(args: readonly string[]): { ok: true; value: CheckArgs } | { ok: false; message: string } {
  const out: CheckArgs = { file: "", json: false, scenarios: [], buses: [], faults: [] };
  const files: string[] = [];
  for (let k = 0; k < args.length; k++) {
    const a = args[k];
    if (a === "--json") out.json = true;
    else if (a === "--scenario" || a === "--bus" || a === "--fault") {
      const v = args[k + 1];
      if (v === undefined || v.startsWith("--")) return { ok: false, message: `option ${a} needs a value` };
      k++;
      if (a === "--scenario") out.scenarios.push(v);
      else if (a === "--bus") out.buses.push(v);
      else {
        const t = FAULT_TYPES.find((x) => x.toLowerCase() === v.toLowerCase());
        if (!t) return { ok: false, message: `--fault must be one of ${FAULT_TYPES.join(", ")} (got ${v})` };
        out.faults.push(t);
      }
    } else if (a.startsWith("--")) return { ok: false, message: `unknown option ${a}` };
    else files.push(a);
  }
  if (files.length !== 1) return { ok: false, message: files.length === 0 ? "missing FILE" : `expected one FILE, got ${files.length}` };
  out.file = files[0];
  return { ok: true, value: out };
}

function humanReport(file: string, result: StudyResult): string[] {
  const lines: string[] = [];
  const scen = result.matrix.scenarios.length;
  lines.push(`${file}: "${result.project}", ${scen} scenario(s), ${result.cases.length} fault cases, ${result.verdicts.length} verdicts`);
  const order: Record<Verdict["status"], number> = { fail: 0, warn: 1, pass: 2 };
  const shown = result.verdicts.filter((v) => v.status !== "pass").sort((a, b) => order[a.status] - order[b.status] || VERDICT_KINDS.indexOf(a.kind) - VERDICT_KINDS.indexOf(b.kind));
  for (const v of shown) lines.push(`  ${v.status.toUpperCase().padEnd(4)} ${v.kind.padEnd(11)} ${v.explanation}`);
  if (shown.length === 0) lines.push("  every verdict passes");
  lines.push("Totals:");
  for (const k of VERDICT_KINDS) {
    const t = result.matrix.totals[k];
    lines.push(`  ${k.padEnd(11)} ${t.fail} fail, ${t.warn} warn, ${t.pass} pass`);
  }
  if (result.timelines.length) {
    lines.push("Clearing timelines of the cases that matter (no isolation, unwanted operations, slowest per zone):");
    for (const tl of result.timelines) {
      const label = result.cases.find((c) => c.faultCase.id === tl.caseId)?.faultCase.label ?? tl.caseId;
      lines.push(`  ${label}: ${tl.summary}`);
      for (const e of tl.events) lines.push(`    ${e.t_s.toFixed(3)} s  ${e.device} ${e.action}${e.element ? ` (${e.element})` : ""}`);
    }
  }
  for (const w of result.warnings) lines.push(`warning: ${w}`);
  lines.push(STUDY_CAUTION);
  return lines;
}

export const checkCommand: CliCommand = {
  name: "check",
  summary: "run the protection study and list its verdicts; exit 1 when one fails",
  async run(args) {
    const parsed = parseCheckArgs(args);
    if (!parsed.ok) {
      console.error(`islet check: ${parsed.message}\n${USAGE}`);
      return 2;
    }
    const a = parsed.value;
    const file = readTextFile(a.file);
    if (!file.ok) {
      console.error(`islet check: ${file.message}`);
      return 2;
    }
    const loaded = loadProject(file.text);
    if (!loaded.ok) {
      console.error(`${a.file}: not a valid Islet project (${loaded.error.kind}), ${loaded.error.messages.length} problem(s):`);
      for (const m of loaded.error.messages) console.error(`  error: ${m}`);
      return 2;
    }
    const project = loaded.project;
    for (const s of a.scenarios)
      if (!project.scenarios.some((x) => x.id === s)) {
        console.error(`islet check: scenario ${s} is not in ${a.file} (scenarios: ${project.scenarios.map((x) => x.id).join(", ")})`);
        return 2;
      }
    for (const b of a.buses)
      if (!project.elements.some((e) => e.kind === "bus" && e.id === b)) {
        console.error(`islet check: bus ${b} is not in ${a.file}`);
        return 2;
      }
    const options: StudyOptions = {};
    if (a.scenarios.length) options.scenarios = a.scenarios;
    if (a.buses.length) options.buses = a.buses;
    if (a.faults.length) options.faultTypes = a.faults;
    if (a.json) {
      // JSON Lines, each scenario's lines written as soon as it is done
      const out = jsonLinesWriter();
      const tally = new VerdictTally();
      let warnings = 0;
      await out.write(headerLine(a.file, project.meta.name, STUDY_CAUTION));
      const done = await studyProject(
        project,
        { ...options, keepResults: false },
        {
          onScenario: async (part) => {
            for (const c of part.cases) {
              tally.cases++;
              await out.write(caseLine(c));
            }
            for (const v of part.verdicts) await out.write(verdictLine(v));
            tally.add(part.verdicts);
            for (const w of part.warnings) await out.write({ type: "warning", text: w });
            warnings += part.warnings.length;
          },
        },
      );
      // settings problems found while studying come last (the device models report them as they meet them)
      for (const w of done.warnings.slice(warnings)) await out.write({ type: "warning", text: w });
      await out.write(summaryLine(tally, done.warnings.length));
      return tally.failed > 0 ? 1 : 0;
    }
    const result = await studyProject(project, options);
    for (const line of humanReport(a.file, result)) console.log(line);
    return result.verdicts.some((v) => v.status === "fail") ? 1 : 0;
  },
};
