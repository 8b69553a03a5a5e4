// Hardening report, item 15: the save dialog confirmed overwriting the name the user typed, but the app then
// wrote that name plus an extension ("plan" -> "plan.islet", "report" -> "report.pdf"), overwriting a file the
// dialog never asked about; safeFileName kept Windows device names and bidirectional controls; an export's
// extension came from the renderer's suggested name while the declared type was checked and ignored.
// Device names: Microsoft, "Naming Files, Paths, and Namespaces" (CON, PRN, AUX, NUL, COM0-9, LPT0-9, also with an
// extension). Bidirectional controls: Unicode UAX #9 (U+202A-U+202E, U+2066-U+2069), and Trojan Source (CVE-2021-42574).
import { describe, expect, it, vi } from "vitest";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { CHANNELS } from "../../../main/channels.ts";
import { createFileStore } from "../../../main/fileStore.ts";
import { registerIpcHandlers, safeFileName, type IpcDeps, type IpcMainLike, type IpcSender } from "../../../main/ipc.ts";
import { APP_ENTRY_URL } from "../../../main/protocol.ts";
import { useTempDir } from "./tempDir.ts";

const newDir = useTempDir();
type Listener = (event: IpcSender, ...args: unknown[]) => unknown;
const FAKE_PDF = new TextEncoder().encode("%PDF-1.7\n%fake\n"); // ISO 32000-1:2008, 7.5.2 header

/** IPC handlers whose save dialogs answer from the lists given, in order (then cancel). */
function setup(saveAnswers: (string | null)[], exportAnswers: (string | null)[]) {
  const dir = newDir();
  const handlers = new Map<string, Listener>();
  const ipcMain: IpcMainLike = { handle: (c, fn) => void handlers.set(c, fn), on: () => undefined };
  const dialogs = {
    chooseProjectToOpen: vi.fn(async () => null),
    chooseProjectSavePath: vi.fn(async (_name: string) => saveAnswers.shift() ?? null),
    chooseExportPath: vi.fn(async (_name: string, _ext: string) => exportAnswers.shift() ?? null),
  };
  const deps: IpcDeps = {
    store: createFileStore({ userDataDir: join(dir, "userData") }),
    dialogs,
    demoPath: join(dir, "demo.islet"),
    caseInsensitivePaths: false,
    now: () => new Date("2026-01-02T03:04:05.000Z"),
    onDocumentState: vi.fn(),
    onSaveFinished: vi.fn(),
    onRecentChanged: vi.fn(),
    warn: vi.fn(),
    printPdf: vi.fn(async () => FAKE_PDF),
  };
  registerIpcHandlers(ipcMain, deps);
  const invoke = async (channel: string, ...args: unknown[]) => handlers.get(channel)!({ senderFrame: { url: APP_ENTRY_URL } }, ...args);
  return { invoke, dialogs };
}

describe("a name typed without its extension", () => {
  it("does not overwrite the existing plan.islet unasked: the dialog asks again on that name", async () => {
    const dir = newDir();
    writeFileSync(join(dir, "plan.islet"), "precious");
    const { invoke, dialogs } = setup([join(dir, "plan"), null], []);
    expect(await invoke(CHANNELS.saveProject, '{"new":1}', null, false)).toEqual({ ok: false, cancelled: true });
    expect(dialogs.chooseProjectSavePath.mock.calls.map((c) => c[0])).toEqual(["untitled.islet", join(dir, "plan.islet")]);
    expect(readFileSync(join(dir, "plan.islet"), "utf8")).toBe("precious");
  });

  it("writes plan.islet once the user confirms that very name", async () => {
    const dir = newDir();
    writeFileSync(join(dir, "plan.islet"), "precious");
    const { invoke } = setup([join(dir, "plan"), join(dir, "plan.islet")], []);
    expect(await invoke(CHANNELS.saveProject, '{"new":1}', null, false)).toMatchObject({ ok: true, file: { name: "plan.islet" } });
    expect(readFileSync(join(dir, "plan.islet"), "utf8")).toBe('{"new":1}');
  });

  it("does not overwrite report.pdf unasked when the user typed report", async () => {
    const dir = newDir();
    writeFileSync(join(dir, "report.pdf"), "other report");
    const { invoke, dialogs } = setup([], [join(dir, "report"), null]);
    expect(await invoke(CHANNELS.exportReportPdf, "site report", "<html></html>")).toBe(false);
    expect(dialogs.chooseExportPath.mock.calls).toEqual([["site report.pdf", "pdf"], [join(dir, "report.pdf"), "pdf"]]);
    expect(readFileSync(join(dir, "report.pdf"), "utf8")).toBe("other report");
  });
});

describe("exports", () => {
  it("take their extension from the declared type, not from the suggested name", async () => {
    const dir = newDir();
    const { invoke, dialogs } = setup([], [join(dir, "plot")]);
    expect(await invoke(CHANNELS.exportFile, "plot.exe", new Uint8Array([0x89, 0x50, 0x4e, 0x47]), "image/png")).toBe(true);
    expect(dialogs.chooseExportPath).toHaveBeenCalledWith("plot.png", "png");
    expect([...readFileSync(join(dir, "plot.png"))]).toEqual([0x89, 0x50, 0x4e, 0x47]);
  });

  it("refuse a type the studio does not export", async () => {
    const { invoke } = setup([], ["/never"]);
    await expect(invoke(CHANNELS.exportFile, "tool.exe", "MZ", "application/x-msdownload")).rejects.toThrow(/exportFile: mime "application\/x-msdownload" is not a type the studio exports/);
  });
});

describe("safeFileName", () => {
  it("keeps no Windows device name, with or without an extension", () => {
    expect(safeFileName("CON", "x")).toBe("_CON");
    expect(safeFileName("nul.txt", "x")).toBe("_nul.txt");
    expect(safeFileName("com1.csv", "x")).toBe("_com1.csv");
    expect(safeFileName("Lpt9", "x")).toBe("_Lpt9");
    expect(safeFileName("console.csv", "x")).toBe("console.csv");
    expect(safeFileName("aux-plot.svg", "x")).toBe("aux-plot.svg");
  });

  it("replaces bidirectional controls and invisible format characters", () => {
    expect(safeFileName("report\u202Efdp.exe", "x")).toBe("report_fdp.exe");
    for (const c of ["\u202A", "\u202B", "\u202C", "\u202D", "\u2066", "\u2067", "\u2068", "\u2069", "\u200E", "\u200F", "\u061C", "\u200B", "\uFEFF", "\u0085", "\u009B"])
      expect(safeFileName(`a${c}b.csv`, "x")).toBe("a_b.csv");
  });
});
