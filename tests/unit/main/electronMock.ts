// A stand-in for the parts of the "electron" module the main process uses. Each test file
// calls vi.mock("electron", () => electronMock()) so nothing loads the real (absent) runtime.
import { EventEmitter } from "node:events";
import { vi } from "vitest";

type PermissionHandler = (wc: unknown, permission: string, cb: (ok: boolean) => void) => void;
type BeforeRequestHandler = (details: { url: string }, cb: (r: { cancel: boolean }) => void) => void;

export interface FakeSession {
  permissionRequestHandler: PermissionHandler | null;
  permissionCheckHandler: (() => boolean) | null;
  beforeRequest: BeforeRequestHandler | null;
  setPermissionRequestHandler(h: PermissionHandler): void;
  setPermissionCheckHandler(h: () => boolean): void;
  webRequest: { onBeforeRequest(h: BeforeRequestHandler): void };
}

export class FakeWebContents extends EventEmitter {
  windowOpenHandler: ((details: { url: string }) => { action: string }) | null = null;
  sent: Array<[string, unknown]> = [];
  loading = false;
  session: FakeSession = {
    permissionRequestHandler: null,
    permissionCheckHandler: null,
    beforeRequest: null,
    setPermissionRequestHandler(h) {
      this.permissionRequestHandler = h;
    },
    setPermissionCheckHandler(h) {
      this.permissionCheckHandler = h;
    },
    webRequest: {
      onBeforeRequest: (h) => {
        this.session.beforeRequest = h;
      },
    },
  };
  setWindowOpenHandler(h: (details: { url: string }) => { action: string }) {
    this.windowOpenHandler = h;
  }
  send(channel: string, payload: unknown) {
    this.sent.push([channel, payload]);
  }
  isLoading() {
    return this.loading;
  }
}

export class FakeBrowserWindow extends EventEmitter {
  static instances: FakeBrowserWindow[] = [];
  static getAllWindows() {
    return FakeBrowserWindow.instances.filter((w) => !w.destroyed);
  }
  options: Record<string, unknown>;
  webContents = new FakeWebContents();
  loadedUrl: string | null = null;
  title = "";
  destroyed = false;
  shown = false;
  constructor(options: Record<string, unknown>) {
    super();
    this.options = options;
    FakeBrowserWindow.instances.push(this);
  }
  loadURL(url: string) {
    this.loadedUrl = url;
    return Promise.resolve();
  }
  setTitle(t: string) {
    this.title = t;
  }
  setDocumentEdited() {}
  show() {
    this.shown = true;
  }
  focus() {}
  isMinimized() {
    return false;
  }
  restore() {}
  isDestroyed() {
    return this.destroyed;
  }
  /** Like Electron: emits "close" with a cancellable event, then "closed" unless prevented. */
  close() {
    let prevented = false;
    this.emit("close", { preventDefault: () => (prevented = true) });
    if (!prevented) {
      this.destroyed = true;
      this.emit("closed");
    }
    return !prevented;
  }
}

export function electronMock() {
  return {
    BrowserWindow: FakeBrowserWindow,
    Menu: {
      buildFromTemplate: vi.fn((template: unknown) => ({ template })),
      setApplicationMenu: vi.fn(),
    },
    dialog: {
      showOpenDialog: vi.fn(async () => ({ canceled: true, filePaths: [] })),
      showSaveDialog: vi.fn(async () => ({ canceled: true })),
      showMessageBox: vi.fn(async () => ({ response: 0 })),
      showMessageBoxSync: vi.fn(() => 2),
      showErrorBox: vi.fn(),
    },
    contextBridge: { exposeInMainWorld: vi.fn() },
    ipcRenderer: { invoke: vi.fn(async () => undefined), send: vi.fn(), on: vi.fn(), removeListener: vi.fn() },
  };
}
