// Everything the desktop app keeps on disk: project files (atomic save with a .bak), exports,
// the recent-files list (userData/recent.json) and the crash-recovery autosave
// (userData/autosave.islet, its modification time being the moment it was written).
// Plain Node: no Electron here, so it is tested against a temp folder.
import * as fsp from "node:fs/promises";
import { existsSync } from "node:fs";
import { join } from "node:path";
import { atomicWriteFile, describeFsError, removeLeftOverTemps, type AtomicWriteFs, type WriteOutcome } from "./atomicWrite.ts";
import { addRecent, dropMissing, parseRecent, serializeRecent } from "./recentList.ts";
import { LIMITS } from "./limits.ts";

export const RECENT_FILE = "recent.json";
export const AUTOSAVE_FILE = "autosave.islet";
export const FIRST_START_FILE = "first-start-done";

export interface FileStoreOptions {
  userDataDir: string;
  /** Compare paths case-insensitively (Windows, macOS). */
  caseInsensitivePaths?: boolean;
  /** Override file-system calls for tests of failures. */
  fs?: AtomicWriteFs;
  exists?: (path: string) => boolean;
  /** Where to report problems that must not interrupt the user (recent list could not be written). */
  warn?: (message: string) => void;
}

export interface FileStore {
  /** Reads a project file as UTF-8 text; throws an Error naming the file when it cannot. */
  readProject(path: string): Promise<string>;
  /** Atomic save with a .bak of the previous version. */
  saveProject(path: string, text: string): Promise<WriteOutcome>;
  /** Atomic write without a backup, for reports and drawings. */
  writeExport(path: string, data: string | Uint8Array): Promise<WriteOutcome>;
  /** The recent list with missing files dropped (and the pruned list persisted). */
  listRecent(): Promise<string[]>;
  /** Put a file at the top of the recent list; returns the new list. */
  rememberRecent(path: string): Promise<string[]>;
  writeAutosave(text: string, now: Date): Promise<WriteOutcome>;
  readAutosave(): Promise<{ text: string; savedAt: string } | null>;
  clearAutosave(): Promise<void>;
  /** True exactly once per user profile: the first time the app starts (it then opens the demo). */
  consumeFirstStart(): Promise<boolean>;
}

export function createFileStore(options: FileStoreOptions): FileStore {
  const { userDataDir } = options;
  const caseInsensitive = options.caseInsensitivePaths ?? false;
  const exists = options.exists ?? existsSync;
  const warn = options.warn ?? (() => undefined);
  const recentPath = join(userDataDir, RECENT_FILE);
  const autosavePath = join(userDataDir, AUTOSAVE_FILE);

  async function readRecentRaw(): Promise<string[]> {
    try {
      return parseRecent(await fsp.readFile(recentPath, "utf8"), caseInsensitive);
    } catch {
      return []; // first start, or unreadable: an empty list is the safe answer
    }
  }

  async function writeRecent(list: string[]): Promise<void> {
    await fsp.mkdir(userDataDir, { recursive: true }).catch(() => undefined);
    const outcome = await atomicWriteFile(recentPath, serializeRecent(list), { fs: options.fs });
    if (!outcome.ok) warn(`Recent files list not saved: ${outcome.message}`);
  }

  return {
    async readProject(path) {
      let size_bytes: number;
      try {
        size_bytes = (await fsp.stat(path)).size;
      } catch (err) {
        throw new Error(`Could not open "${path}": ${describeFsError(err).replace("the folder does not exist", "the file does not exist")}`, { cause: err });
      }
      if (size_bytes > LIMITS.projectFile_bytes) {
        throw new Error(`Could not open "${path}": the file is ${size_bytes} bytes, more than the ${LIMITS.projectFile_bytes}-byte limit for a project`);
      }
      try {
        const text = await fsp.readFile(path, "utf8");
        // temp files an interrupted save of this project left beside it (the next save also removes them)
        void removeLeftOverTemps(path).catch(() => undefined);
        return text;
      } catch (err) {
        throw new Error(`Could not open "${path}": ${describeFsError(err)}`, { cause: err });
      }
    },

    saveProject(path, text) {
      return atomicWriteFile(path, text, { backup: true, fs: options.fs });
    },

    writeExport(path, data) {
      return atomicWriteFile(path, data, { fs: options.fs });
    },

    async listRecent() {
      const stored = await readRecentRaw();
      const present = dropMissing(stored, exists);
      if (present.length !== stored.length) await writeRecent(present);
      return present;
    },

    async rememberRecent(path) {
      const list = addRecent(dropMissing(await readRecentRaw(), exists), path, caseInsensitive);
      await writeRecent(list);
      return list;
    },

    async writeAutosave(text, now) {
      await fsp.mkdir(userDataDir, { recursive: true }).catch(() => undefined);
      const outcome = await atomicWriteFile(autosavePath, text, { fs: options.fs });
      if (outcome.ok) await fsp.utimes(autosavePath, now, now).catch(() => undefined);
      return outcome;
    },

    async readAutosave() {
      try {
        const [text, st] = await Promise.all([fsp.readFile(autosavePath, "utf8"), fsp.stat(autosavePath)]);
        return { text, savedAt: st.mtime.toISOString() };
      } catch {
        return null;
      }
    },

    async clearAutosave() {
      await fsp.rm(autosavePath, { force: true });
    },

    async consumeFirstStart() {
      const marker = join(userDataDir, FIRST_START_FILE);
      if (exists(marker)) return false;
      try {
        await fsp.mkdir(userDataDir, { recursive: true });
        await fsp.writeFile(marker, "", { flag: "wx" });
        return true;
      } catch {
        return false; // another instance got there first, or the profile is read-only
      }
    },
  };
}
