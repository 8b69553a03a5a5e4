// Bundles the `islet` command into one ES module, out/cli/islet.mjs, for packaging.
// (During development src/cli/islet.mjs runs the TypeScript sources through tsx instead.)
import { build } from "esbuild";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "../..");

const entry = `import { main } from "./src/cli/main.ts";
process.exitCode = await main(process.argv.slice(2));
`;

export function cliBuildOptions(root = repoRoot) {
  return {
    stdin: { contents: entry, resolveDir: root, sourcefile: "islet-cli-entry.ts", loader: "ts" },
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    outfile: join(root, "out", "cli", "islet.mjs"),
    banner: {
      // Some bundled packages are CommonJS and call require(); give the ES module one.
      js: '#!/usr/bin/env node\nimport { createRequire as __isletCreateRequire } from "node:module";\nconst require = __isletCreateRequire(import.meta.url);',
    },
    logLevel: "warning",
    absWorkingDir: root,
  };
}

/** The sweep worker thread of `islet study --threads`, beside the command (see src/cli/parallel/sweepPool.ts). */
export function cliWorkerBuildOptions(root = repoRoot) {
  const options = cliBuildOptions(root);
  return {
    ...options,
    stdin: undefined,
    entryPoints: [join(root, "src", "cli", "parallel", "sweepWorker.ts")],
    outfile: join(root, "out", "cli", "sweepWorker.mjs"),
    banner: { js: options.banner.js.replace("#!/usr/bin/env node\n", "") },
  };
}

export async function buildCli(root = repoRoot) {
  await build(cliBuildOptions(root));
  await build(cliWorkerBuildOptions(root));
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  await buildCli();
  console.log("build-cli: out/cli/islet.mjs, out/cli/sweepWorker.mjs");
}
