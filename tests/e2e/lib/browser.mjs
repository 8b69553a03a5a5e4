// Debian's Chromium driven by playwright-core: never a downloaded browser.
import { chromium } from "playwright-core";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";

export const CHROMIUM = process.env.ISLET_CHROMIUM ?? "/usr/bin/chromium";
const ARGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

/** A fresh persistent context in a new temporary profile; close() also removes the profile. */
export async function launchStudioBrowser(viewport = { width: 1366, height: 768 }) {
  const profile = await mkdtemp(join(tmpdir(), "islet-e2e-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    args: ARGS,
    headless: true,
    viewport,
    acceptDownloads: true,
  });
  // Saves are read back from downloads: hide the File System Access pickers (whose native dialogs a headless
  // browser cannot answer), so the studio takes its download path, as in browsers without the API.
  await context.addInitScript(() => {
    for (const name of ["showSaveFilePicker", "showOpenFilePicker"]) Object.defineProperty(window, name, { value: undefined, configurable: true });
  });
  return {
    context,
    async close() {
      await context.close().catch(() => {});
      await rm(profile, { recursive: true, force: true }).catch(() => {});
    },
  };
}
