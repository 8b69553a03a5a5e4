// `npm start`: the desktop app on the demo project (or on a file given after `--`).
// Where the Electron runtime is not installed, says so in one line and serves the same
// studio in the browser, exactly as `npm run web` does.
import { spawn } from "node:child_process";
import { existsSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { ensureRendererBuilt, serveStudio } from "./web.mjs";
import { buildMain } from "./build-main.mjs";

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "../..");

export const RUNTIME_MISSING_LINE =
  "Islet: the desktop runtime (Electron) is not installed here (package.json's allowScripts keeps `npm install` from downloading it, as ELECTRON_SKIP_BINARY_DOWNLOAD=1 would); fetch it once with `node node_modules/electron/install.js`; serving the studio in your browser instead.";

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
  const binary = electronBinary();
  if (binary) {
    process.exitCode = await startDesktop(binary, process.argv.slice(2));
  } else {
    console.log(RUNTIME_MISSING_LINE);
    process.exitCode = await serveStudio(repoRoot);
  }
}
