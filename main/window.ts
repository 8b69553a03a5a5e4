// The studio window and the locks around it: isolated, sandboxed renderer without Node, no
// navigation away from the app, no new windows, no permissions, no requests outside the app.
import { BrowserWindow, type Session, type WebContents, type WebPreferences } from "electron";
import { APP_ENTRY_URL, APP_ORIGIN } from "./protocol.ts";
import { APP_NAME } from "./documentTitle.ts";

export function studioWebPreferences(preloadPath: string, dev: boolean): WebPreferences {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    navigateOnDragDrop: false,
    spellcheck: false,
    devTools: dev,
  };
}

/** Requests the studio may make: its own files, and data/blob URLs it creates itself. */
export function isAllowedRequestUrl(url: string, dev: boolean): boolean {
  if (url.startsWith(`${APP_ORIGIN}/`)) return true;
  if (url.startsWith("data:") || url.startsWith("blob:")) return true;
  return dev && url.startsWith("devtools:");
}

export function lockDownSession(session: Session, dev: boolean): void {
  session.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  session.setPermissionCheckHandler(() => false);
  session.webRequest.onBeforeRequest((details, callback) => callback({ cancel: !isAllowedRequestUrl(details.url, dev) }));
}

export function lockDownContents(contents: WebContents): void {
  contents.on("will-navigate", (event) => event.preventDefault());
  contents.on("will-redirect", (event) => event.preventDefault());
  contents.on("will-attach-webview", (event) => event.preventDefault());
  contents.setWindowOpenHandler(() => ({ action: "deny" }));
}

export interface StudioWindowOptions {
  preloadPath: string;
  dev: boolean;
  iconPath?: string;
}

export function createStudioWindow(options: StudioWindowOptions): BrowserWindow {
  const win = new BrowserWindow({
    title: APP_NAME,
    width: 1440,
    height: 900,
    minWidth: 960,
    minHeight: 600,
    show: false,
    backgroundColor: "#f4f5f2",
    ...(options.iconPath ? { icon: options.iconPath } : {}),
    webPreferences: studioWebPreferences(options.preloadPath, options.dev),
  });
  lockDownSession(win.webContents.session, options.dev);
  lockDownContents(win.webContents);
  // The page's <title> must not replace the document title set by the host.
  win.on("page-title-updated", (event) => event.preventDefault());
  win.once("ready-to-show", () => win.show());
  void win.loadURL(APP_ENTRY_URL);
  return win;
}
