// `islet validate FILE [--json]`: loads a project file and reports every problem, each naming the
// element (id and name) and the field. Exit 0 when the file is good, 1 when it is not, 2 on usage errors.
import type { CliCommand } from "../command.ts";
import { readTextFile } from "../fileIo.ts";
import { loadProject } from "../../model/projectFile.ts";
import { validateRecords } from "../../model/validate.ts";
import type { Message } from "../../model/messages.ts";
import { parseFileArgs } from "../fileArgs.ts";

const USAGE = "Usage: islet validate FILE [--json]";

export const validateCommand: CliCommand = {
  name: "validate",
  summary: "check a project file and list every problem by element and field",
  async run(args) {
    const parsed = parseFileArgs(args, ["--json"]);
    if (!parsed.ok) {
      console.error(`islet validate: ${parsed.message}\n${USAGE}`);
      return 2;
    }
    const json = parsed.flags.has("--json");
    const file = readTextFile(parsed.file);
    if (!file.ok) {
      if (json) console.log(JSON.stringify({ ok: false, file: parsed.file, error: { kind: "unreadable", messages: [file.message] } }, null, 2));
      else console.error(`islet validate: ${file.message}`);
      return 2;
    }
    const result = loadProject(file.text);
    if (!result.ok) {
      if (json) console.log(JSON.stringify({ ok: false, file: parsed.file, error: result.error }, null, 2));
      else {
        console.error(`${parsed.file}: not a valid Islet project (${result.error.kind}), ${result.error.messages.length} problem(s):`);
        for (const m of result.error.messages) console.error(`  error: ${m}`);
      }
      return 1;
    }
    const { project } = result;
    // warnings and notes with their element and field, for tools that read --json
    const messages: Message[] = validateRecords(project);
    const counts = {
      elements: project.elements.length,
      buses: project.elements.filter((e) => e.kind === "bus").length,
      protectiveDevices: project.elements.filter((e) => e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker").length,
      scenarios: project.scenarios.length,
    };
    if (json) {
      console.log(JSON.stringify({ ok: true, file: parsed.file, name: project.meta.name, counts, warnings: result.warnings, messages }, null, 2));
      return 0;
    }
    const warn = result.warnings.length;
    console.log(
      `OK ${parsed.file}: "${project.meta.name}", ${counts.elements} elements (${counts.buses} buses, ${counts.protectiveDevices} protective devices), ${counts.scenarios} scenarios${warn ? `, ${warn} warning(s)` : ""}`,
    );
    for (const w of result.warnings) console.log(`  warning: ${w}`);
    return 0;
  },
};
