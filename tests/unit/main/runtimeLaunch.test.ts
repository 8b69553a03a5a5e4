// `npm start` and the desktop runtime: the decision (runtimeLaunch.mjs) with the download mocked, and the real
// fetch step (start.mjs) running a stand-in for Electron's install script in a temporary package.
import { describe, expect, it } from "vitest";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { useTempDir } from "./tempDir.ts";

const repo = resolve(fileURLToPath(new URL(".", import.meta.url)), "../../..");
const newDir = useTempDir();

interface Failure {
  at_ms: number;
  reason: string;
}
type Outcome = { ok: true } | { ok: false; reason: string; interrupted?: boolean };
type Launch = { mode: "desktop"; binary: string; fetched: boolean } | { mode: "browser" } | { mode: "stop"; code: number };
interface LaunchModule {
  FETCH_FLAG: string;
  RETRY_AFTER_MS: number;
  decideRuntime(s: { present: boolean; forceFetch: boolean; skipDownloadEnv: boolean; lastFailure: Failure | null; now_ms: number }): { action: string; why?: string };
  chooseLaunch(d: {
    args: string[];
    env: Record<string, string | undefined>;
    version: string;
    findRuntime: () => string | null;
    fetchRuntime: (o: { ignoreSkipEnv: boolean }) => Promise<Outcome>;
    readFailure: () => Failure | null;
    writeFailure: (f: Failure) => void;
    clearFailure: () => void;
    now: () => number;
    log: (line: string) => void;
  }): Promise<Launch>;
  appArgs(args: string[]): string[];
}
interface StartModule {
  fetchRuntime(o: { ignoreSkipEnv: boolean }, root: string): Promise<Outcome>;
  readFailure(root: string): Failure | null;
  writeFailure(f: Failure, root: string): void;
  clearFailure(root: string): void;
  failureRecordPath(root: string): string;
}

const load = async <T>(name: string) => (await import(pathToFileURL(join(repo, "main", "scripts", name)).href)) as T;

const HOUR_MS = 3_600_000;
const T0 = Date.UTC(2026, 11, 4, 12, 0, 0);

/** A machine as chooseLaunch sees it, with the download mocked and every effect recorded. */
function machine(o: { runtime?: boolean; fetch?: Outcome | "installs"; failure?: Failure | null; env?: Record<string, string>; args?: string[]; now?: number }) {
  let installed = o.runtime === true;
  let record: Failure | null = o.failure ?? null;
  const lines: string[] = [];
  const fetches: { ignoreSkipEnv: boolean }[] = [];
  const deps = {
    args: o.args ?? [],
    env: o.env ?? {},
    version: "41.7.2",
    findRuntime: () => (installed ? "/fake/electron" : null),
    fetchRuntime: async (opts: { ignoreSkipEnv: boolean }): Promise<Outcome> => {
      fetches.push(opts);
      if (o.fetch === "installs") {
        installed = true;
        return { ok: true };
      }
      return o.fetch ?? { ok: false, reason: "fetch failed: no route to host" };
    },
    readFailure: () => record,
    writeFailure: (f: Failure) => void (record = f),
    clearFailure: () => void (record = null),
    now: () => o.now ?? T0,
    log: (line: string) => void lines.push(line),
  };
  return { deps, lines, fetches, record: () => record };
}

describe("npm start: the desktop runtime decision (download mocked)", () => {
  it("opens the desktop app when the runtime is present, without fetching or printing", async () => {
    const { chooseLaunch } = await load<LaunchModule>("runtimeLaunch.mjs");
    const m = machine({ runtime: true, failure: { at_ms: T0 - HOUR_MS, reason: "old" } });
    expect(await chooseLaunch(m.deps)).toEqual({ mode: "desktop", binary: "/fake/electron", fetched: false });
    expect(m.fetches).toHaveLength(0);
    expect(m.lines).toEqual([]);
  });

  it("fetches a missing runtime once, then opens the desktop app and forgets an older failure", async () => {
    const { chooseLaunch } = await load<LaunchModule>("runtimeLaunch.mjs");
    const m = machine({ fetch: "installs", failure: { at_ms: T0 - 25 * HOUR_MS, reason: "offline yesterday" } });
    expect(await chooseLaunch(m.deps)).toEqual({ mode: "desktop", binary: "/fake/electron", fetched: true });
    expect(m.fetches).toEqual([{ ignoreSkipEnv: false }]);
    expect(m.lines).toHaveLength(1);
    expect(m.lines[0]).toContain("Electron 41.7.2");
    expect(m.record()).toBeNull();
  });

  it("on a failed fetch says so in one line, records when and why, and serves the browser studio", async () => {
    const { chooseLaunch } = await load<LaunchModule>("runtimeLaunch.mjs");
    const m = machine({ fetch: { ok: false, reason: "fetch failed: getaddrinfo ENOTFOUND" } });
    expect(await chooseLaunch(m.deps)).toEqual({ mode: "browser" });
    expect(m.fetches).toHaveLength(1);
    const failed = m.lines.at(-1)!;
    expect(failed).not.toContain("\n");
    expect(failed).toContain("could not fetch the desktop runtime (fetch failed: getaddrinfo ENOTFOUND)");
    expect(failed).toContain("browser");
    expect(failed).toContain("npm start -- --fetch-runtime");
    expect(m.record()).toEqual({ at_ms: T0, reason: "fetch failed: getaddrinfo ENOTFOUND" });
  });

  it("treats an install script that succeeds without leaving a runtime as a failure", async () => {
    const { chooseLaunch } = await load<LaunchModule>("runtimeLaunch.mjs");
    const m = machine({ fetch: { ok: true } });
    expect(await chooseLaunch(m.deps)).toEqual({ mode: "browser" });
    expect(m.record()?.reason).toMatch(/no runtime/);
  });

  it("does not try again within a day of a failure, and says when it failed and how to force a try", async () => {
    const { chooseLaunch, RETRY_AFTER_MS } = await load<LaunchModule>("runtimeLaunch.mjs");
    expect(RETRY_AFTER_MS).toBe(24 * HOUR_MS);
    const m = machine({ failure: { at_ms: T0 - 3 * HOUR_MS, reason: "proxy refused" }, fetch: "installs" });
    expect(await chooseLaunch(m.deps)).toEqual({ mode: "browser" });
    expect(m.fetches).toHaveLength(0);
    expect(m.lines).toHaveLength(1);
    expect(m.lines[0]).not.toContain("\n");
    expect(m.lines[0]).toContain("3 h ago failed (proxy refused)");
    expect(m.lines[0]).toContain("--fetch-runtime");
  });

  it("tries again once the day is over, and at once with --fetch-runtime", async () => {
    const { chooseLaunch, appArgs } = await load<LaunchModule>("runtimeLaunch.mjs");
    const late = machine({ failure: { at_ms: T0 - 24 * HOUR_MS, reason: "x" }, fetch: "installs" });
    expect((await chooseLaunch(late.deps)).mode).toBe("desktop");
    const forced = machine({ failure: { at_ms: T0 - 60_000, reason: "x" }, fetch: "installs", args: ["--fetch-runtime", "site.islet"] });
    expect((await chooseLaunch(forced.deps)).mode).toBe("desktop");
    expect(forced.fetches).toEqual([{ ignoreSkipEnv: true }]);
    // the flag is the launch script's own, not the app's
    expect(appArgs(["--fetch-runtime", "site.islet"])).toEqual(["site.islet"]);
  });

  it("does not hold off a try for a failure recorded in the future (a clock set back)", async () => {
    const { decideRuntime } = await load<LaunchModule>("runtimeLaunch.mjs");
    expect(decideRuntime({ present: false, forceFetch: false, skipDownloadEnv: false, lastFailure: { at_ms: T0 + HOUR_MS, reason: "x" }, now_ms: T0 })).toEqual({ action: "fetch" });
  });

  it("fetches nothing where ELECTRON_SKIP_BINARY_DOWNLOAD is set, unless asked", async () => {
    const { chooseLaunch } = await load<LaunchModule>("runtimeLaunch.mjs");
    const m = machine({ env: { ELECTRON_SKIP_BINARY_DOWNLOAD: "1" }, fetch: "installs" });
    expect(await chooseLaunch(m.deps)).toEqual({ mode: "browser" });
    expect(m.fetches).toHaveLength(0);
    expect(m.lines[0]).toContain("ELECTRON_SKIP_BINARY_DOWNLOAD is set");
  });

  it("stops (exit 130) without recording a failure when the fetch is interrupted", async () => {
    const { chooseLaunch } = await load<LaunchModule>("runtimeLaunch.mjs");
    const m = machine({ fetch: { ok: false, reason: "interrupted", interrupted: true } });
    expect(await chooseLaunch(m.deps)).toEqual({ mode: "stop", code: 130 });
    expect(m.record()).toBeNull();
  });
});

describe("npm start: the fetch step with a stand-in install script", () => {
  function fakePackage(installJs: string): string {
    const root = newDir();
    mkdirSync(join(root, "node_modules", "electron"), { recursive: true });
    writeFileSync(join(root, "node_modules", "electron", "install.js"), installJs);
    return root;
  }

  it("reduces the script's failure (a stack trace) to one line with the network error", async () => {
    const start = await load<StartModule>("start.mjs");
    // fails as Electron's script does offline: fetch rejects (here: a loopback port that was just closed, so
    // nothing listens), the script prints err.stack and exits 1
    const { createServer } = await import("node:net");
    const probe = createServer();
    await new Promise<void>((ok) => probe.listen(0, "127.0.0.1", () => ok()));
    const port = (probe.address() as { port: number }).port;
    await new Promise<void>((ok) => probe.close(() => ok()));
    const root = fakePackage(`fetch("http://127.0.0.1:${port}/electron.zip").catch((err) => { console.error(err.stack); process.exit(1); });`);
    const outcome = await start.fetchRuntime({ ignoreSkipEnv: false }, root);
    expect(outcome).toEqual({ ok: false, reason: `fetch failed: connect ECONNREFUSED 127.0.0.1:${port}` });
  });

  it("reports success when the script ends well, and passes on ELECTRON_SKIP_BINARY_DOWNLOAD only when not forced", async () => {
    const start = await load<StartModule>("start.mjs");
    const root = fakePackage(`require("fs").writeFileSync(require("path").join(__dirname, "env.txt"), String(process.env.ELECTRON_SKIP_BINARY_DOWNLOAD));`);
    const saved = process.env.ELECTRON_SKIP_BINARY_DOWNLOAD;
    process.env.ELECTRON_SKIP_BINARY_DOWNLOAD = "1";
    try {
      expect(await start.fetchRuntime({ ignoreSkipEnv: true }, root)).toEqual({ ok: true });
      expect(readFileSync(join(root, "node_modules", "electron", "env.txt"), "utf8")).toBe("undefined");
      expect(await start.fetchRuntime({ ignoreSkipEnv: false }, root)).toEqual({ ok: true });
      expect(readFileSync(join(root, "node_modules", "electron", "env.txt"), "utf8")).toBe("1");
    } finally {
      if (saved === undefined) delete process.env.ELECTRON_SKIP_BINARY_DOWNLOAD;
      else process.env.ELECTRON_SKIP_BINARY_DOWNLOAD = saved;
    }
  });

  it("names the exit code when the script fails without a stack trace, and a missing script", async () => {
    const start = await load<StartModule>("start.mjs");
    expect(await start.fetchRuntime({ ignoreSkipEnv: false }, fakePackage("process.exit(3);"))).toEqual({ ok: false, reason: "the install script exited with code 3" });
    expect((await start.fetchRuntime({ ignoreSkipEnv: false }, newDir())) as { reason: string }).toMatchObject({ ok: false, reason: expect.stringContaining("install.js is missing") });
  });

  it("keeps the failure record inside node_modules and reads back what it wrote", async () => {
    const start = await load<StartModule>("start.mjs");
    const root = newDir();
    expect(start.readFailure(root)).toBeNull();
    start.writeFailure({ at_ms: T0, reason: "offline" }, root);
    expect(start.failureRecordPath(root).startsWith(join(root, "node_modules"))).toBe(true);
    expect(start.readFailure(root)).toEqual({ at_ms: T0, reason: "offline" });
    start.clearFailure(root);
    expect(existsSync(start.failureRecordPath(root))).toBe(false);
  });
});
