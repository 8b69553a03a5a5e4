// A fresh temp folder per test, removed afterwards.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach } from "vitest";

export function useTempDir(): () => string {
  let dirs: string[] = [];
  afterEach(() => {
    for (const d of dirs) rmSync(d, { recursive: true, force: true });
    dirs = [];
  });
  return () => {
    const d = mkdtempSync(join(tmpdir(), "islet-main-test-"));
    dirs.push(d);
    return d;
  };
}
