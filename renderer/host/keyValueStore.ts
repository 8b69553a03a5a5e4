// A tiny IndexedDB key-value store for the browser host (autosave, texts of recent files).
// Falls back to memory when IndexedDB is unavailable (private windows, some test browsers).
export interface KeyValueStore {
  get<T>(key: string): Promise<T | undefined>;
  set(key: string, value: unknown): Promise<void>;
  delete(key: string): Promise<void>;
  /** Keys starting with `prefix`. */
  keys(prefix: string): Promise<string[]>;
  /** False when IndexedDB is unavailable and values live in this page's memory only (lost with the tab). */
  persistent(): Promise<boolean>;
}

function request<T>(r: IDBRequest<T>): Promise<T> {
  return new Promise((resolve, reject) => {
    r.onsuccess = () => resolve(r.result);
    r.onerror = () => reject(r.error);
  });
}

export function keyValueStore(dbName = "islet-studio", storeName = "kv"): KeyValueStore {
  const memory = new Map<string, unknown>();
  let dbPromise: Promise<IDBDatabase | null> | null = null;
  const open = () => {
    dbPromise ??= new Promise((resolve) => {
      try {
        const r = indexedDB.open(dbName, 1);
        r.onupgradeneeded = () => r.result.createObjectStore(storeName);
        r.onsuccess = () => resolve(r.result);
        r.onerror = () => resolve(null);
      } catch {
        resolve(null);
      }
    });
    return dbPromise;
  };
  const tx = async (mode: IDBTransactionMode) => {
    const db = await open();
    return db ? db.transaction(storeName, mode).objectStore(storeName) : null;
  };
  return {
    async get<T>(key: string) {
      const s = await tx("readonly");
      return s ? ((await request(s.get(key))) as T | undefined) : (memory.get(key) as T | undefined);
    },
    async set(key, value) {
      const s = await tx("readwrite");
      if (s) await request(s.put(value, key));
      else memory.set(key, value);
    },
    async delete(key) {
      const s = await tx("readwrite");
      if (s) await request(s.delete(key));
      else memory.delete(key);
    },
    async keys(prefix) {
      const s = await tx("readonly");
      const all = s ? ((await request(s.getAllKeys())) as IDBValidKey[]).filter((k): k is string => typeof k === "string") : [...memory.keys()];
      return all.filter((k) => k.startsWith(prefix));
    },
    async persistent() {
      return (await open()) !== null;
    },
  };
}
