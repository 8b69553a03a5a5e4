// HostApi for the desktop app: wraps the preload bridge (window.isletHost) so the studio sees
// plain error messages (Electron prefixes a rejected call with "Error invoking remote method
// '<channel>': Error: "), a save that throws becomes a failed SaveResult (the work stays open),
// and only menu commands the contract knows reach the studio.
import type { FileRef, HostApi, MenuCommand, SaveResult } from "../../src/model/hostContract.ts";

const REMOTE_PREFIX = /^Error invoking remote method '[^']*':\s*(?:[A-Za-z]*Error:\s*)?/;

/** The message a person should read, without the IPC wrapper text. */
export function plainMessage(err: unknown): string {
  const raw = err instanceof Error ? err.message : String(err);
  return raw.replace(REMOTE_PREFIX, "");
}

const SIMPLE_COMMANDS: ReadonlySet<string> = new Set(["new", "open", "save", "saveAs", "openDemo", "undo", "redo", "about"]);

/** A menu command as the contract defines it, or null for anything else. */
export function asMenuCommand(value: unknown): MenuCommand | null {
  if (typeof value === "string") return SIMPLE_COMMANDS.has(value) ? (value as MenuCommand) : null;
  if (typeof value === "object" && value !== null && "openRecent" in value) {
    const file = (value as { openRecent: unknown }).openRecent as Partial<FileRef> | null;
    if (file && typeof file.name === "string" && typeof file.key === "string") return { openRecent: { name: file.name, key: file.key } };
  }
  return null;
}

async function plain<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    throw new Error(plainMessage(err), { cause: err });
  }
}

export function desktopHost(bridge: HostApi): HostApi {
  return {
    kind: "desktop",
    openProject: () => plain(() => bridge.openProject()),
    openRecent: (file) => plain(() => bridge.openRecent(file)),
    loadDemo: () => plain(() => bridge.loadDemo()),
    async saveProject(text, file, saveAs): Promise<SaveResult> {
      try {
        return await bridge.saveProject(text, file, saveAs);
      } catch (err) {
        return { ok: false, cancelled: false, message: plainMessage(err) };
      }
    },
    listRecent: () => plain(() => bridge.listRecent()),
    setDocumentState: (state) => bridge.setDocumentState(state),
    writeAutosave: (text) => plain(() => bridge.writeAutosave(text)),
    readAutosave: () => plain(() => bridge.readAutosave()),
    clearAutosave: () => plain(() => bridge.clearAutosave()),
    exportFile: (name, data, mime) => plain(() => bridge.exportFile(name, data, mime)),
    // only when the bridge offers it, so the studio can tell whether PDF printing exists
    ...(bridge.exportReportPdf ? { exportReportPdf: (name: string, html: string) => plain(() => bridge.exportReportPdf!(name, html)) } : {}),
    onMenuCommand(handler) {
      return bridge.onMenuCommand((raw) => {
        const command = asMenuCommand(raw);
        if (command) handler(command);
      });
    },
  };
}
