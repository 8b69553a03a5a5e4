// Compiles every layer with its own tsconfig, so that a DOM or Node call in the core,
// or an Electron import in the renderer, fails to compile. Runs the native tsc.
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";

const tsc = "node_modules/.bin/tsc";
const layers = ["src/tsconfig.json", "src/cli/tsconfig.json", "renderer/tsconfig.json", "main/tsconfig.json", "tests/tsconfig.json"];
let failed = 0;
for (const project of layers) {
  if (!existsSync(project)) continue;
  const r = spawnSync(tsc, ["-p", project], { stdio: "inherit" });
  if (r.status !== 0) {
    failed++;
    console.error(`typecheck failed: ${project}`);
  }
}
if (failed) process.exit(1);
console.log(`typecheck: ${layers.length} layers clean`);
