import type { CliCommand } from "../command.ts";

// Placeholder until this command lands; it refuses rather than pretending to work.
export const validateCommand: CliCommand = {
  name: "validate",
  summary: "(not yet available)",
  async run() {
    console.error("islet validate: not yet available in this build");
    return 2;
  },
};
