// Browser end-to-end tests: serves the built studio with `vite preview` on a free port, drives
// Debian's Chromium with playwright-core, runs every spec in specs/ and prints
// `e2e: N passed, M failed`. Each spec file exports `steps`: [{ name, run(t) }] run in order on
// shared state; after a failed step the rest of that file is reported failed too.
import { readdir, mkdir } from "node:fs/promises";
import { existsSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { startPreview } from "./lib/server.mjs";
import { launchStudioBrowser, CHROMIUM } from "./lib/browser.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, "../..");
const artifacts = join(here, "artifacts");
const only = process.argv[2] ?? null;

async function main() {
  if (!existsSync(join(root, "out/renderer/index.html"))) {
    console.error("e2e: out/renderer is missing; run `npm run build:renderer` first");
    return 1;
  }
  if (!existsSync(CHROMIUM)) {
    console.error(`e2e: no Chromium at ${CHROMIUM}`);
    return 1;
  }
  await mkdir(artifacts, { recursive: true });
  let passed = 0;
  let failed = 0;
  const server = await startPreview(root);
  try {
    const files = (await readdir(join(here, "specs"))).filter((f) => f.endsWith(".mjs") && (!only || f.includes(only))).sort();
    for (const file of files) {
      const mod = await import(pathToFileURL(join(here, "specs", file)).href);
      const browser = await launchStudioBrowser(mod.viewport);
      const state = {};
      let broken = null;
      try {
        for (const step of mod.steps) {
          const label = `${file.replace(/\.mjs$/, "")} › ${step.name}`;
          if (broken) {
            failed++;
            console.log(`  ✗ ${label} (not run: "${broken}" failed)`);
            continue;
          }
          const started = Date.now();
          try {
            await step.run({ context: browser.context, url: server.url, state, artifacts, root, here });
            passed++;
            console.log(`  ✓ ${label} (${Date.now() - started} ms)`);
          } catch (err) {
            failed++;
            broken = step.name;
            console.log(`  ✗ ${label}\n      ${String(err?.stack ?? err).split("\n").slice(0, 6).join("\n      ")}`);
            const page = state.page;
            if (page && !page.isClosed()) await page.screenshot({ path: join(artifacts, `FAILED-${file}-${step.name.replace(/\W+/g, "-")}.png`) }).catch(() => {});
          }
        }
      } finally {
        await browser.close();
      }
    }
  } finally {
    await server.stop();
  }
  console.log(`e2e: ${passed} passed, ${failed} failed`);
  return failed > 0 ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(err);
    console.log("e2e: 0 passed, 1 failed");
    process.exit(1);
  },
);
