// Electron main process: app lifecycle. Wires the protocol, the window, the menu, the IPC
// handlers and the close guard together; each of those lives in its own module.
import { app, BrowserWindow, dialog, ipcMain, protocol } from "electron";
import { existsSync } from "node:fs";
import { join } from "node:path";
import type { MenuCommand } from "../src/model/hostContract.ts";
import { CHANNELS } from "./channels.ts";
import { APP_NAME, documentTitle } from "./documentTitle.ts";
import { aboutText } from "./aboutText.ts";
import { CLOSE_DIALOG_BUTTONS, closeChoiceFromButton, createCloseGuard, type CloseGuard } from "./closeGuard.ts";
import { electronFileDialogs } from "./dialogs.ts";
import { createFileStore } from "./fileStore.ts";
import { fileRefFor, registerIpcHandlers } from "./ipc.ts";
import { createPdfPrinter } from "./pdfPrinter.ts";
import { developerToolsAllowed, parseLaunchArgs, startupCommand } from "./launchArgs.ts";
import { installMenu } from "./menu.ts";
import { registerAppScheme, serveAppProtocol } from "./protocol.ts";
import { createStudioWindow, lockDownContents } from "./window.ts";

const defaultApp = Boolean(process.defaultApp);
const launch = parseLaunchArgs(process.argv, defaultApp, process.cwd());
const dev = developerToolsAllowed(app.isPackaged, launch);
const isMac = process.platform === "darwin";

app.setName(APP_NAME);
app.enableSandbox();
registerAppScheme(protocol); // must happen before "ready"

const appRoot = app.getAppPath();
const rendererDir = join(appRoot, "out", "renderer");
const preloadPath = join(__dirname, "preload.cjs");
const resources = app.isPackaged ? process.resourcesPath : join(appRoot, "assets");
const demoPath = join(resources, "demo", "dairy-coop.islet");
const iconPath = join(resources, "icons", "icon.png");

const store = createFileStore({
  userDataDir: app.getPath("userData"),
  caseInsensitivePaths: process.platform === "win32" || isMac,
  warn: (m) => console.warn(m),
});

let win: BrowserWindow | null = null;
let guard: CloseGuard | null = null;
// Quit closes the window first; a prevented close cancels the quit. When the user chose Save
// during a quit, the quit is resumed once that save succeeded.
let quitRequested = false;
let quitAfterSave = false;
const pendingCommands: MenuCommand[] = [];

function send(command: MenuCommand): void {
  if (win && !win.isDestroyed() && !win.webContents.isLoading()) win.webContents.send(CHANNELS.menuCommand, command);
  else pendingCommands.push(command);
}

function showAbout(): void {
  const text = aboutText(app.getVersion(), { electron: process.versions.electron, chrome: process.versions.chrome, node: process.versions.node });
  const options = { type: "info" as const, title: `About ${APP_NAME}`, buttons: ["OK"], ...text };
  void (win ? dialog.showMessageBox(win, options) : dialog.showMessageBox(options));
}

function refreshMenu(paths: readonly string[]): void {
  installMenu({ isMac, dev, recent: paths.map(fileRefFor), send, showAbout });
}

const ipc = registerIpcHandlers(ipcMain, {
  store,
  dialogs: electronFileDialogs(() => win, () => app.getPath("documents")),
  demoPath,
  caseInsensitivePaths: process.platform === "win32" || isMac,
  now: () => new Date(),
  onDocumentState(state) {
    guard?.setState(state);
    if (win && !win.isDestroyed()) {
      win.setTitle(documentTitle(state.name, state.dirty));
      if (isMac) win.setDocumentEdited(state.dirty);
    }
  },
  onSaveFinished(ok) {
    if (!ok) quitAfterSave = false;
    guard?.saveFinished(ok);
  },
  onRecentChanged: refreshMenu,
  warn: (m) => console.warn(m),
  printPdf: createPdfPrinter({ newWindow: (options) => new BrowserWindow(options) }),
});

function openWindow(): void {
  const w = createStudioWindow({ preloadPath, dev, iconPath: existsSync(iconPath) ? iconPath : undefined });
  win = w;
  const g = createCloseGuard({
    ask(name) {
      const index = dialog.showMessageBoxSync(w, {
        type: "warning",
        title: APP_NAME,
        message: `Save the changes to ${name || "this project"} before closing?`,
        detail: "If you discard them, the changes since the last save are lost.",
        buttons: [...CLOSE_DIALOG_BUTTONS],
        defaultId: 0,
        cancelId: 2,
        noLink: true,
      });
      const choice = closeChoiceFromButton(index);
      if (choice !== "discard") {
        quitAfterSave = quitRequested && choice === "save";
        quitRequested = false;
      }
      return choice;
    },
    requestSave: () => send("save"),
    close() {
      w.close();
      if (quitAfterSave) app.quit();
      quitAfterSave = false;
    },
  });
  guard = g;
  w.on("close", (event) => g.onClose(event));
  w.on("closed", () => {
    if (win === w) win = null;
  });
  w.webContents.on("did-finish-load", () => {
    for (const command of pendingCommands.splice(0)) w.webContents.send(CHANNELS.menuCommand, command);
  });
}

function openFromOs(path: string): void {
  ipc.allowFile(path);
  send({ openRecent: fileRefFor(path) });
  if (win) {
    if (win.isMinimized()) win.restore();
    win.focus();
  }
}

if (!app.requestSingleInstanceLock()) {
  app.quit();
} else {
  app.on("second-instance", (_event, argv, cwd) => {
    const request = parseLaunchArgs(argv, defaultApp, cwd);
    if (request.file) openFromOs(request.file);
    else if (win) win.focus();
  });
  // macOS hands files over by event (Finder, dock), possibly before "ready".
  app.on("open-file", (event, path) => {
    event.preventDefault();
    openFromOs(path);
  });
  app.on("web-contents-created", (_event, contents) => lockDownContents(contents));
  app.on("before-quit", () => {
    quitRequested = true;
  });
  app.on("window-all-closed", () => {
    if (!isMac) app.quit();
  });
  app.on("activate", () => {
    if (BrowserWindow.getAllWindows().length === 0) openWindow();
  });

  void app.whenReady().then(async () => {
    if (!existsSync(join(rendererDir, "index.html"))) {
      dialog.showErrorBox(APP_NAME, `The studio has not been built (${rendererDir} is missing). Run "npm run build" first.`);
      app.quit();
      return;
    }
    serveAppProtocol(protocol, rendererDir);
    refreshMenu(await store.listRecent());
    const firstStart = await store.consumeFirstStart();
    if (launch.file) ipc.allowFile(launch.file);
    const first = startupCommand(launch, firstStart, fileRefFor);
    if (first) pendingCommands.push(first);
    openWindow();
  });
}
