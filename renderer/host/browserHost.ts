// HostApi for a plain browser. Saving goes through the File System Access API where the browser has it
// (the write is confirmed); elsewhere it is a download, which the page cannot see finish, so the result says
// it is unconfirmed. Recent names with their last text are kept in IndexedDB (so "reopen" works without disk
// access), crash-recovery copies per tab (tabAutosave.ts); a beforeunload guard protects unsaved work.
import type { FileRef, HostApi, OpenedFile, SaveResult } from "../../src/model/hostContract.ts";
import { keyValueStore, type KeyValueStore } from "./keyValueStore.ts";
import { filePickers, pickOpenHandle, pickSaveHandle, writeThroughHandle, type FilePickers, type WritableHandle } from "./fileAccess.ts";
import { browserTabEnvironment, tabAutosave, type TabEnvironment } from "./tabAutosave.ts";

const RECENT_KEY = "recent";
const MAX_RECENT = 8;
export const DEMO_URL = "dairy-coop.islet";

function pickFile(accept: string): Promise<File | null> {
  return new Promise((resolve) => {
    const input = document.createElement("input");
    input.type = "file";
    input.accept = accept;
    input.style.display = "none";
    input.addEventListener("change", () => {
      resolve(input.files?.[0] ?? null);
      input.remove();
    });
    input.addEventListener("cancel", () => {
      resolve(null);
      input.remove();
    });
    document.body.appendChild(input);
    input.click();
  });
}

function download(name: string, data: string | Uint8Array, mime: string): void {
  const part: BlobPart = typeof data === "string" ? data : new Uint8Array(data);
  const url = URL.createObjectURL(new Blob([part], { type: mime }));
  const a = document.createElement("a");
  a.href = url;
  a.download = name;
  a.style.display = "none";
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

function withExtension(name: string): string {
  const trimmed = name.trim();
  return /\.islet$/i.test(trimmed) ? trimmed : `${trimmed}.islet`;
}

export interface BrowserHostOptions {
  store?: KeyValueStore;
  /** Asks for a file name on "Save as" (download saves); null when the user cancels. */
  askName?: (suggested: string) => string | null;
  now?: () => Date;
  /** The File System Access pickers; default the window's, when it has them. Null: downloads only. */
  pickers?: FilePickers | null;
  tabs?: TabEnvironment;
  /** Offers the text as a download (default: a link with the download attribute). */
  download?: (name: string, data: string | Uint8Array, mime: string) => void;
  /** Where the beforeunload guard is installed (default: window). */
  unloadTarget?: Pick<Window, "addEventListener"> | null;
}

export function browserHost(options: BrowserHostOptions = {}): HostApi {
  const store = options.store ?? keyValueStore();
  const askName = options.askName ?? ((suggested: string) => window.prompt("Save the project as", suggested));
  const now = options.now ?? (() => new Date());
  const pickers = options.pickers !== undefined ? options.pickers : filePickers(typeof window === "undefined" ? null : window);
  const offer = options.download ?? download;
  const autosave = tabAutosave(store, options.tabs ?? browserTabEnvironment());
  /** File handles by FileRef key (this page's session; also kept in IndexedDB for the recent list). */
  const handles = new Map<string, WritableHandle>();
  let dirty = false;
  let documentName = "";
  const unloadTarget = options.unloadTarget !== undefined ? options.unloadTarget : typeof window === "undefined" ? null : window;
  unloadTarget?.addEventListener("beforeunload", (event: BeforeUnloadEvent) => {
    if (!dirty) return;
    event.preventDefault();
    event.returnValue = ""; // older browsers show their prompt only with a return value
  });

  async function remember(file: FileRef, text: string, handle?: WritableHandle): Promise<void> {
    const list = (await store.get<FileRef[]>(RECENT_KEY)) ?? [];
    const next = [file, ...list.filter((f) => f.key !== file.key)].slice(0, MAX_RECENT);
    await store.set(RECENT_KEY, next);
    await store.set(`file:${file.key}`, text);
    if (handle) {
      handles.set(file.key, handle);
      await store.set(`handle:${file.key}`, handle).catch(() => undefined); // not every store can keep a handle
    }
  }

  async function handleFor(file: FileRef): Promise<WritableHandle | null> {
    return handles.get(file.key) ?? (await store.get<WritableHandle>(`handle:${file.key}`).catch(() => undefined)) ?? null;
  }

  const newKey = (name: string) => `fsa:${name}:${crypto.randomUUID()}`;

  return {
    kind: "browser",
    async openProject(): Promise<OpenedFile | null> {
      if (pickers) {
        const handle = await pickOpenHandle(pickers);
        if (!handle) return null;
        const text = await (await handle.getFile()).text();
        const file = { name: handle.name, key: newKey(handle.name) };
        await remember(file, text, handle);
        return { file, text };
      }
      const picked = await pickFile(".islet,.json,application/json");
      if (!picked) return null;
      const text = await picked.text();
      const file = { name: picked.name, key: picked.name };
      await remember(file, text);
      return { file, text };
    },
    async openRecent(file: FileRef): Promise<OpenedFile> {
      const text = await store.get<string>(`file:${file.key}`);
      if (text === undefined) throw new Error(`The browser no longer holds "${file.name}"; open it from disk instead.`);
      return { file, text };
    },
    async loadDemo(): Promise<OpenedFile> {
      const res = await fetch(DEMO_URL);
      if (!res.ok) throw new Error(`The demo project could not be loaded (HTTP ${res.status}).`);
      return { file: null, text: await res.text() };
    },
    async saveProject(text: string, file: FileRef | null, saveAs: boolean): Promise<SaveResult> {
      if (pickers) {
        let target = file && !saveAs ? { file, handle: await handleFor(file) } : null;
        if (!target?.handle) {
          const handle = await pickSaveHandle(pickers, withExtension(file?.name ?? "project.islet"));
          if (!handle) return { ok: false, cancelled: true };
          target = { file: { name: handle.name, key: newKey(handle.name) }, handle };
        }
        try {
          await writeThroughHandle(target.handle!, text);
        } catch (err) {
          return { ok: false, cancelled: false, message: `Could not save "${target.file.name}": ${err instanceof Error ? err.message : String(err)}.` };
        }
        await remember(target.file, text, target.handle!);
        return { ok: true, file: target.file };
      }
      let target = file;
      if (saveAs || !target) {
        const name = askName(file?.name ?? "project.islet");
        if (name === null || name.trim() === "") return { ok: false, cancelled: true };
        target = { name: withExtension(name), key: withExtension(name) };
      }
      try {
        offer(target.name, text, "application/json");
        await remember(target, text);
        return { ok: true, file: target, unconfirmed: true };
      } catch (err) {
        return { ok: false, cancelled: false, message: `Could not save "${target.name}": ${err instanceof Error ? err.message : String(err)}` };
      }
    },
    async listRecent(): Promise<FileRef[]> {
      return (await store.get<FileRef[]>(RECENT_KEY)) ?? [];
    },
    setDocumentState(state) {
      dirty = state.dirty;
      documentName = state.name;
      if (typeof document !== "undefined") document.title = `${dirty ? "• " : ""}${state.name} – Islet`;
    },
    async writeAutosave(text: string): Promise<void> {
      if (!(await store.persistent())) return; // autosave is off (said once at start, see autosaveAvailable)
      await autosave.write({ text, savedAt: now().toISOString(), document: documentName });
    },
    readAutosave: () => autosave.read(),
    clearAutosave: () => autosave.clear(),
    autosaveAvailable: () => store.persistent(),
    async exportFile(suggestedName: string, data: string | Uint8Array, mime: string): Promise<boolean> {
      offer(suggestedName, data, mime);
      return true;
    },
    onMenuCommand() {
      return () => {};
    },
  };
}
