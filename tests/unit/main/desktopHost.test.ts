// The renderer-side desktop adapter over the preload bridge (contract: src/model/hostContract.ts).
// The wrapper text it strips is the form Electron gives rejected ipcRenderer.invoke calls
// ("Error invoking remote method '<channel>': <error>"), as documented for ipcRenderer.invoke.
import { describe, expect, it, vi } from "vitest";
import type { HostApi, MenuCommand } from "../../../src/model/hostContract.ts";
import { asMenuCommand, desktopHost, plainMessage } from "../../../renderer/host/desktopHost.ts";

function bridge(over: Partial<HostApi> = {}): HostApi {
  return {
    kind: "desktop",
    openProject: vi.fn(async () => null),
    openRecent: vi.fn(async (file) => ({ file, text: "t" })),
    loadDemo: vi.fn(async () => ({ file: null, text: "demo" })),
    saveProject: vi.fn(async () => ({ ok: false as const, cancelled: true as const })),
    listRecent: vi.fn(async () => []),
    setDocumentState: vi.fn(),
    writeAutosave: vi.fn(async () => undefined),
    readAutosave: vi.fn(async () => null),
    clearAutosave: vi.fn(async () => undefined),
    exportFile: vi.fn(async () => true),
    onMenuCommand: vi.fn(() => () => undefined),
    ...over,
  };
}

const remote = (channel: string, message: string) => new Error(`Error invoking remote method '${channel}': Error: ${message}`);

describe("desktop host adapter", () => {
  it("strips the IPC wrapper from error messages", () => {
    expect(plainMessage(remote("islet:open-recent", 'Could not open "/a.islet": the file does not exist'))).toBe('Could not open "/a.islet": the file does not exist');
    expect(plainMessage(new Error("Error invoking remote method 'x': ArgumentError: saveProject: text must be a string (got number)"))).toBe(
      "saveProject: text must be a string (got number)",
    );
    expect(plainMessage("plain")).toBe("plain");
  });

  it("passes calls through to the bridge", async () => {
    const b = bridge();
    const host = desktopHost(b);
    expect(host.kind).toBe("desktop");
    expect(await host.loadDemo()).toEqual({ file: null, text: "demo" });
    host.setDocumentState({ name: "a.islet", dirty: true });
    expect(b.setDocumentState).toHaveBeenCalledWith({ name: "a.islet", dirty: true });
    expect(await host.exportFile("r.csv", "a", "text/csv")).toBe(true);
    expect(b.exportFile).toHaveBeenCalledWith("r.csv", "a", "text/csv");
  });

  it("offers PDF printing only when the bridge does, with plain error messages", async () => {
    expect(desktopHost(bridge()).exportReportPdf).toBeUndefined();
    const print = vi.fn(async () => true);
    const host = desktopHost(bridge({ exportReportPdf: print }));
    expect(await host.exportReportPdf!("r.pdf", "<p>x</p>")).toBe(true);
    expect(print).toHaveBeenCalledWith("r.pdf", "<p>x</p>");
    const failing = desktopHost(bridge({ exportReportPdf: async () => Promise.reject(remote("islet:export-report-pdf", "exportReportPdf: html is too large")) }));
    await expect(failing.exportReportPdf!("r.pdf", "x")).rejects.toThrow(/^exportReportPdf: html is too large$/);
  });

  it("rejects with the plain message when the main process refuses a call", async () => {
    const host = desktopHost(bridge({ openRecent: async () => Promise.reject(remote("islet:open-recent", "openRecent: not listed")) }));
    await expect(host.openRecent({ name: "a", key: "/a" })).rejects.toThrow(/^openRecent: not listed$/);
  });

  it("turns a save that throws into a failed save result, so the studio keeps the work and says why", async () => {
    const host = desktopHost(bridge({ saveProject: async () => Promise.reject(remote("islet:save-project", "saveProject: text is too large")) }));
    expect(await host.saveProject("x", null, false)).toEqual({ ok: false, cancelled: false, message: "saveProject: text is too large" });
  });

  it("forwards only menu commands the contract knows", () => {
    let deliver: (c: MenuCommand) => void = () => undefined;
    const host = desktopHost(bridge({ onMenuCommand: (h) => ((deliver = h), () => undefined) }));
    const seen: MenuCommand[] = [];
    host.onMenuCommand((c) => seen.push(c));
    deliver("save");
    deliver("format-disk" as MenuCommand);
    deliver({ openRecent: { name: "a.islet", key: "/a.islet" } });
    deliver({ openRecent: { name: 1 } } as unknown as MenuCommand);
    expect(seen).toEqual(["save", { openRecent: { name: "a.islet", key: "/a.islet" } }]);
    expect(asMenuCommand(null)).toBeNull();
  });
});
