import type { CliCommand } from "../command.ts";

// Placeholder until this command lands; it refuses rather than pretending to work.
export const summaryCommand: CliCommand = {
  name: "summary",
  summary: "(not yet available)",
  async run() {
    console.error("islet summary: not yet available in this build");
    return 2;
  },
};
