import type { CliCommand } from "../command.ts";

// Placeholder until this command lands; it refuses rather than pretending to work.
export const checkCommand: CliCommand = {
  name: "check",
  summary: "(not yet available)",
  async run() {
    console.error("islet check: not yet available in this build");
    return 2;
  },
};
