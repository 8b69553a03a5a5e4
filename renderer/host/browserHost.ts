// HostApi for a plain browser: a file picker to open, a download to save, recent names with their
// last text kept in IndexedDB (so "reopen" works without disk access), autosave to IndexedDB,
// and the demo fetched from the build.
import type { FileRef, HostApi, OpenedFile, SaveResult } from "../../src/model/hostContract.ts";
import { keyValueStore, type KeyValueStore } from "./keyValueStore.ts";

const RECENT_KEY = "recent";
const AUTOSAVE_KEY = "autosave";
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
  /** Asks for a file name on "Save as"; null when the user cancels. */
  askName?: (suggested: string) => string | null;
  now?: () => Date;
}

export function browserHost(options: BrowserHostOptions = {}): HostApi {
  const store = options.store ?? keyValueStore();
  const askName = options.askName ?? ((suggested: string) => window.prompt("Save the project as", suggested));
  const now = options.now ?? (() => new Date());

  async function remember(file: FileRef, text: string): Promise<void> {
    const list = (await store.get<FileRef[]>(RECENT_KEY)) ?? [];
    const next = [file, ...list.filter((f) => f.key !== file.key)].slice(0, MAX_RECENT);
    await store.set(RECENT_KEY, next);
    await store.set(`file:${file.key}`, text);
  }

  return {
    kind: "browser",
    async openProject(): Promise<OpenedFile | null> {
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
      let target = file;
      if (saveAs || !target) {
        const name = askName(file?.name ?? "project.islet");
        if (name === null || name.trim() === "") return { ok: false, cancelled: true };
        target = { name: withExtension(name), key: withExtension(name) };
      }
      try {
        download(target.name, text, "application/json");
        await remember(target, text);
        return { ok: true, file: target };
      } catch (err) {
        return { ok: false, cancelled: false, message: `Could not save "${target.name}": ${err instanceof Error ? err.message : String(err)}` };
      }
    },
    async listRecent(): Promise<FileRef[]> {
      return (await store.get<FileRef[]>(RECENT_KEY)) ?? [];
    },
    setDocumentState({ name, dirty }) {
      document.title = `${dirty ? "• " : ""}${name} – Islet`;
    },
    async writeAutosave(text: string): Promise<void> {
      await store.set(AUTOSAVE_KEY, { text, savedAt: now().toISOString() });
    },
    async readAutosave() {
      return (await store.get<{ text: string; savedAt: string }>(AUTOSAVE_KEY)) ?? null;
    },
    async clearAutosave() {
      await store.delete(AUTOSAVE_KEY);
    },
    async exportFile(suggestedName: string, data: string | Uint8Array, mime: string): Promise<boolean> {
      download(suggestedName, data, mime);
      return true;
    },
    onMenuCommand() {
      return () => {};
    },
  };
}
