// `islet check FILE [--scenario ID] [--bus ID] [--fault TYPE] [--json] [--quiet]`: runs the protection study and
// prints the verdicts with their numbers; with --json, JSON Lines written scenario by scenario (checkLines.ts).
// Exit 0 when nothing fails, 1 when a verdict fails (for design-review pipelines), 2 on a bad file or bad
// options, 130 when stopped by Ctrl+C. The output is documented in README.md.
import type { CliCommand } from "../command.ts";
import { EXIT_INTERRUPTED } from "../args.ts";
import { jsonLinesWriter } from "../jsonLines.ts";
import { loadStep } from "../loadStep.ts";
import { runCommand } from "../runCommand.ts";
import { refuseTooLarge, studyInSession } from "../studyRun.ts";
import { terminalField } from "../terminalText.ts";
import { STUDY_CAUTION, VERDICT_KINDS, type StudyOptions, type StudyResult, type Verdict } from "../../study/types.ts";
import { checkSpec, parseCheckArgs } from "./checkArgs.ts";
import { caseLine, headerLine, summaryLine, verdictLine, VerdictTally } from "./checkLines.ts";

export { parseCheckArgs };

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
  summary: checkSpec.summary,
  spec: checkSpec,
  run: (args) =>
    runCommand(checkSpec, args, async (session) => {
      const parsed = parseCheckArgs(args);
      if (!parsed.ok) return session.usage(parsed.message);
      const a = parsed.value;
      const loaded = loadStep(session.out, "check", a.file, { json: false, invalidExit: 2 });
      if (!loaded.ok) return loaded.code;
      const project = loaded.project;
      for (const s of a.scenarios)
        if (!project.scenarios.some((x) => x.id === s)) return session.usage(`scenario ${s} is not in ${a.file} (scenarios: ${project.scenarios.map((x) => x.id).join(", ")})`);
      for (const b of a.buses) if (!project.elements.some((e) => e.kind === "bus" && e.id === b)) return session.usage(`bus ${b} is not in ${a.file}`);
      const options: StudyOptions = {};
      if (a.scenarios.length) options.scenarios = a.scenarios;
      if (a.buses.length) options.buses = a.buses;
      if (a.faults.length) options.faultTypes = a.faults;
      const tooLarge = refuseTooLarge(session, project, options);
      if (tooLarge !== null) return tooLarge;
      if (a.json) {
        // JSON Lines, each scenario's lines written as soon as it is done
        const out = jsonLinesWriter();
        const tally = new VerdictTally();
        let warnings = 0;
        let unsolved = 0;
        await out.write(headerLine(a.file, project.meta.name, STUDY_CAUTION));
        const done = await studyInSession(session, project, { ...options, keepResults: false }, "", {
          onScenario: async (part) => {
            session.progress.clear();
            for (const c of part.cases) {
              tally.cases++;
              if (c.unsolved) unsolved++;
              await out.write(caseLine(c));
            }
            for (const v of part.verdicts) await out.write(verdictLine(v));
            tally.add(part.verdicts);
            for (const w of part.warnings) await out.write({ type: "warning", text: w });
            warnings += part.warnings.length;
          },
        });
        if (!done) return EXIT_INTERRUPTED;
        // settings problems found while studying come last (the device models report them as they meet them)
        for (const w of done.warnings.slice(warnings)) await out.write({ type: "warning", text: w });
        await out.write({ ...summaryLine(tally, done.warnings.length), unsolved });
        if (unsolved > 0) session.out.error(`islet check: ${unsolved} case(s) could not be solved by the engine; their reasons are in the warning lines`);
        return tally.failed > 0 || unsolved > 0 ? 1 : 0;
      }
      const result = await studyInSession(session, project, options);
      if (!result) return EXIT_INTERRUPTED;
      session.out.print(humanReport(terminalField(a.file), result).join("\n"));
      const unsolvedCases = result.cases.filter((c) => c.unsolved).length;
      if (unsolvedCases > 0) session.out.error(`islet check: ${unsolvedCases} case(s) could not be solved by the engine; their reasons are in the warnings above`);
      return result.verdicts.some((v) => v.status === "fail") || unsolvedCases > 0 ? 1 : 0;
    }),
};
