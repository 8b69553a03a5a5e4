// Build and dev-server config for the studio. Root is renderer/; the demo project is served and
// copied into the build from assets/demo (publicDir), so the file is not duplicated in git.
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
// the desktop app's own headers (main/protocol.ts serves the same ones)
import { securityHeaders } from "../src/model/contentSecurity.ts";

const here = import.meta.dirname;

function devServerHeaders(): Record<string, string> {
  const { "Content-Security-Policy": _policy, ...rest } = securityHeaders();
  return rest;
}

export default defineConfig({
  root: here,
  base: "./",
  publicDir: `${here}/../assets/demo`,
  plugins: [react()],
  worker: { format: "es" },
  // The built studio (`npm run web`, the browser tests) is served with the desktop app's policy and nosniff. The
  // dev server keeps nosniff and the rest but no policy: its hot reload runs an inline script the policy refuses.
  preview: { headers: securityHeaders() },
  server: { host: "127.0.0.1", port: 5178, fs: { allow: [`${here}/..`] }, headers: devServerHeaders() },
  build: { outDir: `${here}/../out/renderer`, emptyOutDir: true, chunkSizeWarningLimit: 4000, target: "es2022" },
});
