// `islet summary FILE [--json]`: element counts by kind, buses per voltage level, and the scenarios
// with their out-of-service sources. Exit 0 on a readable project, 1 on an invalid one, 2 on usage errors.
import { CAUTION_TEXT } from "../../model/caution.ts";
import type { CliCommand } from "../command.ts";
import { readTextFile } from "../fileIo.ts";
import { parseFileArgs } from "../fileArgs.ts";
import { loadProject } from "../../model/projectFile.ts";
import { summarizeProject } from "../../model/projectSummary.ts";

const USAGE = "Usage: islet summary FILE [--json]";
const CAUTION = CAUTION_TEXT;

export const summaryCommand: CliCommand = {
  name: "summary",
  summary: "element counts by kind, buses per voltage level, scenarios and their sources",
  async run(args) {
    const parsed = parseFileArgs(args, ["--json"]);
    if (!parsed.ok) {
      console.error(`islet summary: ${parsed.message}\n${USAGE}`);
      return 2;
    }
    const json = parsed.flags.has("--json");
    const file = readTextFile(parsed.file);
    if (!file.ok) {
      console.error(`islet summary: ${file.message}`);
      return 2;
    }
    const result = loadProject(file.text);
    if (!result.ok) {
      if (json) console.log(JSON.stringify({ ok: false, file: parsed.file, error: result.error }, null, 2));
      else {
        console.error(`${parsed.file}: not a valid Islet project (${result.error.kind}); run "islet validate ${parsed.file}" for details:`);
        for (const m of result.error.messages) console.error(`  error: ${m}`);
      }
      return 1;
    }
    const s = summarizeProject(result.project);
    if (json) {
      console.log(JSON.stringify({ ok: true, file: parsed.file, ...s, warnings: result.warnings }, null, 2));
      return 0;
    }
    const lines = [`${s.name} (${parsed.file}, formatVersion ${s.formatVersion})`, `${s.elementCount} elements:`];
    for (const [kind, n] of Object.entries(s.countsByKind)) lines.push(`  ${kind.padEnd(12)} ${n}`);
    lines.push("Buses by voltage level:");
    for (const v of s.busesByVoltage) lines.push(`  ${String(v.un_kV).padStart(6)} kV  ${v.buses.length}: ${v.buses.join(", ")}`);
    lines.push(`${s.scenarios.length} scenario(s):`);
    for (const sc of s.scenarios) {
      lines.push(`  ${sc.id} "${sc.name}"`);
      lines.push(`    sources in service:     ${sc.sourcesInService.join(", ") || "none"}`);
      lines.push(`    sources out of service: ${sc.sourcesOutOfService.join(", ") || "none"}`);
      if (sc.otherOutOfService.length) lines.push(`    also out of service:    ${sc.otherOutOfService.join(", ")}`);
      const sw = Object.entries(sc.switchStates);
      if (sw.length) lines.push(`    switches:               ${sw.map(([id, c]) => `${id} ${c ? "closed" : "open"}`).join(", ")}`);
    }
    if (result.warnings.length) {
      lines.push(`${result.warnings.length} warning(s):`);
      for (const w of result.warnings) lines.push(`  warning: ${w}`);
    }
    lines.push("", CAUTION);
    console.log(lines.join("\n"));
    return 0;
  },
};
