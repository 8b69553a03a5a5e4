// File access for the CLI (the only place in src that touches the disk).
// writeFileAtomic: write a temp file in the same folder, fsync it, keep the previous file as <name>.bak,
// then rename the temp file over the target, so a crash never leaves a half-written project.
import { closeSync, constants, copyFileSync, existsSync, fsyncSync, openSync, readFileSync, renameSync, unlinkSync, writeSync } from "node:fs";
import { basename, dirname, join } from "node:path";

export function writeFileAtomic(path: string, text: string): void {
  const dir = dirname(path);
  const tmp = join(dir, `.${basename(path)}.${process.pid}.${Date.now()}.tmp`);
  const fd = openSync(tmp, constants.O_CREAT | constants.O_EXCL | constants.O_WRONLY, 0o644);
  try {
    writeSync(fd, text, null, "utf8");
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  try {
    if (existsSync(path)) copyFileSync(path, `${path}.bak`);
    renameSync(tmp, path);
  } catch (err) {
    try {
      unlinkSync(tmp);
    } catch {
      // the temp file is already gone; the original error is the one to report
    }
    throw err;
  }
  try {
    // make the rename itself durable where the platform allows syncing a directory
    const dfd = openSync(dir, "r");
    try {
      fsyncSync(dfd);
    } finally {
      closeSync(dfd);
    }
  } catch {
    // Windows cannot open a directory for sync; the data is already on disk
  }
}

export type ReadResult = { ok: true; text: string } | { ok: false; message: string };
export type ReadBytesResult = { ok: true; bytes: Buffer } | { ok: false; message: string };

/** Reads a file's bytes, returning a one-line message instead of throwing. */
export function readFileBytes(path: string): ReadBytesResult {
  try {
    return { ok: true, bytes: readFileSync(path) };
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const reason = code === "ENOENT" ? "no such file" : code === "EISDIR" ? "is a folder, not a file" : code === "EACCES" ? "permission denied" : (err as Error).message;
    return { ok: false, message: `cannot read ${path}: ${reason}` };
  }
}

/** Reads a UTF-8 text file, returning a one-line message instead of throwing. */
export function readTextFile(path: string): ReadResult {
  const r = readFileBytes(path);
  return r.ok ? { ok: true, text: r.bytes.toString("utf8") } : r;
}
