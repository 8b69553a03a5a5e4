// Starts `vite preview` on a free local port (spawned directly, not through npx) and stops it.
import { spawn } from "node:child_process";
import { createServer } from "node:net";
import { get } from "node:http";
import { join } from "node:path";

export function freePort() {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.unref();
    srv.on("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
}

function answers(url) {
  return new Promise((resolve) => {
    const req = get(url, (res) => {
      res.resume();
      resolve(res.statusCode !== undefined && res.statusCode < 500);
    });
    req.on("error", () => resolve(false));
    req.setTimeout(1000, () => {
      req.destroy();
      resolve(false);
    });
  });
}

/** @returns {Promise<{ url: string, stop: () => Promise<void> }>} */
export async function startPreview(root) {
  const port = await freePort();
  const vite = join(root, "node_modules", ".bin", "vite");
  const child = spawn(vite, ["preview", "--config", "renderer/vite.config.ts", "--host", "127.0.0.1", "--port", String(port), "--strictPort", "--bypass-lock"], {
    cwd: root,
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  child.stdout.on("data", (d) => (output += d));
  child.stderr.on("data", (d) => (output += d));
  const url = `http://127.0.0.1:${port}/`;
  const stop = () =>
    new Promise((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.once("exit", () => resolve());
      child.kill("SIGTERM");
      setTimeout(() => {
        if (child.exitCode === null) child.kill("SIGKILL");
      }, 3000).unref();
    });
  for (let i = 0; i < 100; i++) {
    if (child.exitCode !== null) throw new Error(`vite preview exited early:\n${output}`);
    if (await answers(url)) return { url, stop };
    await new Promise((r) => setTimeout(r, 150));
  }
  await stop();
  throw new Error(`vite preview did not answer at ${url}:\n${output}`);
}
