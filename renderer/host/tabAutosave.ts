// Crash-recovery copies in the browser, one per tab: two tabs no longer share one slot (tab B was offered tab
// A's work, and after a crash only one came back). Each tab has an id kept in its sessionStorage (a restored
// tab keeps it) and holds a Web Lock named after it while it lives. A tab is offered its own copy, else the
// newest copy of a tab that is gone (its lock can be taken), never the copy of a tab that is still open.
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
  /** True when tab `id` is gone (closed or crashed), false while it is open, null when the browser cannot tell. */
  tabGone(id: string): Promise<boolean | null>;
}

/** A tab just closed frees its lock a moment later: wait this long for it before taking the tab as open. */
const RELEASE_WAIT_MS = 2000;

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
    async tabGone(other) {
      const locks = (navigator as Navigator & { locks?: LockManager }).locks;
      if (!locks) return null;
      // taking the tab's lock (and giving it back at once) succeeds only when no open tab holds it
      return locks.request(LOCK_PREFIX + other, { signal: AbortSignal.timeout(RELEASE_WAIT_MS) }, () => true).catch(() => false);
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
      const copies: { key: string; record: AutosaveRecord }[] = [];
      for (const key of await store.keys(AUTOSAVE_PREFIX)) {
        const record = key === own() ? undefined : await store.get<AutosaveRecord>(key);
        if (record) copies.push({ key, record });
      }
      copies.sort((a, b) => (a.record.savedAt < b.record.savedAt ? 1 : a.record.savedAt > b.record.savedAt ? -1 : 0));
      // newest first; without Web Locks no tab can be told gone: offer nothing rather than another tab's live work
      const gone = await Promise.all(copies.map((c) => env.tabGone(c.key.slice(AUTOSAVE_PREFIX.length))));
      const best = copies.find((_, k) => gone[k] === true) ?? null;
      if (!best) return null;
      // this tab adopts the copy, so another tab is not offered it too
      await store.set(own(), best.record);
      await store.delete(best.key);
      return { text: best.record.text, savedAt: best.record.savedAt };
    },
  };
}
