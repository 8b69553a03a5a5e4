// `islet summary FILE [--json]`: element counts by kind, buses per voltage level, and the scenarios
// with their out-of-service sources. Exit 0 on a readable project, 1 on an invalid one, 2 on usage errors.
import { CAUTION_TEXT } from "../../model/caution.ts";
import type { CliCommand } from "../command.ts";
import { summarizeProject } from "../../model/projectSummary.ts";
import { flag, oneFile, type CommandSpec } from "../args.ts";
import { loadStep } from "../loadStep.ts";
import { runCommand } from "../runCommand.ts";
import { terminalField as f } from "../terminalText.ts";

export const summarySpec: CommandSpec = {
  name: "summary",
  summary: "element counts by kind, buses per voltage level, scenarios and their sources",
  synopsis: "FILE [--json]",
  about: ["For each scenario: the sources in and out of service, other elements out of service and the switch states."],
  options: { json: { type: "boolean", help: "print the summary as one JSON document on stdout" } },
  examples: [
    { command: "islet summary site.islet", does: "what site.islet holds, at a glance" },
    { command: "islet summary site.islet --json", does: "the same as JSON" },
  ],
  exits: ["0  a valid project", "1  not a valid project (run islet validate for the problems)", "2  bad options or the file cannot be read"],
};

export const summaryCommand: CliCommand = {
  name: "summary",
  summary: summarySpec.summary,
  spec: summarySpec,
  run: (args) =>
    runCommand(summarySpec, args, async (session, values, positionals) => {
      const file = oneFile(positionals);
      if (!file.ok) return session.usage(file.message);
      const json = flag(values, "json");
      const loaded = loadStep(session.out, "summary", file.file, { json, invalidExit: 1, note: `run "islet validate ${file.file}" for details` });
      if (!loaded.ok) return loaded.code;
      const s = summarizeProject(loaded.project);
      if (json) {
        session.out.json({ ok: true, file: file.file, ...s, warnings: loaded.warnings });
        return 0;
      }
      const lines = [`${f(s.name)} (${f(file.file)}, formatVersion ${s.formatVersion})`, `${s.elementCount} elements:`];
      for (const [kind, n] of Object.entries(s.countsByKind)) lines.push(`  ${f(kind).padEnd(12)} ${n}`);
      lines.push("Buses by voltage level:");
      for (const v of s.busesByVoltage) lines.push(`  ${String(v.un_kV).padStart(6)} kV  ${v.buses.length}: ${v.buses.map(f).join(", ")}`);
      lines.push(`${s.scenarios.length} scenario(s):`);
      for (const sc of s.scenarios) {
        lines.push(`  ${f(sc.id)} "${f(sc.name)}"`);
        lines.push(`    sources in service:     ${sc.sourcesInService.map(f).join(", ") || "none"}`);
        lines.push(`    sources out of service: ${sc.sourcesOutOfService.map(f).join(", ") || "none"}`);
        if (sc.otherOutOfService.length) lines.push(`    also out of service:    ${sc.otherOutOfService.map(f).join(", ")}`);
        const sw = Object.entries(sc.switchStates);
        if (sw.length) lines.push(`    switches:               ${sw.map(([id, c]) => `${f(id)} ${c ? "closed" : "open"}`).join(", ")}`);
      }
      if (loaded.warnings.length) {
        lines.push(`${loaded.warnings.length} warning(s):`);
        for (const w of loaded.warnings) lines.push(`  warning: ${f(w)}`);
      }
      lines.push("", CAUTION_TEXT);
      session.out.print(lines.join("\n"));
      return 0;
    }),
};
