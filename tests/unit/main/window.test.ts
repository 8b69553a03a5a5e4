// The studio window's security settings, asserted on the options handed to BrowserWindow.
// Source: Electron security checklist (electronjs.org/docs/latest/tutorial/security): context
// isolation, sandbox, no Node integration, web security on, navigation and new windows limited,
// permission requests handled; the project brief's security rules.
import { beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("electron", async () => (await import("./electronMock.ts")).electronMock());

import { FakeBrowserWindow } from "./electronMock.ts";
import { createStudioWindow, isAllowedRequestUrl, lockDownContents, studioWebPreferences } from "../../../main/window.ts";
import { APP_ENTRY_URL } from "../../../main/protocol.ts";

beforeEach(() => {
  FakeBrowserWindow.instances = [];
});

function openWindow(dev = false) {
  createStudioWindow({ preloadPath: "/app/out/main/preload.cjs", dev });
  return FakeBrowserWindow.instances[0];
}

describe("studio window", () => {
  it("isolates the page: context isolation, sandbox, no Node integration, web security on", () => {
    const prefs = openWindow().options.webPreferences as Record<string, unknown>;
    expect(prefs.contextIsolation).toBe(true);
    expect(prefs.sandbox).toBe(true);
    expect(prefs.nodeIntegration).toBe(false);
    expect(prefs.nodeIntegrationInWorker).toBe(false);
    expect(prefs.webSecurity).toBe(true);
    expect(prefs.allowRunningInsecureContent).toBe(false);
    expect(prefs.webviewTag).toBe(false);
    expect(prefs.preload).toBe("/app/out/main/preload.cjs");
  });

  it("offers developer tools only in development", () => {
    expect(studioWebPreferences("/p", false).devTools).toBe(false);
    expect(studioWebPreferences("/p", true).devTools).toBe(true);
  });

  it("loads the studio from the app protocol, not from file://", () => {
    expect(openWindow().loadedUrl).toBe(APP_ENTRY_URL);
  });

  it("shows itself once the page is ready, avoiding a blank flash", () => {
    const win = openWindow();
    expect(win.options.show).toBe(false);
    win.emit("ready-to-show");
    expect(win.shown).toBe(true);
  });

  it("denies window.open and every navigation", () => {
    const win = openWindow();
    expect(win.webContents.windowOpenHandler!({ url: "https://example.org" })).toEqual({ action: "deny" });
    for (const name of ["will-navigate", "will-redirect", "will-attach-webview"]) {
      const preventDefault = vi.fn();
      win.webContents.emit(name, { preventDefault }, "https://example.org/");
      expect(preventDefault).toHaveBeenCalled();
    }
  });

  it("denies every permission request and check", () => {
    const { session } = openWindow().webContents;
    const answer = vi.fn();
    session.permissionRequestHandler!(null, "media", answer);
    expect(answer).toHaveBeenCalledWith(false);
    expect(session.permissionCheckHandler!()).toBe(false);
  });

  it("cancels requests to anything but the app, data: and blob:", () => {
    const { session } = openWindow().webContents;
    const decide = (url: string) => {
      let cancel: boolean | undefined;
      session.beforeRequest!({ url }, (r) => (cancel = r.cancel));
      return cancel;
    };
    expect(decide("https://example.org/tracker.js")).toBe(true);
    expect(decide("http://127.0.0.1:5178/")).toBe(true);
    expect(decide("file:///etc/passwd")).toBe(true);
    expect(decide("islet-app://studio/assets/app.js")).toBe(false);
    expect(decide("data:image/png;base64,AAAA")).toBe(false);
    expect(decide("blob:islet-app://studio/1234")).toBe(false);
    expect(isAllowedRequestUrl("devtools://devtools/bundled/x.html", true)).toBe(true);
    expect(isAllowedRequestUrl("devtools://devtools/bundled/x.html", false)).toBe(false);
  });

  it("can lock down any other web contents the app creates", () => {
    const win = new FakeBrowserWindow({});
    lockDownContents(win.webContents as never);
    expect(win.webContents.windowOpenHandler!({ url: "x" })).toEqual({ action: "deny" });
  });
});
