// The real esbuild bundles, loaded by Node with a stand-in "electron" module: the CommonJS main
// process starts up in the right order, and the preload bundle requires nothing but "electron"
// (sandboxed preloads can require only electron and a few polyfills: Electron docs, "Sandboxing").
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { useTempDir } from "./tempDir.ts";

const repo = resolve(fileURLToPath(new URL(".", import.meta.url)), "../../..");
const newDir = useTempDir();

// Loaded with `node -r`: answers require("electron") with a recorder that prints each call.
const FAKE_ELECTRON = `
const Module = require("module");
const { EventEmitter } = require("events");
const log = (...a) => console.log("electron:", ...a);
class BrowserWindow extends EventEmitter {
  constructor(o) {
    super();
    log("BrowserWindow", JSON.stringify(o.webPreferences));
    this.webContents = Object.assign(new EventEmitter(), {
      session: { setPermissionRequestHandler() {}, setPermissionCheckHandler() {}, webRequest: { onBeforeRequest() {} } },
      setWindowOpenHandler() {},
      send: (c, p) => log("send", c, JSON.stringify(p)),
      isLoading: () => true,
    });
  }
  loadURL(u) { log("loadURL", u); setTimeout(() => this.webContents.emit("did-finish-load"), 5); return Promise.resolve(); }
  isDestroyed() { return false; }
  static getAllWindows() { return []; }
}
const fake = {
  app: {
    isPackaged: false, getAppPath: () => process.env.FAKE_APP_ROOT, getPath: (n) => process.env.FAKE_APP_ROOT + "/" + n,
    getVersion: () => "0.1.0", setName() {}, enableSandbox: () => log("enableSandbox"), requestSingleInstanceLock: () => true,
    on() {}, whenReady: () => { log("whenReady"); return Promise.resolve(); }, quit: () => log("quit"),
  },
  BrowserWindow,
  Menu: { buildFromTemplate: (t) => t, setApplicationMenu: (m) => log("menu", m.map((x) => x.label.replace(/&/g, "")).join(",")) },
  dialog: { showErrorBox: (_t, m) => log("errorBox", m) },
  ipcMain: { handle: (c) => log("ipc", c), on: (c) => log("ipc", c) },
  protocol: { registerSchemesAsPrivileged: (s) => log("privileged", s.map((x) => x.scheme).join(",")), handle: (s) => log("protocol.handle", s) },
  contextBridge: { exposeInMainWorld: (k, v) => log("expose", k, Object.keys(v).sort().join(",")) },
  ipcRenderer: { on: (c) => log("ipcRenderer.on", c), invoke() {}, send() {} },
};
const load = Module._load;
Module._load = function (request, ...rest) { return request === "electron" ? fake : load.call(this, request, ...rest); };
`;

async function buildInto(outDir: string) {
  const { buildMain } = (await import(pathToFileURL(join(repo, "main", "scripts", "build-main.mjs")).href)) as {
    buildMain(root: string, o: { outDir: string; production: boolean }): Promise<void>;
  };
  await buildMain(repo, { outDir, production: false });
}

function run(script: string, appRoot: string, hook: string, args: string[] = []) {
  const r = spawnSync(process.execPath, ["-r", hook, script, ...args], { env: { ...process.env, FAKE_APP_ROOT: appRoot }, encoding: "utf8", timeout: 20000 });
  return (r.stdout + r.stderr).split("\n").filter((l) => l.startsWith("electron:"));
}

describe("built main process and preload", () => {
  it("start up in order: sandbox and scheme before ready, then protocol, menu, window, launch command", async () => {
    const dir = newDir();
    const out = join(dir, "bundle");
    await buildInto(out);
    const appRoot = join(dir, "app");
    mkdirSync(join(appRoot, "out", "renderer"), { recursive: true });
    writeFileSync(join(appRoot, "out", "renderer", "index.html"), "<!doctype html>");
    const hook = join(dir, "fake-electron.cjs");
    writeFileSync(hook, FAKE_ELECTRON);

    const lines = run(join(out, "main.cjs"), appRoot, hook, ["--demo"]).filter((l) => !l.startsWith("electron: ipc "));
    expect(lines.slice(0, 3)).toEqual(["electron: enableSandbox", "electron: privileged islet-app", "electron: whenReady"]);
    expect(lines).toContain("electron: protocol.handle islet-app");
    expect(lines).toContain("electron: menu File,Edit,View,Help");
    const prefs = JSON.parse(lines.find((l) => l.startsWith("electron: BrowserWindow "))!.slice("electron: BrowserWindow ".length));
    expect(prefs).toMatchObject({ contextIsolation: true, sandbox: true, nodeIntegration: false, webSecurity: true, preload: join(out, "preload.cjs") });
    expect(lines).toContain("electron: loadURL islet-app://studio/index.html");
    expect(lines.at(-1)).toBe('electron: send islet:menu-command "openDemo"');
  });

  it("the preload bundle requires only electron and exposes the whole HostApi", async () => {
    const dir = newDir();
    const out = join(dir, "bundle");
    await buildInto(out);
    const text = readFileSync(join(out, "preload.cjs"), "utf8");
    const required = [...text.matchAll(/\brequire\(\s*["']([^"']+)["']\s*\)/g)].map((m) => m[1]);
    expect([...new Set(required)]).toEqual(["electron"]);
    const hook = join(dir, "fake-electron.cjs");
    writeFileSync(hook, FAKE_ELECTRON);
    const lines = run(join(out, "preload.cjs"), dir, hook);
    expect(lines).toContain("electron: ipcRenderer.on islet:menu-command");
    expect(lines).toContain(
      "electron: expose isletHost clearAutosave,exportFile,exportReportPdf,kind,listRecent,loadDemo,onMenuCommand,openProject,openRecent,readAutosave,saveProject,setDocumentState,writeAutosave",
    );
  });
});
