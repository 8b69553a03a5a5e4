// `npm start`: the desktop app on the demo project (or on a file given after `--`).
// Where the Electron runtime is not installed (package.json's allowScripts keeps `npm install` offline), it fetches
// it once with Electron's own install script, showing that script's progress, then opens the app; where the fetch
// fails it says so in one line and serves the same studio in the browser, exactly as `npm run web` does. What is
// decided when, and the day without a new try after a failure: runtimeLaunch.mjs.
import { spawn } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { ensureRendererBuilt, serveStudio } from "./web.mjs";
import { buildMain } from "./build-main.mjs";
import { appArgs, chooseLaunch, SKIP_ENV_LINE } from "./runtimeLaunch.mjs";

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "../..");

/** The line shown when the runtime is missing and is not fetched (ELECTRON_SKIP_BINARY_DOWNLOAD set). */
export const RUNTIME_MISSING_LINE = SKIP_ENV_LINE;

/** Where the last failed fetch is recorded (inside node_modules: a fresh install tries again). */
export function failureRecordPath(root = repoRoot) {
  return join(root, "node_modules", ".cache", "islet", "desktop-runtime-fetch.json");
}

export function readFailure(root = repoRoot) {
  try {
    const r = JSON.parse(readFileSync(failureRecordPath(root), "utf8"));
    return typeof r.at_ms === "number" && typeof r.reason === "string" ? { at_ms: r.at_ms, reason: r.reason } : null;
  } catch {
    return null;
  }
}

export function writeFailure(failure, root = repoRoot) {
  try {
    mkdirSync(dirname(failureRecordPath(root)), { recursive: true });
    writeFileSync(failureRecordPath(root), JSON.stringify(failure));
  } catch {
    // not recorded: the next start simply tries again
  }
}

export function clearFailure(root = repoRoot) {
  rmSync(failureRecordPath(root), { force: true });
}

/**
 * Runs node_modules/electron/install.js (Electron's own download, as `npm install` would have run it) with this
 * terminal, so its progress bar shows. Its failure (a stack trace) is reduced to one line: a small wrapper keeps the
 * first line of what the script prints on failure, with the network error under "fetch failed", and hands it back
 * on file descriptor 3.
 */
export function installScriptWrapper(installJs) {
  return `const fs = require("fs");
let cause = "";
const realFetch = globalThis.fetch;
if (realFetch) globalThis.fetch = async (...a) => { try { return await realFetch(...a); } catch (e) { cause = (e && e.cause && (e.cause.message || e.cause.code)) || ""; throw e; } };
const realError = console.error;
console.error = (...a) => {
  const text = a.map(String).join(" ");
  if (!/\\n\\s+at /.test(text)) return realError(...a);
  const first = text.split("\\n")[0].replace(/^[A-Za-z]*Error: /, "");
  try { fs.writeSync(3, cause ? first + ": " + cause : first); } catch {}
};
require(${JSON.stringify(installJs)});`;
}

/** One try of Electron's install script; resolves with ok, or the reason in one line. */
export function fetchRuntime({ ignoreSkipEnv }, root = repoRoot) {
  const installJs = join(root, "node_modules", "electron", "install.js");
  if (!existsSync(installJs)) return Promise.resolve({ ok: false, reason: "node_modules/electron/install.js is missing; run npm install" });
  const env = { ...process.env };
  if (ignoreSkipEnv) delete env.ELECTRON_SKIP_BINARY_DOWNLOAD;
  return new Promise((done) => {
    const child = spawn(process.execPath, ["-e", installScriptWrapper(installJs)], { cwd: root, env, stdio: ["ignore", "inherit", "inherit", "pipe"] });
    let reason = "";
    child.stdio[3]?.on("data", (chunk) => (reason += chunk.toString("utf8")));
    // Ctrl+C reaches the script too; wait for it to end, then stop without recording a failure
    let interrupted = false;
    const onInterrupt = () => (interrupted = true);
    process.on("SIGINT", onInterrupt);
    child.on("error", (err) => {
      process.off("SIGINT", onInterrupt);
      done({ ok: false, reason: `could not run the install script: ${err.message}` });
    });
    child.on("close", (code, signal) => {
      process.off("SIGINT", onInterrupt);
      if (interrupted || signal === "SIGINT") done({ ok: false, reason: "interrupted", interrupted: true });
      else if (code === 0) done({ ok: true });
      else done({ ok: false, reason: reason.trim().split("\n")[0] || `the install script exited with ${signal ?? `code ${code}`}` });
    });
  });
}

function electronVersion(root = repoRoot) {
  try {
    return JSON.parse(readFileSync(join(root, "node_modules", "electron", "package.json"), "utf8")).version ?? "";
  } catch {
    return "";
  }
}

/** Path of the Electron binary, or null when the package is there without its runtime. */
export function electronBinary(root = repoRoot) {
  try {
    const path = createRequire(resolve(root, "package.json"))("electron");
    return typeof path === "string" && existsSync(path) ? path : null;
  } catch {
    return null;
  }
}

/** Arguments for the desktop app: the given project files, else the demo. */
export function desktopArgs(userArgs) {
  const files = userArgs.filter((a) => !a.startsWith("-"));
  return [".", ...(files.length > 0 ? files.map((f) => resolve(f)) : ["--demo"]), ...userArgs.filter((a) => a.startsWith("-"))];
}

async function startDesktop(binary, userArgs) {
  if (!(await ensureRendererBuilt(repoRoot))) return 1;
  await buildMain(repoRoot);
  const child = spawn(binary, desktopArgs(userArgs), { cwd: repoRoot, stdio: "inherit" });
  const forward = (signal) => () => {
    if (child.exitCode === null) child.kill(signal);
  };
  process.on("SIGINT", forward("SIGINT"));
  process.on("SIGTERM", forward("SIGTERM"));
  return new Promise((done) => {
    child.on("error", (err) => {
      console.error(`Islet: could not start the desktop app: ${err.message}`);
      done(1);
    });
    child.on("exit", (code) => done(code ?? 0));
  });
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  const args = process.argv.slice(2);
  const launch = await chooseLaunch({
    args,
    env: process.env,
    version: electronVersion(),
    findRuntime: () => electronBinary(),
    fetchRuntime: (opts) => fetchRuntime(opts),
    readFailure: () => readFailure(),
    writeFailure: (f) => writeFailure(f),
    clearFailure: () => clearFailure(),
    now: () => Date.now(),
    log: (line) => console.log(line),
  });
  if (launch.mode === "desktop") process.exitCode = await startDesktop(launch.binary, appArgs(args));
  else if (launch.mode === "browser") process.exitCode = await serveStudio(repoRoot);
  else process.exitCode = launch.code;
}
