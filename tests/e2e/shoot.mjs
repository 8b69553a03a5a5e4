// Developer helper: serve the built studio, open a page and save a screenshot.
// Usage: node tests/e2e/shoot.mjs "?demo=1" out.png [width height] [dark]
import { resolve, dirname } from "node:path";
import { fileURLToPath } from "node:url";
import { startPreview } from "./lib/server.mjs";
import { launchStudioBrowser } from "./lib/browser.mjs";

const root = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
const [query = "", out = "tests/e2e/artifacts/shot.png", w = "1366", h = "768"] = process.argv.slice(2);
const server = await startPreview(root);
const browser = await launchStudioBrowser({ width: Number(w), height: Number(h) });
try {
  const page = await browser.context.newPage();
  page.on("console", (m) => console.log("console:", m.type(), m.text()));
  page.on("pageerror", (e) => console.log("pageerror:", e.message));
  await page.goto(server.url + query);
  await page.waitForSelector("html[data-ready='1']", { timeout: 20000 });
  await page.waitForTimeout(800);
  await page.screenshot({ path: out });
  console.log("saved", out);
} finally {
  await browser.close();
  await server.stop();
}
