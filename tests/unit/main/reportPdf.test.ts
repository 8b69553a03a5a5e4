// The desktop's report PDF: the exportReportPdf IPC call (arguments checked in main, printed with
// the report's print options, saved where the user chose, false on cancel) and the hidden print
// window (locked down like the studio, JavaScript off, loads only the report file, always closed).
import { describe, expect, it, vi } from "vitest";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { CHANNELS } from "../../../main/channels.ts";
import { LIMITS } from "../../../main/limits.ts";
import { createFileStore } from "../../../main/fileStore.ts";
import { registerIpcHandlers, type IpcDeps, type IpcMainLike, type IpcSender } from "../../../main/ipc.ts";
import { createPdfPrinter, PDF_PARTITION, type PdfWindow, type PdfWindowOptions } from "../../../main/pdfPrinter.ts";
import { APP_ENTRY_URL } from "../../../main/protocol.ts";
import { REPORT_PDF_OPTIONS, type PdfPrinter } from "../../../src/report/printReportPdf.ts";
import { useTempDir } from "./tempDir.ts";

const newDir = useTempDir();
// ISO 32000-1:2008, 7.5.2: a PDF file begins with the header "%PDF-" and the version
const FAKE_PDF = new TextEncoder().encode("%PDF-1.7\n%fake\n");

type Listener = (event: IpcSender, ...args: unknown[]) => unknown;

function setup(savePath: string | null, printPdf: PdfPrinter | null = vi.fn(async () => FAKE_PDF)) {
  const dir = newDir();
  const handlers = new Map<string, Listener>();
  const ipcMain: IpcMainLike = { handle: (c, fn) => void handlers.set(c, fn), on: () => undefined };
  const dialogs = {
    chooseProjectToOpen: vi.fn(async () => null),
    chooseProjectSavePath: vi.fn(async () => null),
    chooseExportPath: vi.fn(async (_name: string, _ext: string) => savePath),
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
    ...(printPdf ? { printPdf } : {}),
  };
  registerIpcHandlers(ipcMain, deps);
  const invoke = async (...args: unknown[]) => handlers.get(CHANNELS.exportReportPdf)!({ senderFrame: { url: APP_ENTRY_URL } }, ...args);
  return { invoke, dialogs, printPdf, handlers };
}

describe("exportReportPdf", () => {
  it("prints with the report's print options and writes the PDF where the user chose", async () => {
    const out = join(newDir(), "plant-report");
    const { invoke, dialogs, printPdf } = setup(out);
    expect(await invoke("../plant-report.pdf", "<html><body>Report</body></html>")).toBe(true);
    expect(printPdf).toHaveBeenCalledWith("<html><body>Report</body></html>", REPORT_PDF_OPTIONS);
    expect(dialogs.chooseExportPath).toHaveBeenCalledWith("_plant-report.pdf", "pdf"); // no folder part survives
    expect(new Uint8Array(readFileSync(`${out}.pdf`))).toEqual(FAKE_PDF); // .pdf added to a bare name
  });

  it("returns false and writes nothing when the user cancels the save dialog", async () => {
    const { invoke } = setup(null);
    expect(await invoke("r.pdf", "<p>x</p>")).toBe(false);
  });

  it("checks its arguments before printing, naming the call and the argument", async () => {
    const { invoke, printPdf, dialogs } = setup("/never");
    await expect(invoke(42, "<p>x</p>")).rejects.toThrow("exportReportPdf: suggestedName must be a string (got number)");
    await expect(invoke("r.pdf", null)).rejects.toThrow("exportReportPdf: html must be a string (got null)");
    await expect(invoke("r.pdf", "x".repeat(LIMITS.reportHtml_chars + 1))).rejects.toThrow(/exportReportPdf: html is too large/);
    expect(printPdf).not.toHaveBeenCalled();
    expect(dialogs.chooseExportPath).not.toHaveBeenCalled();
  });

  it("refuses a printer output that is not a PDF, and a window without a printer", async () => {
    const bad = setup("/never", async () => new TextEncoder().encode("<html>"));
    await expect(bad.invoke("r.pdf", "<p>x</p>")).rejects.toThrow("the PDF printer returned something that is not a PDF");
    expect(bad.dialogs.chooseExportPath).not.toHaveBeenCalled();
    const none = setup("/never", null);
    await expect(none.invoke("r.pdf", "<p>x</p>")).rejects.toThrow("exportReportPdf: printing to PDF is not available in this window");
  });

  it("refuses a call from outside the studio page", async () => {
    const { handlers } = setup("/never");
    await expect(Promise.resolve().then(() => handlers.get(CHANNELS.exportReportPdf)!({ senderFrame: { url: "https://example.org/" } }, "r.pdf", "x"))).rejects.toThrow(/refused/);
  });
});

function fakeWindow() {
  const state = { loaded: null as string | null, html: null as string | null, destroyed: false, filter: null as null | ((d: { url: string }, cb: (r: { cancel: boolean }) => void) => void) };
  const printToPDF = vi.fn(async () => FAKE_PDF);
  const win: PdfWindow = {
    async loadURL(url) {
      state.loaded = url;
      state.html = readFileSync(fileURLToPath(url), "utf8");
    },
    destroy: () => void (state.destroyed = true),
    webContents: { printToPDF, session: { webRequest: { onBeforeRequest: (l) => void (state.filter = l) } } },
  };
  return { win, state, printToPDF };
}

describe("the hidden print window", () => {
  it("is sandboxed, isolated, without Node or JavaScript, in its own session", async () => {
    const { win } = fakeWindow();
    let options: PdfWindowOptions | null = null;
    const printer = createPdfPrinter({ newWindow: (o) => ((options = o), win), tempRoot: newDir() });
    await printer("<p>x</p>", REPORT_PDF_OPTIONS);
    expect(options).toMatchObject({
      show: false,
      webPreferences: { sandbox: true, contextIsolation: true, nodeIntegration: false, javascript: false, webSecurity: true, partition: PDF_PARTITION },
    });
    expect(PDF_PARTITION.startsWith("persist:")).toBe(false);
  });

  it("loads the report from a temporary file, prints it, then closes and removes everything", async () => {
    const { win, state, printToPDF } = fakeWindow();
    const tempRoot = newDir();
    const printer = createPdfPrinter({ newWindow: () => win, tempRoot });
    const bytes = await printer("<h1>Cover</h1>", REPORT_PDF_OPTIONS);
    expect(state.html).toBe("<h1>Cover</h1>");
    expect(printToPDF).toHaveBeenCalledWith(REPORT_PDF_OPTIONS);
    expect(bytes).toEqual(FAKE_PDF);
    expect(state.destroyed).toBe(true);
    expect(readdirSync(tempRoot)).toEqual([]);
    expect(existsSync(fileURLToPath(state.loaded!))).toBe(false);
    // only the report file itself may load
    const verdict = (url: string) => {
      let cancel: boolean | null = null;
      state.filter!({ url }, (r) => (cancel = r.cancel));
      return cancel;
    };
    expect(verdict(state.loaded!)).toBe(false);
    expect(verdict("https://example.org/font.woff")).toBe(true);
    expect(verdict("file:///etc/passwd")).toBe(true);
  });

  it("closes the window and removes the file when printing fails", async () => {
    const { win, state, printToPDF } = fakeWindow();
    printToPDF.mockRejectedValueOnce(new Error("printing failed"));
    const tempRoot = newDir();
    await expect(createPdfPrinter({ newWindow: () => win, tempRoot })("<p>x</p>", REPORT_PDF_OPTIONS)).rejects.toThrow("printing failed");
    expect(state.destroyed).toBe(true);
    expect(readdirSync(tempRoot)).toEqual([]);
  });
});
