// .ci/run's control flow, run by bash with a stand-in `npm` first on PATH (nothing is installed
// or built). Expectations from the project brief: npm ci then npm test, ELECTRON_SKIP_BINARY_DOWNLOAD
// exported, the vitest and e2e summary lines in the output, and the verdict that of npm test.
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { chmodSync, existsSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { useTempDir } from "./tempDir.ts";

const repo = resolve(fileURLToPath(new URL(".", import.meta.url)), "../../..");
const newDir = useTempDir();

// The stand-in prints what npm would announce for each script ("> islet@0.1.0 <script>").
const FAKE_NPM = `#!/usr/bin/env bash
echo "npm $* skip=\${ELECTRON_SKIP_BINARY_DOWNLOAD:-unset}" >> "$FAKE_NPM_LOG"
case "$1" in
  --version) echo 11.0.0 ;;
  ci) echo "added 400 packages" ;;
  test)
    echo "> islet@0.1.0 test"
    echo "> islet@0.1.0 typecheck"
    if [ "$FAKE_NPM_MODE" = "typecheck-fails" ]; then echo "typecheck failed"; exit 1; fi
    echo "> islet@0.1.0 test:unit"
    printf '\\033[2m Test Files \\033[22m \\033[32m3 passed\\033[39m (3)\\n'
    echo "      Tests  40 passed (40)"
    echo "> islet@0.1.0 test:e2e"
    echo "e2e: 5 passed, 0 failed"
    ;;
  run)
    echo "> islet@0.1.0 $2"
    if [ "$2" = "test:unit" ]; then echo " Test Files  3 passed (3)"; echo "      Tests  40 passed (40)"; fi
    if [ "$2" = "test:e2e" ]; then echo "e2e: 5 passed, 0 failed"; fi
    ;;
esac
`;

function runCi(mode: string) {
  const bin = newDir();
  const log = join(bin, "npm.log");
  writeFileSync(join(bin, "npm"), FAKE_NPM);
  chmodSync(join(bin, "npm"), 0o755);
  const r = spawnSync("bash", [join(repo, ".ci", "run")], {
    env: { ...process.env, PATH: `${bin}:${process.env.PATH}`, FAKE_NPM_LOG: log, FAKE_NPM_MODE: mode, CI: "true" },
    encoding: "utf8",
  });
  return { status: r.status, out: r.stdout + r.stderr, calls: existsSync(log) ? readFileSync(log, "utf8").trim().split("\n") : [] };
}

describe.skipIf(!existsSync("/usr/bin/chromium") || process.platform === "win32")(".ci/run", () => {
  it("installs with npm ci, then runs npm test, with the Electron download skipped", () => {
    const { status, calls } = runCi("pass");
    expect(status).toBe(0);
    expect(calls.filter((c) => !c.startsWith("npm --version"))).toEqual(["npm ci skip=1", "npm test skip=1"]);
  });

  it("repeats the vitest and e2e summary lines, without colour codes, at the end", () => {
    const { out } = runCi("pass");
    const summary = out.slice(out.lastIndexOf("Summary"));
    expect(summary).toContain(" Test Files  3 passed (3)");
    expect(summary).toContain("Tests  40 passed (40)");
    expect(summary).toContain("e2e: 5 passed, 0 failed");
    expect(summary).toContain("CI: npm test passed");
  });

  it("when npm test stops early, still runs the unit and e2e stages for the record and fails", () => {
    const { status, out, calls } = runCi("typecheck-fails");
    expect(status).toBe(1);
    expect(calls).toContain("npm run test:unit skip=1");
    expect(calls).toContain("npm run test:e2e skip=1");
    expect(out).toContain("CI: npm test FAILED (exit code 1)");
    expect(out.slice(out.lastIndexOf("Summary"))).toContain("Test Files  3 passed (3)");
  });
});
