// writeFileAtomic: the previous file survives as <name>.bak, no temp file is left behind,
// and the target always holds a complete text.
import { describe, it, expect, beforeEach, afterEach } from "vitest";
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { writeFileAtomic, readTextFile } from "../../../../src/cli/fileIo.ts";

let dir = "";
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), "islet-fileio-"));
});
afterEach(() => {
  rmSync(dir, { recursive: true, force: true });
});

describe("writeFileAtomic", () => {
  it("creates a new file without a backup", () => {
    const path = join(dir, "site.islet");
    writeFileAtomic(path, "first\n");
    expect(readFileSync(path, "utf8")).toBe("first\n");
    expect(readdirSync(dir)).toEqual(["site.islet"]);
  });

  it("keeps the previous version as .bak and leaves no temp file", () => {
    const path = join(dir, "site.islet");
    writeFileSync(path, "old\n");
    writeFileAtomic(path, "new \u00e9\n");
    expect(readFileSync(path, "utf8")).toBe("new \u00e9\n");
    expect(readFileSync(`${path}.bak`, "utf8")).toBe("old\n");
    expect(readdirSync(dir).sort()).toEqual(["site.islet", "site.islet.bak"]);
  });

  it("fails without touching the target when the folder does not exist", () => {
    expect(() => writeFileAtomic(join(dir, "missing", "site.islet"), "x")).toThrow();
    expect(readdirSync(dir)).toEqual([]);
  });
});

describe("readTextFile", () => {
  it("returns a one-line message instead of throwing", () => {
    expect(readTextFile(join(dir, "none.islet"))).toEqual({ ok: false, message: `cannot read ${join(dir, "none.islet")}: no such file` });
    expect(readTextFile(dir)).toEqual({ ok: false, message: `cannot read ${dir}: is a folder, not a file` });
  });
});
