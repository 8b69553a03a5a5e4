// `islet validate FILE [--json]`: loads a project file and reports every problem, each naming the
// element (id and name) and the field. Exit 0 when the file is good, 1 when it is not, 2 on usage errors.
import type { CliCommand } from "../command.ts";
import { validateRecords } from "../../model/validate.ts";
import type { Message } from "../../model/messages.ts";
import { flag, oneFile, type CommandSpec } from "../args.ts";
import { loadStep } from "../loadStep.ts";
import { runCommand } from "../runCommand.ts";
import { terminalField } from "../terminalText.ts";

export const validateSpec: CommandSpec = {
  name: "validate",
  summary: "check a project file and list every problem by element and field",
  synopsis: "FILE [--json]",
  about: ["Every problem names the element (id and name) and the field. Warnings follow a good file."],
  options: { json: { type: "boolean", help: "print one JSON document on stdout: ok, counts, warnings and messages, or the loader's error" } },
  examples: [
    { command: "islet validate site.islet", does: "check site.islet and list its problems" },
    { command: "islet validate site.islet --json", does: "the same as JSON, for scripts" },
  ],
  exits: ["0  the file is a valid project", "1  it is not (the problems are listed)", "2  bad options or the file cannot be read"],
};

export const validateCommand: CliCommand = {
  name: "validate",
  summary: validateSpec.summary,
  spec: validateSpec,
  run: (args) =>
    runCommand(validateSpec, args, async (session, values, positionals) => {
      const file = oneFile(positionals);
      if (!file.ok) return session.usage(file.message);
      const json = flag(values, "json");
      const loaded = loadStep(session.out, "validate", file.file, { json, unreadableAsJson: true, invalidExit: 1 });
      if (!loaded.ok) return loaded.code;
      const { project } = loaded;
      // warnings and notes with their element and field, for tools that read --json
      const messages: Message[] = validateRecords(project);
      const counts = {
        elements: project.elements.length,
        buses: project.elements.filter((e) => e.kind === "bus").length,
        protectiveDevices: project.elements.filter((e) => e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker").length,
        scenarios: project.scenarios.length,
      };
      if (json) {
        session.out.json({ ok: true, file: file.file, name: project.meta.name, counts, warnings: loaded.warnings, messages });
        return 0;
      }
      const warn = loaded.warnings.length;
      const lines = [
        `OK ${terminalField(file.file)}: "${terminalField(project.meta.name)}", ${counts.elements} elements (${counts.buses} buses, ${counts.protectiveDevices} protective devices), ${counts.scenarios} scenarios${warn ? `, ${warn} warning(s)` : ""}`,
      ];
      for (const w of loaded.warnings) lines.push(`  warning: ${terminalField(w)}`);
      session.out.print(lines.join("\n"));
      return 0;
    }),
};
