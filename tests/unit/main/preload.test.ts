// The preload bridge exposes exactly the HostApi (src/model/hostContract.ts) as
// window.isletHost, each call on its own channel (project brief: narrow typed IPC).
import { describe, expect, it, vi } from "vitest";

vi.mock("electron", async () => (await import("./electronMock.ts")).electronMock());

import { contextBridge, ipcRenderer } from "electron";
import type { HostApi, MenuCommand } from "../../../src/model/hostContract.ts";
import { CHANNELS } from "../../../main/channels.ts";
import { createHostBridge, type BridgeIpc } from "../../../main/preload.ts";

// Compile-time: this record must name every HostApi member and nothing else, except autosaveAvailable, which only
// the browser host has (the desktop always keeps its recovery copy on disk).
const HOST_API_MEMBERS: Record<Exclude<keyof HostApi, "autosaveAvailable">, true> = {
  kind: true,
  openProject: true,
  openRecent: true,
  loadDemo: true,
  saveProject: true,
  listRecent: true,
  setDocumentState: true,
  writeAutosave: true,
  readAutosave: true,
  clearAutosave: true,
  exportFile: true,
  exportReportPdf: true,
  onMenuCommand: true,
};

function fakeIpc() {
  let menuListener: ((event: never, ...args: unknown[]) => void) | null = null;
  const ipc = {
    invoke: vi.fn(async (..._args: unknown[]) => "answer"),
    send: vi.fn(),
    on: vi.fn((_channel: string, listener: (event: never, ...args: unknown[]) => void) => {
      menuListener = listener;
    }),
  };
  return { ipc: ipc as unknown as BridgeIpc & typeof ipc, emitMenu: (c: MenuCommand) => menuListener!(undefined as never, c) };
}

describe("preload bridge", () => {
  it("is exposed to the page as window.isletHost with exactly the HostApi members", () => {
    const expose = contextBridge.exposeInMainWorld as unknown as ReturnType<typeof vi.fn>;
    expect(expose).toHaveBeenCalledTimes(1);
    const [name, api] = expose.mock.calls[0];
    expect(name).toBe("isletHost");
    expect(Object.keys(api).sort()).toEqual(Object.keys(HOST_API_MEMBERS).sort());
    expect(api.kind).toBe("desktop");
    expect(ipcRenderer.on).toHaveBeenCalledWith(CHANNELS.menuCommand, expect.any(Function));
  });

  it("sends each call on its own channel with its arguments", async () => {
    const { ipc } = fakeIpc();
    const host = createHostBridge(ipc);
    const file = { name: "a.islet", key: "/a.islet" };
    const bytes = new Uint8Array([1]);
    await host.openProject();
    await host.openRecent(file);
    await host.loadDemo();
    await host.saveProject("text", file, true);
    await host.listRecent();
    await host.writeAutosave("draft");
    await host.readAutosave();
    await host.clearAutosave();
    await host.exportFile("r.png", bytes, "image/png");
    await host.exportReportPdf!("r.pdf", "<html></html>");
    expect(ipc.invoke.mock.calls).toEqual([
      [CHANNELS.openProject],
      [CHANNELS.openRecent, file],
      [CHANNELS.loadDemo],
      [CHANNELS.saveProject, "text", file, true],
      [CHANNELS.listRecent],
      [CHANNELS.writeAutosave, "draft"],
      [CHANNELS.readAutosave],
      [CHANNELS.clearAutosave],
      [CHANNELS.exportFile, "r.png", bytes, "image/png"],
      [CHANNELS.exportReportPdf, "r.pdf", "<html></html>"],
    ]);
    host.setDocumentState({ name: "a.islet", dirty: true });
    expect(ipc.send).toHaveBeenCalledWith(CHANNELS.setDocumentState, { name: "a.islet", dirty: true });
  });

  it("uses distinct channel names for distinct calls", () => {
    const names = Object.values(CHANNELS);
    expect(new Set(names).size).toBe(names.length);
  });

  it("delivers menu commands to subscribers until they unsubscribe", () => {
    const { ipc, emitMenu } = fakeIpc();
    const host = createHostBridge(ipc);
    const seen: MenuCommand[] = [];
    const stop = host.onMenuCommand((c) => seen.push(c));
    emitMenu("save");
    stop();
    emitMenu("undo");
    expect(seen).toEqual(["save"]);
  });

  it("keeps a command that arrives before the studio subscribes (the launch command) and delivers it", async () => {
    const { ipc, emitMenu } = fakeIpc();
    const host = createHostBridge(ipc);
    emitMenu("openDemo");
    const seen: MenuCommand[] = [];
    host.onMenuCommand((c) => seen.push(c));
    await Promise.resolve();
    expect(seen).toEqual(["openDemo"]);
    const later: MenuCommand[] = [];
    host.onMenuCommand((c) => later.push(c));
    await Promise.resolve();
    expect(later).toEqual([]); // delivered once, not replayed
  });
});
