import type { CliCommand } from "../command.ts";

// Placeholder until this command lands; it refuses rather than pretending to work.
export const reportCommand: CliCommand = {
  name: "report",
  summary: "(not yet available)",
  async run() {
    console.error("islet report: not yet available in this build");
    return 2;
  },
};
