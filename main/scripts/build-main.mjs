// Bundles the Electron main process and the preload into out/main/ with esbuild.
// Both are CommonJS: the main process because Electron loads it most predictably that way,
// the preload because a sandboxed preload cannot load ES modules or local files, only "electron".
import { build } from "esbuild";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "../..");

/** esbuild options for the two bundles; exported so a test can check them without building. */
export function mainBuildOptions(root = repoRoot, { production = process.env.NODE_ENV === "production", outDir = join(root, "out", "main") } = {}) {
  const common = {
    bundle: true,
    format: "cjs",
    target: "node20",
    external: ["electron"],
    sourcemap: production ? false : "linked",
    minify: production,
    logLevel: "warning",
    absWorkingDir: root,
  };
  return [
    { ...common, platform: "node", entryPoints: [join(root, "main", "main.ts")], outfile: join(outDir, "main.cjs") },
    // Sandboxed preloads get a limited require: only "electron" (and a few polyfills) resolve,
    // so everything else is bundled in and nothing may pull in Node built-ins.
    { ...common, platform: "browser", entryPoints: [join(root, "main", "preload.ts")], outfile: join(outDir, "preload.cjs") },
  ];
}

export async function buildMain(root = repoRoot, options = {}) {
  for (const o of mainBuildOptions(root, options)) await build(o);
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  await buildMain();
  console.log("build-main: out/main/main.cjs, out/main/preload.cjs");
}
