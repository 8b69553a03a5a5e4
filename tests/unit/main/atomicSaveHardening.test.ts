// The save's failure cases from the hardening report: kill -9 during a save left a broken .bak (it was copied in
// place), interrupted saves left temp files forever, and saving through a symbolic link replaced the link.
// Method: POSIX rename(2) replaces a name atomically within one file system, fsync(2) makes data durable
// before the rename shows it; so every file a reader can see is made by rename from a flushed temp.
import { describe, expect, it } from "vitest";
import * as fsp from "node:fs/promises";
import { existsSync, lstatSync, readFileSync, readdirSync, symlinkSync, utimesSync, writeFileSync } from "node:fs";
import { spawnSync } from "node:child_process";
import { join } from "node:path";
import { atomicWriteFile, backupPathFor, type AtomicWriteFs } from "../../../main/atomicWrite.ts";
import { useTempDir } from "./tempDir.ts";

const newDir = useTempDir();

class Crash extends Error {}

/**
 * The real file system until call number `crashAt`, which "crashes the machine": a copy or write in progress
 * leaves half its data, and that call and every later one (clean-up included) does nothing and throws.
 */
function crashingFs(crashAt: number) {
  let n = 0;
  let dead = false;
  const step = () => {
    if (dead) throw new Crash("after the crash");
    if (n++ === crashAt) {
      dead = true;
      return true;
    }
    return false;
  };
  const fs: AtomicWriteFs = {
    async open(path, flags, mode) {
      if (step()) throw new Crash("open");
      const h = await fsp.open(path, flags, mode);
      return {
        async writeFile(data) {
          if (step()) {
            await h.writeFile(typeof data === "string" ? data.slice(0, data.length / 2) : data.subarray(0, data.length / 2));
            throw new Crash("writeFile");
          }
          await h.writeFile(data);
        },
        async sync() {
          if (step()) throw new Crash("sync");
          await h.sync();
        },
        close: () => h.close(),
      };
    },
    stat: (p) => fsp.stat(p),
    async copyFile(a, b) {
      if (step()) {
        const text = readFileSync(a);
        writeFileSync(b, text.subarray(0, text.length / 2));
        throw new Crash("copyFile");
      }
      await fsp.copyFile(a, b);
    },
    async rename(a, b) {
      if (step()) throw new Crash("rename");
      await fsp.rename(a, b);
    },
    async unlink(p) {
      if (step()) throw new Crash("unlink");
      await fsp.unlink(p);
    },
    async readdir(p) {
      if (step()) throw new Crash("readdir");
      return fsp.readdir(p);
    },
  };
  return { fs, calls: () => n, crashed: () => dead };
}

describe("a crash at any step of a save", () => {
  it("leaves the project and its .bak each complete: old or new, never empty or cut short", async () => {
    const OLDER = "older version ".repeat(500);
    const OLD = "previous version ".repeat(500);
    const NEW = "new version ".repeat(500);
    let steps = 0;
    for (let crashAt = 0; ; crashAt++) {
      const dir = newDir();
      const target = join(dir, "site.islet");
      writeFileSync(target, OLD);
      writeFileSync(backupPathFor(target), OLDER);
      const { fs, crashed } = crashingFs(crashAt);
      await atomicWriteFile(target, NEW, { backup: true, fs }).catch((e: unknown) => {
        if (!(e instanceof Crash)) throw e;
      });
      expect([OLD, NEW]).toContain(readFileSync(target, "utf8"));
      expect([OLDER, OLD]).toContain(readFileSync(backupPathFor(target), "utf8"));
      if (readFileSync(target, "utf8") === NEW) expect(readFileSync(backupPathFor(target), "utf8")).toBe(OLD);
      if (!crashed()) break; // the save ran to its end before the crash point
      steps++;
    }
    expect(steps).toBeGreaterThanOrEqual(7); // temp open, write, sync, backup copy, flush, rename, rename
  });
});

describe("temp files an interrupted save left", () => {
  it("are removed by the next save when their process is gone; others are kept", async () => {
    const dir = newDir();
    const target = join(dir, "site.islet");
    writeFileSync(target, "v1");
    // a process id that was just in use and is now free
    const gone = spawnSync(process.execPath, ["-e", "process.stdout.write(String(process.pid))"]).stdout.toString();
    const orphans = [`.site.islet.${gone}-0123456789ab.tmp`, `.site.islet.bak.${gone}-ba9876543210.tmp`, ".site.islet.00aa11bb22cc.tmp"];
    const kept = [`.site.islet.${process.ppid}-aaaaaaaaaaaa.tmp`, ".site.islet.notes.tmp", ".other.islet.00aa11bb22cc.tmp", ".site.islet.ffeeddccbbaa.tmp"];
    for (const name of [...orphans, ...kept]) writeFileSync(join(dir, name), "partial");
    const hourAgo = new Date(Date.now() - 3600_000);
    for (const name of [".site.islet.00aa11bb22cc.tmp", ".other.islet.00aa11bb22cc.tmp"]) utimesSync(join(dir, name), hourAgo, hourAgo);
    // ".site.islet.ffeeddccbbaa.tmp" (old naming, written just now) may be a save in progress of an older build
    expect(await atomicWriteFile(target, "v2", { backup: true })).toEqual({ ok: true });
    expect(readdirSync(dir).sort()).toEqual(["site.islet", "site.islet.bak", ...kept].sort());
  });
});

describe("saving through a symbolic link", () => {
  it("writes the link's target, keeps the link, and puts the .bak beside the real file", async () => {
    const dir = newDir();
    const real = join(dir, "real.islet");
    const link = join(dir, "link.islet");
    writeFileSync(real, "old");
    symlinkSync(real, link);
    expect(await atomicWriteFile(link, "new", { backup: true })).toEqual({ ok: true });
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
    expect(readFileSync(real, "utf8")).toBe("new");
    expect(readFileSync(backupPathFor(real), "utf8")).toBe("old");
    expect(existsSync(backupPathFor(link))).toBe(false);
  });
});
