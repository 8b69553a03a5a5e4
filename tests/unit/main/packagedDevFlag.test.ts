// Hardening report, item 14: a packaged app honoured --dev (DevTools and the reload menu). main/main.ts with the
// electron module mocked as a packaged app launched with --dev: the window has no DevTools, the menu no reload.
import { afterAll, describe, expect, it, vi } from "vitest";

const env = await vi.hoisted(async () => {
  const { mkdtempSync, mkdirSync, writeFileSync } = await import("node:fs");
  const { tmpdir } = await import("node:os");
  const { join } = await import("node:path");
  const root = mkdtempSync(join(tmpdir(), "islet-main-packaged-"));
  mkdirSync(join(root, "out", "renderer"), { recursive: true });
  writeFileSync(join(root, "out", "renderer", "index.html"), "<!doctype html>");
  mkdirSync(join(root, "resources", "demo"), { recursive: true });
  writeFileSync(join(root, "resources", "demo", "dairy-coop.islet"), '{"format":"islet-project"}');
  const savedArgv = process.argv;
  process.argv = ["/opt/islet/islet", "--dev"];
  (process as { resourcesPath?: string }).resourcesPath = join(root, "resources");
  let markReady: () => void = () => undefined;
  const ready = new Promise<void>((r) => (markReady = r));
  return { root, savedArgv, ready, markReady };
});

vi.mock("electron", async () => {
  const base = (await import("./electronMock.ts")).electronMock();
  return {
    ...base,
    app: {
      isPackaged: true,
      getAppPath: () => env.root,
      getPath: () => env.root,
      getVersion: () => "0.1.0",
      setName: vi.fn(),
      enableSandbox: vi.fn(),
      requestSingleInstanceLock: () => true,
      on: vi.fn(),
      whenReady: () => env.ready,
      quit: vi.fn(),
    },
    ipcMain: { handle: vi.fn(), on: vi.fn() },
    protocol: { registerSchemesAsPrivileged: vi.fn(), handle: vi.fn() },
  };
});

import * as electron from "electron";
import { FakeBrowserWindow } from "./electronMock.ts";
import "../../../main/main.ts";

afterAll(async () => {
  process.argv = env.savedArgv;
  const { rmSync } = await import("node:fs");
  rmSync(env.root, { recursive: true, force: true });
});

describe("a packaged app launched with --dev", () => {
  it("opens its window without DevTools and its menu without reload or DevTools items", async () => {
    env.markReady();
    for (let i = 0; i < 100 && FakeBrowserWindow.instances.length === 0; i++) await new Promise((r) => setTimeout(r, 10));
    const win = FakeBrowserWindow.instances[0];
    expect((win.options.webPreferences as { devTools: boolean }).devTools).toBe(false);
    const menu = JSON.stringify((electron as unknown as { Menu: { buildFromTemplate: ReturnType<typeof vi.fn> } }).Menu.buildFromTemplate.mock.calls);
    expect(menu).toContain('"label":"&File"');
    expect(menu).not.toMatch(/toggleDevTools|"reload"|forceReload/);
  });
});
