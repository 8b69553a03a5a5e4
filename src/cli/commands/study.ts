import type { CliCommand } from "../command.ts";

// Placeholder until this command lands; it refuses rather than pretending to work.
export const studyCommand: CliCommand = {
  name: "study",
  summary: "(not yet available)",
  async run() {
    console.error("islet study: not yet available in this build");
    return 2;
  },
};
