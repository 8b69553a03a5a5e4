// The main-process side of the HostApi: one IPC channel per call, every argument checked.
// The renderer can only read or write files the user picked in a dialog, opened from the
// recent list or passed on the command line: a file key is never trusted on its own.
import { basename, extname } from "node:path";
import type { FileRef, OpenedFile, SaveResult } from "../src/model/hostContract.ts";
import { CHANNELS } from "./channels.ts";
import { LIMITS } from "./limits.ts";
import { ArgumentError, checkBoolean, checkDocumentState, checkExportData, checkFileRef, checkFileRefOrNull, checkString } from "./argCheck.ts";
import { samePath } from "./recentList.ts";
import type { FileStore } from "./fileStore.ts";
import { APP_ORIGIN } from "./protocol.ts";
import { printReportPdf, type PdfPrinter } from "../src/report/printReportPdf.ts";

export const PROJECT_EXTENSION = ".islet";

/** The sender of an IPC message as far as these checks need it. */
export interface IpcSender {
  senderFrame?: { url: string } | null;
}

/** The subset of Electron's ipcMain used here. */
export interface IpcMainLike {
  handle(channel: string, listener: (event: IpcSender, ...args: unknown[]) => unknown): void;
  on(channel: string, listener: (event: IpcSender, ...args: unknown[]) => void): void;
}

export interface FileDialogs {
  /** Path of a project to open, or null when cancelled. */
  chooseProjectToOpen(): Promise<string | null>;
  /** Where to save a project, or null when cancelled. */
  chooseProjectSavePath(suggestedName: string): Promise<string | null>;
  /** Where to write an export, or null when cancelled. */
  chooseExportPath(suggestedName: string, extension: string): Promise<string | null>;
}

export interface IpcDeps {
  store: FileStore;
  dialogs: FileDialogs;
  demoPath: string;
  caseInsensitivePaths: boolean;
  now(): Date;
  onDocumentState(state: { name: string; dirty: boolean }): void;
  /** Every project save's outcome (the close guard waits for one). */
  onSaveFinished(ok: boolean): void;
  onRecentChanged(paths: string[]): void;
  warn(message: string): void;
  /** Prints report HTML to PDF bytes (the desktop's hidden print window); without it the call is refused. */
  printPdf?: PdfPrinter;
}

export function isAppFrameUrl(url: string | undefined | null): boolean {
  return typeof url === "string" && url.startsWith(`${APP_ORIGIN}/`);
}

export function fileRefFor(path: string): FileRef {
  return { name: basename(path), key: path };
}

/** A suggested export name reduced to a plain file name (no folders, no control characters). */
export function safeFileName(suggested: string, fallback: string): string {
  // eslint-disable-next-line no-control-regex
  const cleaned = suggested.replace(/[\u0000-\u001f<>:"/\\|?*]/g, "_").replace(/^[.\s]+|[.\s]+$/g, "");
  return cleaned.length > 0 ? cleaned : fallback;
}

export function withProjectExtension(path: string): string {
  return extname(path).toLowerCase() === PROJECT_EXTENSION ? path : `${path}${PROJECT_EXTENSION}`;
}

export interface IpcRegistration {
  /** Let the renderer use this path (a file given on the command line or by the OS). */
  allowFile(path: string): void;
}

export function registerIpcHandlers(ipcMain: IpcMainLike, deps: IpcDeps): IpcRegistration {
  const allowed: string[] = [];
  const isAllowed = (path: string) => allowed.some((p) => samePath(p, path, deps.caseInsensitivePaths));
  const allowFile = (path: string) => {
    if (!isAllowed(path)) allowed.push(path);
  };

  function handle(channel: string, call: string, fn: (...args: unknown[]) => Promise<unknown>): void {
    ipcMain.handle(channel, (event, ...args) => {
      if (!isAppFrameUrl(event.senderFrame?.url)) throw new ArgumentError(`${call}: refused, the request did not come from the studio page`);
      return fn(...args);
    });
  }

  async function remember(path: string): Promise<void> {
    allowFile(path);
    deps.onRecentChanged(await deps.store.rememberRecent(path));
  }

  async function open(path: string): Promise<OpenedFile> {
    const text = await deps.store.readProject(path);
    await remember(path);
    return { file: fileRefFor(path), text };
  }

  handle(CHANNELS.openProject, "openProject", async () => {
    const path = await deps.dialogs.chooseProjectToOpen();
    return path === null ? null : open(path);
  });

  handle(CHANNELS.openRecent, "openRecent", async (fileArg) => {
    const file = checkFileRef("openRecent", "file", fileArg);
    const recent = await deps.store.listRecent();
    if (!isAllowed(file.key) && !recent.some((p) => samePath(p, file.key, deps.caseInsensitivePaths))) {
      throw new ArgumentError(`openRecent: "${file.key}" is not in the recent files list (it may have been moved or deleted)`);
    }
    return open(file.key);
  });

  handle(CHANNELS.loadDemo, "loadDemo", async (): Promise<OpenedFile> => {
    try {
      return { file: null, text: await deps.store.readProject(deps.demoPath) };
    } catch (err) {
      throw new Error(`The demo project could not be loaded: ${err instanceof Error ? err.message : String(err)}`, { cause: err });
    }
  });

  handle(CHANNELS.saveProject, "saveProject", async (textArg, fileArg, saveAsArg): Promise<SaveResult> => {
    const text = checkString("saveProject", "text", textArg, LIMITS.projectText_chars);
    const file = checkFileRefOrNull("saveProject", "file", fileArg);
    const saveAs = checkBoolean("saveProject", "saveAs", saveAsArg);
    let target: string;
    if (file && !saveAs && isAllowed(file.key)) {
      target = file.key;
    } else {
      // A file the user never chose here is treated like "Save as": ask, never guess a path.
      const chosen = await deps.dialogs.chooseProjectSavePath(withProjectExtension(safeFileName(file?.name ?? "", "untitled")));
      if (chosen === null) {
        deps.onSaveFinished(false);
        return { ok: false, cancelled: true };
      }
      target = withProjectExtension(chosen);
    }
    const outcome = await deps.store.saveProject(target, text);
    if (!outcome.ok) {
      deps.onSaveFinished(false);
      return { ok: false, cancelled: false, message: outcome.message };
    }
    await remember(target);
    deps.onSaveFinished(true);
    return { ok: true, file: fileRefFor(target) };
  });

  handle(CHANNELS.listRecent, "listRecent", async () => {
    const list = await deps.store.listRecent();
    deps.onRecentChanged(list); // files deleted since leave the menu too
    return list.map(fileRefFor);
  });

  ipcMain.on(CHANNELS.setDocumentState, (event, stateArg) => {
    if (!isAppFrameUrl(event.senderFrame?.url)) return deps.warn("setDocumentState: refused, the message did not come from the studio page");
    try {
      deps.onDocumentState(checkDocumentState("setDocumentState", stateArg));
    } catch (err) {
      deps.warn(err instanceof Error ? err.message : String(err));
    }
  });

  handle(CHANNELS.writeAutosave, "writeAutosave", async (textArg) => {
    const text = checkString("writeAutosave", "text", textArg, LIMITS.projectText_chars);
    const outcome = await deps.store.writeAutosave(text, deps.now());
    if (!outcome.ok) throw new Error(`Crash-recovery copy not written: ${outcome.message}`);
  });

  handle(CHANNELS.readAutosave, "readAutosave", () => deps.store.readAutosave());

  handle(CHANNELS.clearAutosave, "clearAutosave", () => deps.store.clearAutosave());

  handle(CHANNELS.exportFile, "exportFile", async (nameArg, dataArg, mimeArg) => {
    const suggested = safeFileName(checkString("exportFile", "suggestedName", nameArg, LIMITS.name_chars), "export");
    const data = checkExportData("exportFile", "data", dataArg);
    checkString("exportFile", "mime", mimeArg, LIMITS.mime_chars);
    const path = await deps.dialogs.chooseExportPath(suggested, extname(suggested).slice(1));
    if (path === null) return false;
    const outcome = await deps.store.writeExport(path, data);
    if (!outcome.ok) throw new Error(outcome.message);
    return true;
  });

  handle(CHANNELS.exportReportPdf, "exportReportPdf", async (nameArg, htmlArg) => {
    const suggested = withPdfExtension(safeFileName(checkString("exportReportPdf", "suggestedName", nameArg, LIMITS.name_chars), "report.pdf"));
    const html = checkString("exportReportPdf", "html", htmlArg, LIMITS.reportHtml_chars);
    if (!deps.printPdf) throw new Error("exportReportPdf: printing to PDF is not available in this window");
    // print first: a failed print never leaves the user with a half-chosen file
    const pdf = await printReportPdf(html, deps.printPdf);
    const path = await deps.dialogs.chooseExportPath(suggested, "pdf");
    if (path === null) return false;
    const outcome = await deps.store.writeExport(withPdfExtension(path), pdf);
    if (!outcome.ok) throw new Error(outcome.message);
    return true;
  });

  return { allowFile };
}

export function withPdfExtension(path: string): string {
  return extname(path).toLowerCase() === ".pdf" ? path : `${path}.pdf`;
}
