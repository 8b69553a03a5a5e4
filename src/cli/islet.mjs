#!/usr/bin/env node
// The `islet` command. Runs the TypeScript CLI directly through tsx, so no build step is needed.
import { register } from "tsx/esm/api";

register();
const { main } = await import("./main.ts");
process.exitCode = await main(process.argv.slice(2));
