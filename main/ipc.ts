// The main-process side of the HostApi: one IPC channel per call, every argument checked.
// The renderer can only read or write files the user picked in a dialog, opened from the
// recent list or passed on the command line: a file key is never trusted on its own.
import { existsSync } from "node:fs";
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
  /** Whether a file exists (default: node:fs existsSync); decides when a name with an added extension needs asking. */
  pathExists?(path: string): boolean;
}

export function isAppFrameUrl(url: string | undefined | null): boolean {
  return typeof url === "string" && url.startsWith(`${APP_ORIGIN}/`);
}

export function fileRefFor(path: string): FileRef {
  return { name: basename(path), key: path };
}

/** Names Windows reserves for devices, with or without an extension ("NUL", "con.txt"): such a file cannot be made. */
const RESERVED_DEVICE_NAME = /^(con|prn|aux|nul|com[0-9¹²³]|lpt[0-9¹²³])(\.|$)/i;
/**
 * Characters no file name gets: path and wildcard characters, C0 and C1 controls, and the invisible format
 * characters (bidirectional embeddings, overrides and isolates, marks, zero-width characters, BOM) that can
 * make "report‮fdp.exe" read as another name.
 */
// eslint-disable-next-line no-control-regex
const UNSAFE_CHARS = /[\u0000-\u001f\u007f-\u009f<>:"/\\|?*\u061c\u180e\u200b-\u200f\u202a-\u202e\u2060-\u2064\u2066-\u206f\ufeff\ufff9-\ufffb]/g;

/** A suggested export name reduced to a plain file name (no folders, no control or format characters, no device name). */
export function safeFileName(suggested: string, fallback: string): string {
  const cleaned = suggested.replace(UNSAFE_CHARS, "_").replace(/^[.\s]+|[.\s]+$/g, "");
  if (cleaned.length === 0) return fallback;
  return RESERVED_DEVICE_NAME.test(cleaned) ? `_${cleaned}` : cleaned;
}

/** The extension each export type gets, whatever the suggested name says. */
export const EXPORT_EXTENSIONS: Readonly<Record<string, string>> = {
  "text/csv": "csv",
  "text/html": "html",
  "text/plain": "txt",
  "application/json": "json",
  "application/pdf": "pdf",
  "image/svg+xml": "svg",
  "image/png": "png",
};

/** `name` with its extension (if any) replaced by `ext`. */
export function withExtension(name: string, ext: string): string {
  const current = extname(name);
  return `${current ? name.slice(0, -current.length) : name}.${ext}`;
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

  const pathExists = deps.pathExists ?? existsSync;

  /**
   * The path to write for a name the user chose in a save dialog, `ext` added when missing. The dialog confirmed
   * overwriting only the name as typed: when the name with the extension is another existing file, the dialog is
   * shown again on that name (and confirms it), so no file is overwritten unasked. Null when the user cancels.
   */
  async function confirmedWithExtension(chosen: string | null, ext: string, askAgain: (path: string) => Promise<string | null>): Promise<string | null> {
    for (let k = 0; chosen !== null && k < 5; k++) {
      if (extname(chosen).toLowerCase() === `.${ext}`) return chosen;
      const withExt = `${chosen}.${ext}`;
      if (!pathExists(withExt)) return withExt;
      chosen = await askAgain(withExt);
    }
    return null;
  }

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
      const ask = (name: string) => deps.dialogs.chooseProjectSavePath(name);
      const chosen = await confirmedWithExtension(await ask(withProjectExtension(safeFileName(file?.name ?? "", "untitled"))), PROJECT_EXTENSION.slice(1), ask);
      if (chosen === null) {
        deps.onSaveFinished(false);
        return { ok: false, cancelled: true };
      }
      target = chosen;
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
    const name = safeFileName(checkString("exportFile", "suggestedName", nameArg, LIMITS.name_chars), "export");
    const data = checkExportData("exportFile", "data", dataArg);
    const mime = checkString("exportFile", "mime", mimeArg, LIMITS.mime_chars);
    // the declared type decides the extension; a suggested "plot.exe" for an image/png is written as plot.png
    const ext = Object.hasOwn(EXPORT_EXTENSIONS, mime) ? EXPORT_EXTENSIONS[mime] : null;
    if (ext === null) throw new ArgumentError(`exportFile: mime "${mime.slice(0, 60)}" is not a type the studio exports (${Object.keys(EXPORT_EXTENSIONS).join(", ")})`);
    const ask = (suggested: string) => deps.dialogs.chooseExportPath(suggested, ext);
    const path = await confirmedWithExtension(await ask(withExtension(name, ext)), ext, ask);
    if (path === null) return false;
    const outcome = await deps.store.writeExport(path, data);
    if (!outcome.ok) throw new Error(outcome.message);
    return true;
  });

  handle(CHANNELS.exportReportPdf, "exportReportPdf", async (nameArg, htmlArg) => {
    const suggested = withExtension(safeFileName(checkString("exportReportPdf", "suggestedName", nameArg, LIMITS.name_chars), "report.pdf"), "pdf");
    const html = checkString("exportReportPdf", "html", htmlArg, LIMITS.reportHtml_chars);
    if (!deps.printPdf) throw new Error("exportReportPdf: printing to PDF is not available in this window");
    // print first: a failed print never leaves the user with a half-chosen file
    const pdf = await printReportPdf(html, deps.printPdf);
    const ask = (name: string) => deps.dialogs.chooseExportPath(name, "pdf");
    const path = await confirmedWithExtension(await ask(suggested), "pdf", ask);
    if (path === null) return false;
    const outcome = await deps.store.writeExport(path, pdf);
    if (!outcome.ok) throw new Error(outcome.message);
    return true;
  });

  return { allowFile };
}
