// The app lifecycle in main/main.ts with the whole electron module mocked: the scheme is
// registered before "ready" (Electron docs, protocol.registerSchemesAsPrivileged: "can only be
// used before the ready event"), the window opens on the demo at first start (project brief),
// the title follows the document state, and closing with unsaved work asks first.
import { afterAll, describe, expect, it, vi } from "vitest";

const env = await vi.hoisted(async () => {
  const { mkdtempSync, mkdirSync, writeFileSync } = await import("node:fs");
  const { tmpdir } = await import("node:os");
  const { join } = await import("node:path");
  const root = mkdtempSync(join(tmpdir(), "islet-main-lifecycle-"));
  mkdirSync(join(root, "out", "renderer"), { recursive: true });
  writeFileSync(join(root, "out", "renderer", "index.html"), "<!doctype html>");
  mkdirSync(join(root, "assets", "demo"), { recursive: true });
  writeFileSync(join(root, "assets", "demo", "dairy-coop.islet"), '{"format":"islet-project"}');
  const savedArgv = process.argv;
  process.argv = ["/opt/islet/islet"]; // a packaged launch without arguments
  let markReady: () => void = () => undefined;
  const ready = new Promise<void>((r) => (markReady = r));
  return { root, userData: join(root, "userData"), savedArgv, ready, markReady, appEvents: new Map<string, (...a: unknown[]) => void>(), order: [] as string[] };
});

vi.mock("electron", async () => {
  const base = (await import("./electronMock.ts")).electronMock();
  const handlers = new Map<string, (...a: unknown[]) => unknown>();
  const listeners = new Map<string, (...a: unknown[]) => unknown>();
  return {
    ...base,
    app: {
      isPackaged: false,
      getAppPath: () => env.root,
      getPath: (name: string) => (name === "userData" ? env.userData : env.root),
      getVersion: () => "0.1.0",
      setName: vi.fn(),
      enableSandbox: vi.fn(() => env.order.push("enableSandbox")),
      requestSingleInstanceLock: () => true,
      on: (event: string, fn: (...a: unknown[]) => void) => env.appEvents.set(event, fn),
      whenReady: () => env.ready.then(() => void env.order.push("ready")),
      quit: vi.fn(),
    },
    ipcMain: {
      handlers,
      listeners,
      handle: (c: string, fn: (...a: unknown[]) => unknown) => handlers.set(c, fn),
      on: (c: string, fn: (...a: unknown[]) => unknown) => listeners.set(c, fn),
    },
    protocol: {
      registerSchemesAsPrivileged: vi.fn(() => env.order.push("registerSchemesAsPrivileged")),
      handle: vi.fn(),
    },
  };
});

import * as electron from "electron";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { FakeBrowserWindow } from "./electronMock.ts";
import { CHANNELS } from "../../../main/channels.ts";
import { APP_ENTRY_URL } from "../../../main/protocol.ts";
import "../../../main/main.ts";

afterAll(async () => {
  process.argv = env.savedArgv;
  const { rmSync } = await import("node:fs");
  rmSync(env.root, { recursive: true, force: true });
});

const mocked = electron as unknown as {
  app: { quit: ReturnType<typeof vi.fn> };
  protocol: { handle: ReturnType<typeof vi.fn> };
  dialog: { showMessageBoxSync: ReturnType<typeof vi.fn>; showSaveDialog: ReturnType<typeof vi.fn> };
  Menu: { setApplicationMenu: ReturnType<typeof vi.fn> };
  ipcMain: { listeners: Map<string, (...a: unknown[]) => unknown>; handlers: Map<string, (...a: unknown[]) => unknown> };
};

const studio = { senderFrame: { url: APP_ENTRY_URL } };

function setState(state: { name: string; dirty: boolean }): void {
  mocked.ipcMain.listeners.get(CHANNELS.setDocumentState)!(studio, state);
}

async function untilWindow(): Promise<FakeBrowserWindow> {
  for (let i = 0; i < 100 && FakeBrowserWindow.instances.length === 0; i++) await new Promise((r) => setTimeout(r, 10));
  return FakeBrowserWindow.instances[0];
}

describe("app lifecycle", () => {
  it("registers the app scheme and enables the sandbox before the app is ready, with no window yet", () => {
    expect(env.order).toEqual(["enableSandbox", "registerSchemesAsPrivileged"]);
    expect(FakeBrowserWindow.instances).toHaveLength(0);
    expect(mocked.ipcMain.handlers.has(CHANNELS.saveProject)).toBe(true);
  });

  it("on ready serves the app protocol, installs the menu and opens the studio window", async () => {
    env.markReady();
    const win = await untilWindow();
    expect(win).toBeDefined();
    expect(mocked.protocol.handle).toHaveBeenCalledWith("islet-app", expect.any(Function));
    expect(mocked.Menu.setApplicationMenu).toHaveBeenCalled();
    expect(win.loadedUrl).toBe(APP_ENTRY_URL);
    expect((win.options.webPreferences as { preload: string }).preload).toMatch(/preload\.cjs$/);
  });

  it("tells the studio to open the demo on first start, once the page has loaded", async () => {
    const win = await untilWindow();
    win.webContents.emit("did-finish-load");
    expect(win.webContents.sent).toEqual([[CHANNELS.menuCommand, "openDemo"]]);
  });

  it("shows the document name and unsaved state in the title", async () => {
    const win = await untilWindow();
    mocked.ipcMain.listeners.get(CHANNELS.setDocumentState)!({ senderFrame: { url: APP_ENTRY_URL } }, { name: "dairy-coop.islet", dirty: true });
    expect(win.title).toBe("dairy-coop.islet • — Islet");
  });

  it("asks before closing with unsaved work and stays open on Cancel", async () => {
    const win = await untilWindow();
    mocked.dialog.showMessageBoxSync.mockReturnValueOnce(2); // Cancel
    expect(win.close()).toBe(false);
    expect(mocked.dialog.showMessageBoxSync).toHaveBeenCalledTimes(1);
    const options = mocked.dialog.showMessageBoxSync.mock.calls[0][1] as { buttons: string[]; message: string };
    expect(options.buttons).toEqual(["Save", "Discard", "Cancel"]);
    expect(options.message).toContain("dairy-coop.islet");
  });

  it("on Save asks the studio to save and keeps the window until the save is done", async () => {
    const win = await untilWindow();
    mocked.dialog.showMessageBoxSync.mockReturnValueOnce(0); // Save
    expect(win.close()).toBe(false);
    expect(win.webContents.sent.at(-1)).toEqual([CHANNELS.menuCommand, "save"]);
  });

  it("lets the window close without asking once the document is saved", async () => {
    const win = await untilWindow();
    mocked.dialog.showMessageBoxSync.mockClear();
    setState({ name: "dairy-coop.islet", dirty: false });
    const event = { preventDefault: vi.fn() };
    win.emit("close", event);
    expect(event.preventDefault).not.toHaveBeenCalled();
    expect(mocked.dialog.showMessageBoxSync).not.toHaveBeenCalled();
  });

  it("resumes a quit once the save chosen in the close question has succeeded", async () => {
    const win = await untilWindow();
    setState({ name: "dairy-coop.islet", dirty: true });
    env.appEvents.get("before-quit")!();
    mocked.dialog.showMessageBoxSync.mockReturnValueOnce(0); // Save
    expect(win.close()).toBe(false);
    expect(mocked.app.quit).not.toHaveBeenCalled();
    mocked.dialog.showSaveDialog.mockResolvedValueOnce({ canceled: false, filePath: join(env.root, "saved.islet") });
    const result = (await mocked.ipcMain.handlers.get(CHANNELS.saveProject)!(studio, '{"saved":true}', null, false)) as { ok: boolean };
    expect(result.ok).toBe(true);
    expect(readFileSync(join(env.root, "saved.islet"), "utf8")).toBe('{"saved":true}');
    expect(win.destroyed).toBe(true);
    expect(mocked.app.quit).toHaveBeenCalledTimes(1);
  });
});
