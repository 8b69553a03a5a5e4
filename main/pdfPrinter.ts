// Prints the report's HTML to PDF in a hidden, locked-down window: sandboxed, isolated, no Node,
// no JavaScript, its own in-memory session that may load nothing but the report file itself.
// The HTML goes through a temporary file (a data: URL has a length limit a large report can pass).
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import type { PdfPrinter, PdfPrintOptions } from "../src/report/printReportPdf.ts";

/** Options for the hidden print window (a subset of BrowserWindowConstructorOptions). */
export interface PdfWindowOptions {
  show: false;
  webPreferences: {
    sandbox: true;
    contextIsolation: true;
    nodeIntegration: false;
    nodeIntegrationInWorker: false;
    nodeIntegrationInSubFrames: false;
    javascript: false;
    webSecurity: true;
    webviewTag: false;
    spellcheck: false;
    devTools: false;
    partition: string;
  };
}

/** The parts of a BrowserWindow the printer uses. */
export interface PdfWindow {
  loadURL(url: string): Promise<void>;
  destroy(): void;
  webContents: {
    printToPDF(options: PdfPrintOptions): Promise<Uint8Array>;
    session: { webRequest: { onBeforeRequest(listener: (details: { url: string }, callback: (r: { cancel: boolean }) => void) => void): void } };
  };
}

/** In-memory (no "persist:" prefix), so nothing of the report stays on disk in the profile. */
export const PDF_PARTITION = "islet-report-pdf";

export function pdfWindowOptions(): PdfWindowOptions {
  return {
    show: false,
    webPreferences: {
      sandbox: true,
      contextIsolation: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      nodeIntegrationInSubFrames: false,
      javascript: false,
      webSecurity: true,
      webviewTag: false,
      spellcheck: false,
      devTools: false,
      partition: PDF_PARTITION,
    },
  };
}

export interface PdfPrinterDeps {
  newWindow(options: PdfWindowOptions): PdfWindow;
  /** Folder for the temporary HTML file (defaults to the OS temp folder). */
  tempRoot?: string;
}

export function createPdfPrinter(deps: PdfPrinterDeps): PdfPrinter {
  return async (html, options) => {
    const dir = await mkdtemp(join(deps.tempRoot ?? tmpdir(), "islet-report-"));
    const file = join(dir, "report.html");
    const url = pathToFileURL(file).href;
    const win = deps.newWindow(pdfWindowOptions());
    try {
      await writeFile(file, html, "utf8");
      // the report is self-contained: any other request (fonts, images, links) is refused
      win.webContents.session.webRequest.onBeforeRequest((details, callback) => callback({ cancel: details.url !== url && !details.url.startsWith("data:") }));
      await win.loadURL(url);
      return new Uint8Array(await win.webContents.printToPDF(options));
    } finally {
      win.destroy();
      await rm(dir, { recursive: true, force: true });
    }
  };
}
