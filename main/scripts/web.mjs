// `npm run web`: the studio in a browser. Builds the renderer when out/renderer is missing or
// older than its sources, then serves it with vite preview on a fixed local address.
// Also used by main/scripts/start.mjs where the desktop runtime is not installed.
import { spawn } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import { get } from "node:http";
import { createServer } from "node:net";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

export const STUDIO_HOST = "127.0.0.1";
export const STUDIO_PORT = 5178;
export const STUDIO_URL = `http://${STUDIO_HOST}:${STUDIO_PORT}/`;

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "../..");

/** Folders and files whose changes make the built renderer stale (the CLI is not part of it). */
export const RENDERER_INPUTS = ["renderer", "src/model", "src/engine", "src/protection", "src/study", "src/report", "assets/demo", "package.json"];

/** Newest modification time (ms) of a file or of any file below a folder; 0 when missing. */
export function newestMtime_ms(path) {
  if (!existsSync(path)) return 0;
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of readdirSync(path, { withFileTypes: true })) {
    if (entry.name === "node_modules" || entry.name.startsWith(".")) continue;
    newest = Math.max(newest, newestMtime_ms(join(path, entry.name)));
  }
  return newest;
}

/**
 * Why the renderer must be (re)built, or null when out/renderer is up to date.
 * @param {string} root repository root
 * @returns {string | null}
 */
export function rendererBuildReason(root) {
  const built = join(root, "out", "renderer", "index.html");
  if (!existsSync(built)) return "out/renderer is missing";
  const builtAt = statSync(built).mtimeMs;
  for (const input of RENDERER_INPUTS) {
    if (newestMtime_ms(join(root, input)) > builtAt) return `${input} changed since the last build`;
  }
  return null;
}

/** The vite command line, spawned directly (not through npx) so the child pid is the server. */
export function viteCommand(root, args) {
  if (process.platform === "win32") return { cmd: process.execPath, args: [join(root, "node_modules", "vite", "bin", "vite.js"), ...args] };
  return { cmd: join(root, "node_modules", ".bin", "vite"), args };
}

function run(root, args, log) {
  const { cmd, args: full } = viteCommand(root, args);
  return new Promise((resolveRun) => {
    const child = spawn(cmd, full, { cwd: root, stdio: "inherit" });
    child.on("error", (err) => {
      log(`Islet: could not start vite: ${err.message}`);
      resolveRun(1);
    });
    child.on("exit", (code, signal) => resolveRun(code ?? (signal ? 1 : 0)));
  });
}

/** Build the renderer if needed; resolves to true when out/renderer is ready. */
export async function ensureRendererBuilt(root = repoRoot, log = console.log) {
  const config = join(root, "renderer", "vite.config.ts");
  if (!existsSync(config)) {
    log(`Islet: renderer/vite.config.ts is missing, so the studio cannot be built.`);
    return false;
  }
  const reason = rendererBuildReason(root);
  if (reason === null) return true;
  log(`Islet: building the studio (${reason})...`);
  const code = await run(root, ["build", "--config", "renderer/vite.config.ts"], log);
  if (code !== 0) log(`Islet: the studio build failed (exit code ${code}).`);
  return code === 0;
}

function answers(url) {
  return new Promise((resolveAnswer) => {
    const req = get(url, (res) => {
      res.resume();
      resolveAnswer(true);
    });
    req.on("error", () => resolveAnswer(false));
    req.setTimeout(1000, () => {
      req.destroy();
      resolveAnswer(false);
    });
  });
}

/** Whether host:port can be listened on now (so the URL we print is really ours). */
export function portIsFree(port, host = STUDIO_HOST) {
  return new Promise((resolveFree) => {
    const probe = createServer();
    probe.once("error", () => resolveFree(false));
    probe.listen(port, host, () => probe.close(() => resolveFree(true)));
  });
}

/**
 * Serve out/renderer with vite preview until the server exits or this process is stopped.
 * Resolves to the exit code to use.
 */
export async function serveStudio(root = repoRoot, log = console.log) {
  if (!(await portIsFree(STUDIO_PORT))) {
    log(`Islet: port ${STUDIO_PORT} on ${STUDIO_HOST} is already in use (is the studio already running?). Stop that server and try again.`);
    return 1;
  }
  if (!(await ensureRendererBuilt(root, log))) return 1;
  const { cmd, args } = viteCommand(root, ["preview", "--config", "renderer/vite.config.ts", "--host", STUDIO_HOST, "--port", String(STUDIO_PORT), "--strictPort"]);
  const child = spawn(cmd, args, { cwd: root, stdio: "inherit" });
  const forward = (signal) => () => {
    if (child.exitCode === null) child.kill(signal);
  };
  const onInt = forward("SIGINT");
  const onTerm = forward("SIGTERM");
  process.on("SIGINT", onInt);
  process.on("SIGTERM", onTerm);

  let exited = false;
  const done = new Promise((resolveDone) => {
    child.on("error", (err) => {
      exited = true;
      log(`Islet: could not start the studio server: ${err.message}`);
      resolveDone(1);
    });
    child.on("exit", (code, signal) => {
      exited = true;
      resolveDone(code ?? (signal === "SIGINT" || signal === "SIGTERM" ? 0 : 1));
    });
  });

  // Announce the address once the server answers, so the printed URL works when clicked.
  // If it is slow to answer, announce it anyway while it still runs.
  for (let i = 0; i < 150 && !exited; i++) {
    if (await answers(STUDIO_URL)) break;
    await new Promise((r) => setTimeout(r, 200));
  }
  if (!exited) log(`Islet studio: ${STUDIO_URL}`);

  const code = await done;
  process.off("SIGINT", onInt);
  process.off("SIGTERM", onTerm);
  return code;
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  process.exitCode = await serveStudio();
}
