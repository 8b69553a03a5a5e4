// Canvas benchmark in Debian's Chromium: a generated diagram of 2,000+ elements panned and zoomed
// (frame rate from requestAnimationFrame timestamps in the page), and on the demo the time from an
// edit to the repainted fault overlay (performance marks set by the studio). Prints figures and
// PASS/MISS lines; never fails on a missed target.
import { spawnSync } from "node:child_process";
import { cpus, loadavg } from "node:os";
import { existsSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import type { Page } from "playwright-core";
import { generateRadialNetwork } from "../../src/model/generateNetwork.ts";
import { startPreview } from "../../tests/e2e/lib/server.mjs";
import { launchStudioBrowser, CHROMIUM } from "../../tests/e2e/lib/browser.mjs";
import { median } from "./libBench.ts";

const root = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
const TARGET_FPS = 50;
const TARGET_OVERLAY_MS = 50;
const ELEMENTS_WANTED = 2000;

/** Buses for a generated radial network of at least `wanted` elements (devices on every branch). */
function busesFor(wanted: number): number {
  let buses = 100;
  while (generateRadialNetwork({ buses, devices: buses, seed: 7 }).elements.length < wanted) buses += 20;
  return buses;
}

/** Records frame timestamps while `action` runs; returns frames per second and the 95th-percentile frame time. */
async function frameRate(page: Page, action: () => Promise<void>): Promise<{ fps: number; p95_ms: number; frames: number }> {
  // page scripts as text: the TypeScript loader would add helpers the page does not have
  await page.evaluate(`(() => {
    window.__frames = [];
    window.__recording = true;
    const tick = (t) => {
      if (!window.__recording) return;
      window.__frames.push(t);
      requestAnimationFrame(tick);
    };
    requestAnimationFrame(tick);
  })()`);
  await action();
  const frames = (await page.evaluate(`(() => { window.__recording = false; return window.__frames; })()`)) as number[];
  const gaps = frames.slice(1).map((t, i) => t - frames[i]);
  const sorted = [...gaps].sort((a, b) => a - b);
  const span_ms = frames[frames.length - 1] - frames[0];
  return { fps: ((frames.length - 1) / span_ms) * 1000, p95_ms: sorted[Math.floor(sorted.length * 0.95)] ?? NaN, frames: frames.length };
}

async function panAndZoom(page: Page): Promise<void> {
  const box = await page.locator(".canvas-wrap").boundingBox();
  if (!box) throw new Error("canvas not on screen");
  const cx = box.x + box.width / 2;
  const cy = box.y + box.height / 2;
  await page.mouse.move(cx, cy);
  await page.mouse.down();
  for (let i = 0; i < 90; i++) await page.mouse.move(cx + 200 * Math.sin(i / 9), cy + 120 * Math.cos(i / 9));
  await page.mouse.up();
  for (let i = 0; i < 30; i++) await page.mouse.wheel(0, i < 15 ? -120 : 120);
}

async function main() {
  if (!existsSync(CHROMIUM)) {
    console.log(`canvas: skipped, no Chromium at ${CHROMIUM}`);
    return;
  }
  if (!existsSync(join(root, "out/renderer/index.html"))) {
    const built = spawnSync(join(root, "node_modules/.bin/vite"), ["build", "--config", "renderer/vite.config.ts"], { cwd: root, stdio: "inherit" });
    if (built.status !== 0) throw new Error("renderer build failed");
  }
  const buses = busesFor(ELEMENTS_WANTED);
  const server = await startPreview(root);
  const browser = await launchStudioBrowser({ width: 1600, height: 1000 });
  try {
    const page = await browser.context.newPage();
    await page.goto(`${server.url}?generate=${buses}&devices=${buses}`);
    await page.waitForSelector("html[data-ready='1']", { timeout: 120000 });
    const elements = (await page.evaluate(`document.querySelectorAll(".react-flow__node").length`)) as number;
    await page.waitForTimeout(500);
    // the whole diagram in view (every node on screen), then at working scale
    const whole = await frameRate(page, () => panAndZoom(page));
    console.log(`canvas: whole diagram in view: ${whole.fps.toFixed(1)} fps over ${whole.frames} frames, p95 frame ${whole.p95_ms.toFixed(1)} ms`);
    const box = await page.locator(".canvas-wrap").boundingBox();
    if (box) await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    for (let i = 0; i < 9; i++) await page.mouse.wheel(0, -250);
    await page.waitForTimeout(500);
    const zoom = await page.evaluate(`document.querySelector(".react-flow__viewport").style.transform`);
    const r = await frameRate(page, () => panAndZoom(page));
    console.log(`canvas: at working scale (${zoom}): ${r.fps.toFixed(1)} fps`);
    console.log(`canvas: machine load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores (figures vary with load)`);
    console.log(`canvas: generated radial network, ${buses} buses, ${elements} nodes (devices drawn inside them)`);
    console.log(`canvas: pan and zoom ${r.fps.toFixed(1)} fps over ${r.frames} frames, p95 frame ${r.p95_ms.toFixed(1)} ms`);
    console.log(`${r.fps >= TARGET_FPS ? "PASS" : "MISS"} canvas pan/zoom of ${elements}+ elements: ${r.fps.toFixed(1)} fps (target ${TARGET_FPS} fps)`);

    // edit-to-overlay on the demo
    const demo = await browser.context.newPage();
    await demo.goto(`${server.url}?demo=1`);
    await demo.waitForSelector("html[data-ready='1']");
    await demo.locator('[data-element="LV-A"] .bus-bar').click({ force: true });
    await demo.keyboard.press("f");
    await demo.locator('[data-testid="fault-ikss"]').waitFor();
    await demo.locator('[data-element="T1"] svg').click({ force: true });
    const field = demo.getByLabel("Short-circuit voltage", { exact: true });
    const MEASURES = `performance.getEntriesByType("measure").filter((m) => m.name.startsWith("islet-overlay-"))`;
    const start = (await demo.evaluate(`${MEASURES}.length`)) as number;
    const edits = 20;
    for (let i = 0; i < edits; i++) {
      await field.fill(String(6 + ((i % 5) + 1) / 10));
      await field.press("Enter");
      await demo.waitForFunction(`${MEASURES}.length >= ${start + i + 1}`);
      await demo.waitForTimeout(120);
    }
    const times = (await demo.evaluate(`${MEASURES}.map((m) => m.duration)`)) as number[];
    const last = times.slice(-edits);
    const med = median(last);
    const worst = Math.max(...last);
    const mode = (await demo.evaluate(`window.__isletEngineMode`)) as string;
    const answers = ((await demo.evaluate(`performance.getEntriesByType("measure").filter((m) => m.name.startsWith("islet-answer-")).map((m) => m.duration)`)) as number[]).slice(-edits);
    console.log(`canvas: of which edit to engine answer (worker round trip while the edit renders): median ${median(answers).toFixed(1)} ms`);
    console.log(`canvas: demo edit-to-overlay over ${last.length} edits (${mode}): median ${med.toFixed(1)} ms, worst ${worst.toFixed(1)} ms`);
    console.log(`${med < TARGET_OVERLAY_MS ? "PASS" : "MISS"} demo edit-to-overlay median ${med.toFixed(1)} ms (target < ${TARGET_OVERLAY_MS} ms)`);
  } finally {
    await browser.close();
    await server.stop();
  }
}

await main();
