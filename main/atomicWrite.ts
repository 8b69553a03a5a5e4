// Atomic file replacement: write a temp file in the same folder, fsync it, keep the previous
// version as "<file>.bak", then rename the temp over the target. A rename within one folder is
// atomic, so at every moment the target holds either the old or the new complete text. Any
// failure leaves the original untouched and is reported, never thrown.
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

export async function atomicWriteFile(target: string, data: string | Uint8Array, options: AtomicWriteOptions = {}): Promise<WriteOutcome> {
  const fs = options.fs ?? (fsp as unknown as AtomicWriteFs);
  const suffix = options.tempSuffix ?? (() => randomBytes(6).toString("hex"));
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
      await fs.copyFile(target, backupPathFor(target));
    }
    step = "replace the file";
    await fs.rename(temp, target);
  } catch (err) {
    await fs.unlink(temp).catch(() => undefined);
    const kept = previousMode === null ? "Nothing was written." : "The previous version on disk is unchanged.";
    return { ok: false, message: `Could not save "${target}": ${describeFsError(err)} (while trying to ${step}). ${kept}` };
  }
  await syncFolder(dirname(target));
  return { ok: true };
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
