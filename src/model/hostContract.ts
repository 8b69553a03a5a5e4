// The narrow contract between the studio (renderer) and whatever hosts it: the Electron
// preload bridge in the desktop app, or the browser adapter. Plain data only, every call async.
// It lives in the core because both main/ and renderer/ must agree on it and neither may import the other.

/** An opaque reference to a file the host opened or saved (a path on the desktop, a name in the browser). */
export interface FileRef {
  /** Display name, e.g. "dairy-coop.islet". */
  name: string;
  /** Host-specific key: an absolute path on the desktop, a browser-local key otherwise. */
  key: string;
}

export type SaveResult =
  /**
   * `unconfirmed`: the host offered the text as a browser download and cannot know it was written (the browser
   * may refuse it); the studio keeps the document marked unsaved, and its recovery copy, until the user confirms.
   */
  | { ok: true; file: FileRef; unconfirmed?: true }
  | { ok: false; cancelled: true }
  | { ok: false; cancelled: false; message: string };

export interface OpenedFile {
  file: FileRef | null;
  text: string;
}

export type MenuCommand = "new" | "open" | "save" | "saveAs" | "openDemo" | "undo" | "redo" | "about" | { openRecent: FileRef };

export interface HostApi {
  readonly kind: "desktop" | "browser";
  /** Ask the user for a project file; null when cancelled. */
  openProject(): Promise<OpenedFile | null>;
  /** Re-open a file from the recent list. */
  openRecent(file: FileRef): Promise<OpenedFile>;
  /** The bundled demo project's text. */
  loadDemo(): Promise<OpenedFile>;
  /** Save text to `file` (or ask where when file is null or saveAs is set). Atomic with a backup on the desktop. */
  saveProject(text: string, file: FileRef | null, saveAs: boolean): Promise<SaveResult>;
  listRecent(): Promise<FileRef[]>;
  /** Tell the host the document's display name and whether it has unsaved changes (title bar, close guard). */
  setDocumentState(state: { name: string; dirty: boolean }): void;
  /** Crash-recovery store: the latest unsaved document text. */
  writeAutosave(text: string): Promise<void>;
  readAutosave(): Promise<{ text: string; savedAt: string } | null>;
  clearAutosave(): Promise<void>;
  /** False when the host has nowhere to keep recovery copies (a browser without IndexedDB): autosave is off. */
  autosaveAvailable?(): Promise<boolean>;
  /** Export a generated file (report, CSV, SVG, PNG) chosen by the user; returns false when cancelled. */
  exportFile(suggestedName: string, data: string | Uint8Array, mime: string): Promise<boolean>;
  /** Desktop only: print the report's HTML to PDF and save it where the user chooses; false when cancelled. */
  exportReportPdf?(suggestedName: string, html: string): Promise<boolean>;
  /** Commands from the native menu (desktop) or nothing (browser). Returns an unsubscribe function. */
  onMenuCommand(handler: (command: MenuCommand) => void): () => void;
}
