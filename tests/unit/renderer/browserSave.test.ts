// Hardening report, item 10: in the browser studio a download the browser refused still said "Saved", marked the
// document clean and cleared the autosave; two tabs shared one autosave slot; without IndexedDB nothing said
// autosave was off. Where the browser has the File System Access API (WHATWG File System Access: a writable
// stream's close() resolves once the data is written) saves go through it and are confirmed; a download is
// not, and the document stays unsaved until the user confirms. Autosaves are kept per tab.
import { beforeEach, describe, expect, it, vi } from "vitest";
import { browserHost } from "../../../renderer/host/browserHost.ts";
import type { KeyValueStore } from "../../../renderer/host/keyValueStore.ts";
import type { FilePickers, WritableHandle } from "../../../renderer/host/fileAccess.ts";
import type { TabEnvironment } from "../../../renderer/host/tabAutosave.ts";
import type { HostApi } from "../../../src/model/hostContract.ts";
import { setHost } from "../../../renderer/host/currentHost.ts";
import { saveDocument } from "../../../renderer/files/fileCommands.ts";
import { startAutosave } from "../../../renderer/files/autosave.ts";
import { useDocumentStore } from "../../../renderer/store/documentStore.ts";
import { useSessionStore } from "../../../renderer/store/sessionStore.ts";
import { newProject } from "../../../src/model/projectFile.ts";

function memoryStore(persistent = true): KeyValueStore & { data: Map<string, unknown> } {
  const data = new Map<string, unknown>();
  return {
    data,
    get: async <T>(k: string) => data.get(k) as T | undefined,
    set: async (k, v) => void data.set(k, v),
    delete: async (k) => void data.delete(k),
    keys: async (prefix) => [...data.keys()].filter((k) => k.startsWith(prefix)),
    persistent: async () => persistent,
  };
}

/** Tabs sharing one store; `open` lists the tabs alive. */
function tabs(open: Set<string>) {
  return (id: string): TabEnvironment => ({ tabId: () => id, tabGone: async (other) => !open.has(other) });
}

function fakeHandle(name: string, fail?: string) {
  const written: string[] = [];
  const handle: WritableHandle = {
    name,
    async createWritable() {
      let pending = "";
      return {
        write: async (d: string) => void (pending += d),
        close: async () => {
          if (fail) throw new Error(fail);
          written.push(pending);
        },
      };
    },
    getFile: async () => new File([written.at(-1) ?? ""], name),
  };
  return { handle, written };
}

function makeDirty(): number {
  const store = useDocumentStore.getState();
  store.applyChanges([{ type: "replaceDocument", project: newProject("Site") }], { undoable: false });
  useSessionStore.getState().set({ savedRevision: -5, file: null });
  return useDocumentStore.getState().revision;
}

describe("saving by download (no File System Access API)", () => {
  const host = () => {
    const offered: string[] = [];
    const h = browserHost({ store: memoryStore(), pickers: null, askName: () => "plan", download: (n) => void offered.push(n), tabs: tabs(new Set())("t1"), unloadTarget: null });
    return { h, offered };
  };

  it("says the download is unconfirmed", async () => {
    const { h, offered } = host();
    expect(await h.saveProject("{}", null, false)).toEqual({ ok: true, file: { name: "plan.islet", key: "plan.islet" }, unconfirmed: true });
    expect(offered).toEqual(["plan.islet"]);
  });

  describe("in the studio", () => {
    let clear: ReturnType<typeof vi.fn>;
    beforeEach(() => {
      const { h } = host();
      clear = vi.fn(async () => undefined);
      setHost({ ...h, clearAutosave: clear } as HostApi);
    });

    it("keeps the document unsaved and the recovery copy when the user does not confirm", async () => {
      vi.stubGlobal("window", { confirm: vi.fn(() => false) });
      makeDirty();
      expect(await saveDocument()).toBe(false);
      expect(useSessionStore.getState().savedRevision).toBe(-5);
      expect(clear).not.toHaveBeenCalled();
      expect(useSessionStore.getState().notices.at(-1)?.text).toMatch(/^Offered plan\.islet as a download\. .*stays marked unsaved/);
      vi.unstubAllGlobals();
    });

    it("marks it saved and clears the copy once the user confirms", async () => {
      vi.stubGlobal("window", { confirm: vi.fn(() => true) });
      const revision = makeDirty();
      expect(await saveDocument()).toBe(true);
      expect(useSessionStore.getState().savedRevision).toBe(revision);
      expect(clear).toHaveBeenCalledTimes(1);
      vi.unstubAllGlobals();
    });
  });
});

describe("saving through the File System Access API", () => {
  it("writes through the chosen file, reuses it on the next save and reports a confirmed save", async () => {
    const { handle, written } = fakeHandle("plan.islet");
    const pickers: FilePickers = { showSaveFilePicker: vi.fn(async () => handle), showOpenFilePicker: vi.fn(async () => [handle]) };
    const h = browserHost({ store: memoryStore(), pickers, tabs: tabs(new Set())("t1"), unloadTarget: null });
    const first = await h.saveProject('{"v":1}', null, false);
    expect(first).toMatchObject({ ok: true, file: { name: "plan.islet" } });
    expect(first).not.toHaveProperty("unconfirmed");
    if (!first.ok) return;
    const second = await h.saveProject('{"v":2}', first.file, false);
    expect(second).toEqual(first);
    expect(pickers.showSaveFilePicker).toHaveBeenCalledTimes(1);
    expect(written).toEqual(['{"v":1}', '{"v":2}']);
  });

  it("reports a refused write as a failure naming the file, and a closed picker as cancelled", async () => {
    const { handle } = fakeHandle("plan.islet", "QuotaExceededError: no space");
    const h = browserHost({ store: memoryStore(), pickers: { showSaveFilePicker: async () => handle, showOpenFilePicker: async () => [] }, tabs: tabs(new Set())("t1"), unloadTarget: null });
    expect(await h.saveProject("{}", null, false)).toEqual({ ok: false, cancelled: false, message: 'Could not save "plan.islet": QuotaExceededError: no space.' });
    const abort = Object.assign(new Error("closed"), { name: "AbortError" });
    const cancelled = browserHost({ store: memoryStore(), pickers: { showSaveFilePicker: async () => Promise.reject(abort), showOpenFilePicker: async () => [] }, tabs: tabs(new Set())("t1"), unloadTarget: null });
    expect(await cancelled.saveProject("{}", null, true)).toEqual({ ok: false, cancelled: true });
  });
});

describe("the beforeunload guard", () => {
  it("asks before leaving only while there is unsaved work", () => {
    let listener: ((e: BeforeUnloadEvent) => void) | null = null;
    const h = browserHost({ store: memoryStore(), pickers: null, tabs: tabs(new Set())("t1"), unloadTarget: { addEventListener: ((_: string, fn: (e: BeforeUnloadEvent) => void) => (listener = fn)) as Window["addEventListener"] } });
    const event = () => ({ preventDefault: vi.fn(), returnValue: "unset" }) as unknown as BeforeUnloadEvent & { preventDefault: ReturnType<typeof vi.fn> };
    const clean = event();
    listener!(clean);
    expect(clean.preventDefault).not.toHaveBeenCalled();
    h.setDocumentState({ name: "site.islet", dirty: true });
    const dirty = event();
    listener!(dirty);
    expect(dirty.preventDefault).toHaveBeenCalled();
    expect(dirty.returnValue).toBe("");
  });
});

describe("autosave per tab", () => {
  it("never offers a tab the work of another open tab, and brings back each crashed tab's work", async () => {
    const store = memoryStore();
    const open = new Set(["A", "B"]);
    const tab = tabs(open);
    const hostOf = (id: string) => browserHost({ store, pickers: null, tabs: tab(id), unloadTarget: null, now: () => new Date(`2026-01-01T00:00:0${id === "A" ? 1 : 2}Z`) });
    const a = hostOf("A");
    const b = hostOf("B");
    await a.writeAutosave("work of A");
    await b.writeAutosave("work of B");
    expect((await b.readAutosave())?.text).toBe("work of B");
    const c = hostOf("C");
    open.add("C");
    expect(await c.readAutosave()).toBeNull(); // A and B are open: their work is theirs
    // both crash; two fresh tabs each get one of the copies, the newest first
    open.clear();
    open.add("D");
    const d = hostOf("D");
    expect((await d.readAutosave())?.text).toBe("work of B");
    open.add("E");
    expect((await hostOf("E").readAutosave())?.text).toBe("work of A");
    expect(await hostOf("F").readAutosave()).toBeNull();
  });

  it("says autosave is off when the browser gives no IndexedDB, and writes nothing", async () => {
    const store = memoryStore(false);
    const h = browserHost({ store, pickers: null, tabs: tabs(new Set())("t1"), unloadTarget: null });
    expect(await h.autosaveAvailable?.()).toBe(false);
    await h.writeAutosave("x");
    expect(store.data.size).toBe(0);
    const stop = startAutosave(h);
    await new Promise((r) => setTimeout(r, 0));
    expect(useSessionStore.getState().notices.map((n) => n.text)).toContain(
      "Autosave is off: this browser gives the studio no storage (IndexedDB), so unsaved work is not kept for recovery after a crash. Save with Ctrl+S.",
    );
    stop();
  });
});
