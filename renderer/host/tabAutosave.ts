// Crash-recovery copies in the browser, one per tab: two tabs no longer share one slot (tab B was offered tab
// A's work, and after a crash only one came back). Each tab has an id kept in its sessionStorage (a restored
// tab keeps it) and holds a Web Lock named after it while it lives. A tab is offered its own copy, else the
// newest copy of a tab that is gone (its lock is free), never the copy of a tab that is still open.
import type { KeyValueStore } from "./keyValueStore.ts";

export const AUTOSAVE_PREFIX = "autosave:";
const TAB_ID_KEY = "islet-tab-id";
const LOCK_PREFIX = "islet-tab:";

export interface AutosaveRecord {
  text: string;
  savedAt: string;
  /** The document's display name when it was written. */
  document: string;
}

/** What the tab machinery needs from the page, so tests can pass their own. */
export interface TabEnvironment {
  /** This tab's id (kept across reloads and session restore of the same tab). */
  tabId(): string;
  /** Ids of tabs that are open now, or null when the browser cannot tell (no Web Locks). */
  openTabs(): Promise<Set<string> | null>;
}

export function browserTabEnvironment(): TabEnvironment {
  let id: string | null = null;
  const tabId = () => {
    if (id) return id;
    try {
      id = sessionStorage.getItem(TAB_ID_KEY);
      if (!id) sessionStorage.setItem(TAB_ID_KEY, (id = crypto.randomUUID()));
    } catch {
      id = crypto.randomUUID();
    }
    const locks = (navigator as Navigator & { locks?: LockManager }).locks;
    // held until the tab closes or crashes: other tabs then see this tab's copy as recoverable
    void locks?.request(LOCK_PREFIX + id, () => new Promise<never>(() => undefined)).catch(() => undefined);
    return id;
  };
  return {
    tabId,
    async openTabs() {
      const locks = (navigator as Navigator & { locks?: LockManager }).locks;
      if (!locks) return null;
      const state = await locks.query();
      return new Set((state.held ?? []).map((l) => l.name ?? "").filter((n) => n.startsWith(LOCK_PREFIX)).map((n) => n.slice(LOCK_PREFIX.length)));
    },
  };
}

export function tabAutosave(store: KeyValueStore, env: TabEnvironment) {
  env.tabId(); // take the tab's id (and its lock) now, so other tabs see this one open from the start
  const own = () => AUTOSAVE_PREFIX + env.tabId();
  return {
    write: (record: AutosaveRecord) => store.set(own(), record),
    clear: () => store.delete(own()),
    /** This tab's copy, else the newest copy of a tab no longer open; null when there is none to offer. */
    async read(): Promise<{ text: string; savedAt: string } | null> {
      const mine = await store.get<AutosaveRecord>(own());
      if (mine) return { text: mine.text, savedAt: mine.savedAt };
      const open = await env.openTabs();
      let best: { key: string; record: AutosaveRecord } | null = null;
      for (const key of await store.keys(AUTOSAVE_PREFIX)) {
        const tab = key.slice(AUTOSAVE_PREFIX.length);
        // without Web Locks no tab can be told gone: offer nothing rather than another tab's live work
        if (open === null || open.has(tab) || key === own()) continue;
        const record = await store.get<AutosaveRecord>(key);
        if (record && (!best || record.savedAt > best.record.savedAt)) best = { key, record };
      }
      if (!best) return null;
      // this tab adopts the copy, so another tab is not offered it too
      await store.set(own(), best.record);
      await store.delete(best.key);
      return { text: best.record.text, savedAt: best.record.savedAt };
    },
  };
}
