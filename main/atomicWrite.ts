// Atomic file replacement: write a temp file in the same folder, fsync it, keep the previous
// version as "<file>.bak", then rename the temp over the target. A rename within one folder is
// atomic, so at every moment the target holds either the old or the new complete text. The .bak is
// made the same way (copy to a temp, fsync, rename), so it too is always complete. A symbolic link
// is written through to its target. Temp files an interrupted save left behind are removed on the
// next save. Any failure leaves the original untouched and is reported, never thrown.
import * as fsp from "node:fs/promises";
import { basename, dirname, join } from "node:path";
import { randomBytes } from "node:crypto";

/** The file-system calls used, so a test can make any one of them fail. */
export interface AtomicWriteFs {
  open(path: string, flags: string, mode?: number): Promise<{ writeFile(data: string | Uint8Array): Promise<void>; sync(): Promise<void>; close(): Promise<void> }>;
  stat(path: string): Promise<{ mode: number }>;
  copyFile(src: string, dest: string): Promise<void>;
  rename(oldPath: string, newPath: string): Promise<void>;
  unlink(path: string): Promise<void>;
  /** Optional (default node:fs/promises): resolving symbolic links, listing a folder for left-over temp files. */
  realpath?(path: string): Promise<string>;
  readdir?(path: string): Promise<string[]>;
}

export type WriteOutcome = { ok: true } | { ok: false; message: string };

export interface AtomicWriteOptions {
  /** Keep the previous version as "<file>.bak" (project saves do; exports and autosave do not). */
  backup?: boolean;
  fs?: AtomicWriteFs;
  /** Suffix that makes the temp name unique; random by default. */
  tempSuffix?: () => string;
}

export function backupPathFor(target: string): string {
  return `${target}.bak`;
}

function hasCode(err: unknown): err is { code: string } {
  return typeof err === "object" && err !== null && typeof (err as { code?: unknown }).code === "string";
}

/** A short reason a user can act on. */
export function describeFsError(err: unknown): string {
  const code = hasCode(err) ? err.code : "";
  switch (code) {
    case "ENOSPC":
      return "the disk is full";
    case "EDQUOT":
      return "the disk quota is exhausted";
    case "EACCES":
    case "EPERM":
      return "permission denied";
    case "EROFS":
      return "the file system is read-only";
    case "ENOENT":
      return "the folder does not exist";
    case "EISDIR":
      return "a folder has that name";
    case "EBUSY":
      return "the file is in use by another program";
    default:
      return err instanceof Error ? err.message : String(err);
  }
}

/** Temp names carry the writing process's id, so a later save can tell a left-over from a save in progress. */
const defaultSuffix = () => `${process.pid}-${randomBytes(6).toString("hex")}`;

/** The file a save should replace: the target of a symbolic link (followed to the end), else the path itself. */
async function resolveTarget(path: string, fs: AtomicWriteFs): Promise<string> {
  try {
    return await (fs.realpath ?? fsp.realpath)(path);
  } catch {
    return path; // a new file (or a dangling link's name: then the link is replaced, as before)
  }
}

export async function atomicWriteFile(requested: string, data: string | Uint8Array, options: AtomicWriteOptions = {}): Promise<WriteOutcome> {
  const fs = options.fs ?? (fsp as unknown as AtomicWriteFs);
  const suffix = options.tempSuffix ?? defaultSuffix;
  const target = await resolveTarget(requested, fs);
  const temp = join(dirname(target), `.${basename(target)}.${suffix()}.tmp`);

  let previousMode: number | null;
  try {
    previousMode = (await fs.stat(target)).mode & 0o777;
  } catch {
    previousMode = null; // a new file
  }

  let step = "write the temporary file";
  try {
    const handle = await fs.open(temp, "wx", previousMode ?? 0o644);
    try {
      await handle.writeFile(data);
      step = "flush the temporary file to disk";
      await handle.sync();
    } finally {
      await handle.close();
    }
    if (options.backup && previousMode !== null) {
      step = `keep the previous version as ${basename(backupPathFor(target))}`;
      await writeBackup(target, fs, suffix());
    }
    step = "replace the file";
    await fs.rename(temp, target);
  } catch (err) {
    await fs.unlink(temp).catch(() => undefined);
    const kept = previousMode === null ? "Nothing was written." : "The previous version on disk is unchanged.";
    const shown = target === requested ? `"${target}"` : `"${requested}" (a link to "${target}")`;
    return { ok: false, message: `Could not save ${shown}: ${describeFsError(err)} (while trying to ${step}). ${kept}` };
  }
  await syncFolder(dirname(target));
  await removeLeftOverTemps(target, fs);
  return { ok: true };
}

/** The .bak as an atomic replacement too: copy the current file to a temp, flush it, rename it over the .bak. */
async function writeBackup(target: string, fs: AtomicWriteFs, suffix: string): Promise<void> {
  const bak = backupPathFor(target);
  const temp = join(dirname(bak), `.${basename(bak)}.${suffix}.tmp`);
  try {
    await fs.copyFile(target, temp);
    const handle = await fs.open(temp, "r+");
    try {
      await handle.sync();
    } finally {
      await handle.close();
    }
    await fs.rename(temp, bak);
  } catch (err) {
    await fs.unlink(temp).catch(() => undefined);
    throw err;
  }
}

/** Older builds named temps with 12 hex digits and no process id: those are left-overs once this old. */
const UNOWNED_TEMP_AGE_MS = 10 * 60 * 1000;

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return hasCode(err) && err.code === "EPERM"; // exists, owned by someone else
  }
}

/**
 * Removes temp files of `target` (and of its .bak) that an interrupted save left: those whose writing process is
 * gone, and unowned ones older than ten minutes. Only names this module makes are touched; failures are ignored.
 */
export async function removeLeftOverTemps(target: string, fs: AtomicWriteFs = fsp as unknown as AtomicWriteFs): Promise<string[]> {
  const folder = dirname(target);
  const base = basename(target).replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const pattern = new RegExp(`^\\.${base}(?:\\.bak)?\\.(?:(\\d+)-[0-9a-f]{12}|([0-9a-f]{12}))\\.tmp$`);
  const removed: string[] = [];
  let names: string[];
  try {
    names = await (fs.readdir ?? fsp.readdir)(folder);
  } catch {
    return removed;
  }
  for (const name of names) {
    const m = pattern.exec(name);
    if (!m) continue;
    const path = join(folder, name);
    let stale: boolean;
    if (m[1] !== undefined) stale = Number(m[1]) !== process.pid && !processAlive(Number(m[1]));
    else stale = await fsp.stat(path).then((st) => Date.now() - st.mtimeMs > UNOWNED_TEMP_AGE_MS, () => false);
    if (stale && (await fs.unlink(path).then(() => true, () => false))) removed.push(path);
  }
  return removed;
}

/** Make the rename itself durable. Not possible on every platform, so failures are ignored. */
async function syncFolder(folder: string): Promise<void> {
  try {
    const handle = await fsp.open(folder, "r");
    try {
      await handle.sync();
    } finally {
      await handle.close();
    }
  } catch {
    // Windows cannot open folders; the data itself was already flushed.
  }
}
