// The IPC side of the HostApi: one channel per call, every argument checked in main, files
// limited to those the user chose. Rules from the project brief (narrow typed IPC, size limits)
// and the Electron security checklist (validate the sender of every IPC message).
import { describe, expect, it, vi } from "vitest";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { CHANNELS } from "../../../main/channels.ts";
import { LIMITS } from "../../../main/limits.ts";
import { createFileStore } from "../../../main/fileStore.ts";
import { registerIpcHandlers, safeFileName, withProjectExtension, type FileDialogs, type IpcDeps, type IpcMainLike, type IpcSender } from "../../../main/ipc.ts";
import { APP_ENTRY_URL } from "../../../main/protocol.ts";
import { useTempDir } from "./tempDir.ts";

const newDir = useTempDir();

type Listener = (event: IpcSender, ...args: unknown[]) => unknown;

function fakeIpcMain() {
  const handlers = new Map<string, Listener>();
  const listeners = new Map<string, Listener>();
  const ipcMain: IpcMainLike = {
    handle: (channel, fn) => void handlers.set(channel, fn),
    on: (channel, fn) => void listeners.set(channel, fn),
  };
  const studio: IpcSender = { senderFrame: { url: APP_ENTRY_URL } };
  return {
    ipcMain,
    handlers,
    invoke: async (channel: string, ...args: unknown[]) => handlers.get(channel)!(studio, ...args),
    invokeFrom: async (url: string, channel: string, ...args: unknown[]) => handlers.get(channel)!({ senderFrame: { url } }, ...args),
    send: (channel: string, ...args: unknown[]) => listeners.get(channel)!(studio, ...args),
  };
}

function setup(dialogAnswers: Partial<Record<keyof FileDialogs, string | null>> = {}) {
  const dir = newDir();
  const demoPath = join(dir, "demo.islet");
  writeFileSync(demoPath, '{"format":"islet-project"}');
  const dialogs = {
    chooseProjectToOpen: vi.fn(async () => dialogAnswers.chooseProjectToOpen ?? null),
    chooseProjectSavePath: vi.fn(async (_name: string) => dialogAnswers.chooseProjectSavePath ?? null),
    chooseExportPath: vi.fn(async (_name: string, _ext: string) => dialogAnswers.chooseExportPath ?? null),
  };
  const deps: IpcDeps = {
    store: createFileStore({ userDataDir: join(dir, "userData") }),
    dialogs,
    demoPath,
    caseInsensitivePaths: false,
    now: () => new Date("2026-01-02T03:04:05.000Z"),
    onDocumentState: vi.fn(),
    onSaveFinished: vi.fn(),
    onRecentChanged: vi.fn(),
    warn: vi.fn(),
  };
  const fake = fakeIpcMain();
  const registration = registerIpcHandlers(fake.ipcMain, deps);
  return { dir, deps, dialogs, registration, ...fake };
}

describe("IPC channels", () => {
  it("has one channel per HostApi call and no generic one", () => {
    const { handlers } = setup();
    const expected = [
      CHANNELS.openProject,
      CHANNELS.openRecent,
      CHANNELS.loadDemo,
      CHANNELS.saveProject,
      CHANNELS.listRecent,
      CHANNELS.writeAutosave,
      CHANNELS.readAutosave,
      CHANNELS.clearAutosave,
      CHANNELS.exportFile,
      CHANNELS.exportReportPdf,
    ];
    expect([...handlers.keys()].sort()).toEqual([...expected].sort());
  });

  it("refuses calls that do not come from the studio page", async () => {
    const { invokeFrom } = setup();
    await expect(invokeFrom("https://example.org/", CHANNELS.loadDemo)).rejects.toThrow(/refused/);
    await expect(invokeFrom("file:///tmp/x.html", CHANNELS.listRecent)).rejects.toThrow(/refused/);
  });
});

describe("saveProject arguments", () => {
  it("rejects text that is not a string, naming the call and the argument", async () => {
    const { invoke } = setup();
    await expect(invoke(CHANNELS.saveProject, 42, null, false)).rejects.toThrow("saveProject: text must be a string (got number)");
    await expect(invoke(CHANNELS.saveProject, { text: "x" }, null, false)).rejects.toThrow("saveProject: text must be a string (got object)");
  });

  it("rejects an oversized document", async () => {
    const { invoke, dialogs } = setup({ chooseProjectSavePath: "/never" });
    const huge = "x".repeat(LIMITS.projectText_chars + 1);
    await expect(invoke(CHANNELS.saveProject, huge, null, true)).rejects.toThrow(/saveProject: text is too large/);
    expect(dialogs.chooseProjectSavePath).not.toHaveBeenCalled();
  });

  it("rejects a malformed file reference and a non-boolean saveAs", async () => {
    const { invoke } = setup();
    await expect(invoke(CHANNELS.saveProject, "{}", { name: "a" }, false)).rejects.toThrow("saveProject: file.key must be a string (got undefined)");
    await expect(invoke(CHANNELS.saveProject, "{}", null, "yes")).rejects.toThrow("saveProject: saveAs must be true or false (got string of 3 characters)");
  });
});

describe("saving", () => {
  it("asks where to save a new document, adds .islet, writes it and lists it as recent", async () => {
    const { invoke, dir, deps, dialogs } = setup({ chooseProjectSavePath: join(newDir(), "plant") });
    const target = (dialogs.chooseProjectSavePath as ReturnType<typeof vi.fn>).mock;
    const result = (await invoke(CHANNELS.saveProject, '{"a":1}', null, false)) as { ok: boolean; file: { name: string; key: string } };
    expect(target.calls[0][0]).toBe("untitled.islet");
    expect(result.ok).toBe(true);
    expect(result.file.name).toBe("plant.islet");
    expect(readFileSync(result.file.key, "utf8")).toBe('{"a":1}');
    expect(deps.onSaveFinished).toHaveBeenCalledWith(true);
    expect(deps.onRecentChanged).toHaveBeenLastCalledWith([result.file.key]);
    expect(dir).toBeTruthy();
  });

  it("saves again to the same file without asking once the user chose it", async () => {
    const out = join(newDir(), "site.islet");
    const { invoke, dialogs } = setup({ chooseProjectSavePath: out });
    const first = (await invoke(CHANNELS.saveProject, "v1", null, false)) as { ok: true; file: { name: string; key: string } };
    await invoke(CHANNELS.saveProject, "v2", first.file, false);
    expect(dialogs.chooseProjectSavePath).toHaveBeenCalledTimes(1);
    expect(readFileSync(out, "utf8")).toBe("v2");
    expect(readFileSync(`${out}.bak`, "utf8")).toBe("v1");
  });

  it("never writes to a path the renderer made up: it asks instead", async () => {
    const victim = join(newDir(), "victim.txt");
    writeFileSync(victim, "keep");
    const { invoke, dialogs } = setup({ chooseProjectSavePath: null });
    const result = await invoke(CHANNELS.saveProject, "evil", { name: "victim.txt", key: victim }, false);
    expect(dialogs.chooseProjectSavePath).toHaveBeenCalledWith("victim.txt.islet");
    expect(result).toEqual({ ok: false, cancelled: true });
    expect(readFileSync(victim, "utf8")).toBe("keep");
  });

  it("reports a failed save as a result naming the file, keeping the close guard informed", async () => {
    const target = join(newDir(), "no-such-folder", "site.islet");
    const { invoke, deps } = setup({ chooseProjectSavePath: target });
    const result = (await invoke(CHANNELS.saveProject, "text", null, true)) as { ok: false; cancelled: false; message: string };
    expect(result.ok).toBe(false);
    expect(result.cancelled).toBe(false);
    expect(result.message).toContain(target);
    expect(deps.onSaveFinished).toHaveBeenCalledWith(false);
  });
});

describe("opening", () => {
  it("opens the file chosen in the dialog and lets it be reopened from the recent list", async () => {
    const path = join(newDir(), "site.islet");
    writeFileSync(path, "project text");
    const { invoke, deps } = setup({ chooseProjectToOpen: path });
    expect(await invoke(CHANNELS.openProject)).toEqual({ file: { name: "site.islet", key: path }, text: "project text" });
    expect(await invoke(CHANNELS.listRecent)).toEqual([{ name: "site.islet", key: path }]);
    expect(deps.onRecentChanged).toHaveBeenLastCalledWith([path]);
    expect(await invoke(CHANNELS.openRecent, { name: "site.islet", key: path })).toEqual({ file: { name: "site.islet", key: path }, text: "project text" });
  });

  it("returns null when the open dialog is cancelled", async () => {
    const { invoke } = setup({ chooseProjectToOpen: null });
    expect(await invoke(CHANNELS.openProject)).toBeNull();
  });

  it("refuses to read a file that is neither recent nor chosen by the user", async () => {
    const secret = join(newDir(), "secret.txt");
    writeFileSync(secret, "secret");
    const { invoke } = setup();
    await expect(invoke(CHANNELS.openRecent, { name: "secret.txt", key: secret })).rejects.toThrow(/not in the recent files list/);
  });

  it("opens a file passed on the command line once main allows it", async () => {
    const path = join(newDir(), "cli.islet");
    writeFileSync(path, "from the command line");
    const { invoke, registration } = setup();
    registration.allowFile(path);
    expect(await invoke(CHANNELS.openRecent, { name: "cli.islet", key: path })).toEqual({ file: { name: "cli.islet", key: path }, text: "from the command line" });
  });

  it("loads the demo as an unnamed document, so saving it asks where", async () => {
    const { invoke } = setup();
    expect(await invoke(CHANNELS.loadDemo)).toEqual({ file: null, text: '{"format":"islet-project"}' });
  });
});

describe("document state, autosave, export", () => {
  it("passes a valid document state on and ignores a malformed one with a warning", () => {
    const { send, deps } = setup();
    send(CHANNELS.setDocumentState, { name: "site.islet", dirty: true });
    expect(deps.onDocumentState).toHaveBeenCalledWith({ name: "site.islet", dirty: true });
    send(CHANNELS.setDocumentState, { name: 5, dirty: true });
    expect(deps.onDocumentState).toHaveBeenCalledTimes(1);
    expect(deps.warn).toHaveBeenCalledWith(expect.stringContaining("setDocumentState: state.name must be a string"));
  });

  it("round-trips the autosave with main's clock and rejects non-string text", async () => {
    const { invoke } = setup();
    await invoke(CHANNELS.writeAutosave, "draft");
    expect(await invoke(CHANNELS.readAutosave)).toEqual({ text: "draft", savedAt: "2026-01-02T03:04:05.000Z" });
    await invoke(CHANNELS.clearAutosave);
    expect(await invoke(CHANNELS.readAutosave)).toBeNull();
    await expect(invoke(CHANNELS.writeAutosave, null)).rejects.toThrow("writeAutosave: text must be a string (got null)");
  });

  it("exports text and bytes where the user chose, and returns false when cancelled", async () => {
    const out = join(newDir(), "report.csv");
    const { invoke, dialogs } = setup({ chooseExportPath: out });
    expect(await invoke(CHANNELS.exportFile, "../../report.csv", "a,b\n1,2\n", "text/csv")).toBe(true);
    expect(dialogs.chooseExportPath).toHaveBeenCalledWith("_.._report.csv", "csv"); // no folder part survives;
    expect(readFileSync(out, "utf8")).toBe("a,b\n1,2\n");
    const cancelled = setup({ chooseExportPath: null });
    expect(await cancelled.invoke(CHANNELS.exportFile, "x.png", new Uint8Array([1, 2]), "image/png")).toBe(false);
  });

  it("rejects export data that is neither text nor bytes, and an oversized byte array", async () => {
    const { invoke } = setup({ chooseExportPath: "/never" });
    await expect(invoke(CHANNELS.exportFile, "x.bin", [1, 2, 3], "application/octet-stream")).rejects.toThrow("exportFile: data must be a string or a Uint8Array (got array)");
    const big = new Uint8Array(LIMITS.export_bytes + 1);
    await expect(invoke(CHANNELS.exportFile, "x.bin", big, "application/octet-stream")).rejects.toThrow(/exportFile: data is too large/);
    await expect(invoke(CHANNELS.exportFile, "x.bin", "x", 12)).rejects.toThrow("exportFile: mime must be a string (got number)");
  });
});

describe("file names", () => {
  it("adds the project extension only when missing", () => {
    expect(withProjectExtension("/a/site")).toBe("/a/site.islet");
    expect(withProjectExtension("/a/site.ISLET")).toBe("/a/site.ISLET");
  });

  it("reduces a suggested name to a plain file name", () => {
    expect(safeFileName("a/b\\c:d*.csv", "x")).toBe("a_b_c_d_.csv");
    expect(safeFileName("...", "fallback")).toBe("fallback");
  });
});
