// Atomic save: temp file in the same folder, fsync, .bak of the previous version, rename.
// Source for the method: POSIX rename(2) replaces the target atomically within one file system;
// fsync(2) makes the data durable before the rename exposes it (the project brief's save rules).
import { describe, expect, it } from "vitest";
import * as fsp from "node:fs/promises";
import { existsSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { atomicWriteFile, backupPathFor, describeFsError, type AtomicWriteFs } from "../../../main/atomicWrite.ts";
import { useTempDir } from "./tempDir.ts";

const newDir = useTempDir();

/** The real file system, recording each call, with one call made to fail on request. */
function recordingFs(failOn?: { call: "writeFile" | "sync" | "copyFile" | "rename"; code: string }) {
  const calls: string[] = [];
  const fail = (call: string) => {
    if (failOn && failOn.call === call) throw Object.assign(new Error(`${failOn.code}: simulated`), { code: failOn.code });
  };
  const fs: AtomicWriteFs = {
    async open(path, flags, mode) {
      calls.push(`open ${path} ${flags}`);
      const h = await fsp.open(path, flags, mode);
      return {
        async writeFile(data) {
          calls.push("writeFile");
          fail("writeFile");
          await h.writeFile(data);
        },
        async sync() {
          calls.push("sync");
          fail("sync");
          await h.sync();
        },
        close: () => h.close(),
      };
    },
    stat: (p) => fsp.stat(p),
    async copyFile(a, b) {
      calls.push(`copyFile ${a} ${b}`);
      fail("copyFile");
      await fsp.copyFile(a, b);
    },
    async rename(a, b) {
      calls.push(`rename ${a} ${b}`);
      fail("rename");
      await fsp.rename(a, b);
    },
    async unlink(p) {
      calls.push(`unlink ${p}`);
      await fsp.unlink(p);
    },
  };
  return { fs, calls };
}

describe("atomic project save", () => {
  it("writes a temp file in the same folder, flushes it, then renames it over the target", async () => {
    const dir = newDir();
    const target = join(dir, "dairy-coop.islet");
    const { fs, calls } = recordingFs();
    const outcome = await atomicWriteFile(target, '{"v":1}', { fs, tempSuffix: () => "t1" });
    expect(outcome).toEqual({ ok: true });
    const temp = join(dir, ".dairy-coop.islet.t1.tmp");
    // order required by the brief: temp, fsync, rename
    expect(calls).toEqual([`open ${temp} wx`, "writeFile", "sync", `rename ${temp} ${target}`]);
    expect(readFileSync(target, "utf8")).toBe('{"v":1}');
    expect(readdirSync(dir)).toEqual(["dairy-coop.islet"]); // no temp left, no .bak for a new file
  });

  it("keeps the previous version as <file>.bak", async () => {
    const dir = newDir();
    const target = join(dir, "site.islet");
    writeFileSync(target, "old text");
    const outcome = await atomicWriteFile(target, "new text", { backup: true });
    expect(outcome.ok).toBe(true);
    expect(backupPathFor(target)).toBe(`${target}.bak`);
    expect(readFileSync(`${target}.bak`, "utf8")).toBe("old text");
    expect(readFileSync(target, "utf8")).toBe("new text");
  });

  it("replaces the .bak on the next save, so it always holds the version just before the save", async () => {
    const dir = newDir();
    const target = join(dir, "site.islet");
    writeFileSync(target, "v1");
    await atomicWriteFile(target, "v2", { backup: true });
    await atomicWriteFile(target, "v3", { backup: true });
    expect(readFileSync(`${target}.bak`, "utf8")).toBe("v2");
    expect(readFileSync(target, "utf8")).toBe("v3");
  });

  it("leaves the original intact and names the file when the rename fails", async () => {
    const dir = newDir();
    const target = join(dir, "site.islet");
    writeFileSync(target, "precious");
    const { fs } = recordingFs({ call: "rename", code: "EXDEV" });
    const outcome = await atomicWriteFile(target, "replacement", { backup: true, fs });
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.message).toContain(target);
    expect(outcome.message).toContain("unchanged");
    expect(readFileSync(target, "utf8")).toBe("precious");
    expect(readdirSync(dir).filter((f) => f.endsWith(".tmp"))).toEqual([]);
  });

  it("reports a full disk in plain words and removes the partial temp file", async () => {
    const dir = newDir();
    const target = join(dir, "site.islet");
    writeFileSync(target, "precious");
    const { fs } = recordingFs({ call: "writeFile", code: "ENOSPC" });
    const outcome = await atomicWriteFile(target, "x".repeat(1000), { backup: true, fs });
    expect(outcome).toEqual({ ok: false, message: expect.stringContaining("the disk is full") });
    expect(readFileSync(target, "utf8")).toBe("precious");
    expect(readdirSync(dir)).toEqual(["site.islet"]); // neither temp nor .bak written
  });

  it("does not replace the file when the previous version cannot be kept", async () => {
    const dir = newDir();
    const target = join(dir, "site.islet");
    writeFileSync(target, "precious");
    const { fs, calls } = recordingFs({ call: "copyFile", code: "EACCES" });
    const outcome = await atomicWriteFile(target, "replacement", { backup: true, fs });
    expect(outcome.ok).toBe(false);
    expect(calls.some((c) => c.startsWith("rename"))).toBe(false);
    expect(readFileSync(target, "utf8")).toBe("precious");
  });

  it("says nothing was written when a new file cannot be created", async () => {
    const target = join(newDir(), "missing-folder", "site.islet");
    const outcome = await atomicWriteFile(target, "text");
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.message).toContain("the folder does not exist");
    expect(outcome.message).toContain("Nothing was written");
    expect(existsSync(target)).toBe(false);
  });

  it("writes bytes unchanged", async () => {
    const target = join(newDir(), "drawing.png");
    const bytes = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0, 255]);
    expect((await atomicWriteFile(target, bytes)).ok).toBe(true);
    expect(new Uint8Array(readFileSync(target))).toEqual(bytes);
  });

  it("turns common error codes into reasons a user can act on", () => {
    expect(describeFsError({ code: "EROFS" })).toBe("the file system is read-only");
    expect(describeFsError({ code: "EACCES" })).toBe("permission denied");
    expect(describeFsError(new Error("odd"))).toBe("odd");
  });
});
