// The desktop file store against a real temp folder: project read/save, recent.json in the user
// data folder, the crash-recovery autosave with its timestamp, and the first-start marker.
import { describe, expect, it } from "vitest";
import * as fsp from "node:fs/promises";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { AUTOSAVE_FILE, RECENT_FILE, createFileStore } from "../../../main/fileStore.ts";
import type { AtomicWriteFs } from "../../../main/atomicWrite.ts";
import { useTempDir } from "./tempDir.ts";

const newDir = useTempDir();

function storeIn(dir: string, extra: Partial<Parameters<typeof createFileStore>[0]> = {}) {
  return createFileStore({ userDataDir: join(dir, "userData"), ...extra });
}

describe("project files", () => {
  it("saves with a backup of the previous version and reads the text back", async () => {
    const dir = newDir();
    const store = storeIn(dir);
    const path = join(dir, "site.islet");
    writeFileSync(path, "first");
    expect(await store.saveProject(path, "second")).toEqual({ ok: true });
    expect(await store.readProject(path)).toBe("second");
    expect(readFileSync(`${path}.bak`, "utf8")).toBe("first");
  });

  it("names the file when it cannot be opened", async () => {
    const path = join(newDir(), "gone.islet");
    await expect(storeIn(newDir()).readProject(path)).rejects.toThrow(`Could not open "${path}": the file does not exist`);
  });

  it("reports a failed save without touching the original", async () => {
    const dir = newDir();
    const path = join(dir, "site.islet");
    writeFileSync(path, "keep me");
    const failingRename: AtomicWriteFs = {
      open: (p, f, m) => fsp.open(p, f, m),
      stat: (p) => fsp.stat(p),
      copyFile: (a, b) => fsp.copyFile(a, b),
      rename: async () => {
        throw Object.assign(new Error("no space"), { code: "ENOSPC" });
      },
      unlink: (p) => fsp.unlink(p),
    };
    const outcome = await storeIn(dir, { fs: failingRename }).saveProject(path, "new");
    expect(outcome.ok).toBe(false);
    expect(outcome.ok ? "" : outcome.message).toContain(path);
    expect(readFileSync(path, "utf8")).toBe("keep me");
  });

  it("writes exports without a backup", async () => {
    const dir = newDir();
    const path = join(dir, "report.html");
    writeFileSync(path, "old report");
    expect((await storeIn(dir).writeExport(path, "<html></html>")).ok).toBe(true);
    expect(existsSync(`${path}.bak`)).toBe(false);
  });
});

describe("recent files in userData/recent.json", () => {
  it("persists the list across store instances (app restarts)", async () => {
    const dir = newDir();
    const a = join(dir, "a.islet");
    const b = join(dir, "b.islet");
    writeFileSync(a, "");
    writeFileSync(b, "");
    await storeIn(dir).rememberRecent(a);
    await storeIn(dir).rememberRecent(b);
    expect(await storeIn(dir).listRecent()).toEqual([b, a]);
    expect(existsSync(join(dir, "userData", RECENT_FILE))).toBe(true);
  });

  it("drops files that were deleted since and saves the pruned list", async () => {
    const dir = newDir();
    const a = join(dir, "a.islet");
    const b = join(dir, "b.islet");
    writeFileSync(a, "");
    writeFileSync(b, "");
    const store = storeIn(dir);
    await store.rememberRecent(a);
    await store.rememberRecent(b);
    await fsp.rm(a);
    expect(await store.listRecent()).toEqual([b]);
    expect(JSON.parse(readFileSync(join(dir, "userData", RECENT_FILE), "utf8")).files).toEqual([b]);
  });

  it("caps the persisted list at 10", async () => {
    const dir = newDir();
    const store = storeIn(dir, { exists: () => true });
    for (let i = 0; i < 12; i++) await store.rememberRecent(join(dir, `p${i}.islet`));
    const list = await store.listRecent();
    expect(list).toHaveLength(10); // project brief: max 10
    expect(list[0]).toBe(join(dir, "p11.islet"));
  });

  it("starts with an empty list when recent.json is damaged", async () => {
    const dir = newDir();
    await fsp.mkdir(join(dir, "userData"));
    writeFileSync(join(dir, "userData", RECENT_FILE), "{{{");
    expect(await storeIn(dir).listRecent()).toEqual([]);
  });
});

describe("crash-recovery autosave", () => {
  it("stores the text in userData/autosave.islet with the time it was written", async () => {
    const dir = newDir();
    const store = storeIn(dir);
    const at = new Date("2026-03-04T05:06:07.000Z");
    expect((await store.writeAutosave('{"doc":1}', at)).ok).toBe(true);
    expect(existsSync(join(dir, "userData", AUTOSAVE_FILE))).toBe(true);
    expect(await store.readAutosave()).toEqual({ text: '{"doc":1}', savedAt: "2026-03-04T05:06:07.000Z" });
  });

  it("has nothing to offer before the first autosave and after clearing", async () => {
    const store = storeIn(newDir());
    expect(await store.readAutosave()).toBeNull();
    await store.writeAutosave("x", new Date(0));
    await store.clearAutosave();
    expect(await store.readAutosave()).toBeNull();
    await store.clearAutosave(); // clearing twice is harmless
  });
});

describe("first start", () => {
  it("is reported once per user profile", async () => {
    const dir = newDir();
    expect(await storeIn(dir).consumeFirstStart()).toBe(true);
    expect(await storeIn(dir).consumeFirstStart()).toBe(false);
  });
});
