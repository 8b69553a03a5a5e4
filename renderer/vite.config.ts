// Build and dev-server config for the studio. Root is renderer/; the demo project is served and
// copied into the build from assets/demo (publicDir), so the file is not duplicated in git.
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";

const here = import.meta.dirname;

export default defineConfig({
  root: here,
  base: "./",
  publicDir: `${here}/../assets/demo`,
  plugins: [react()],
  worker: { format: "es" },
  server: { host: "127.0.0.1", port: 5178, fs: { allow: [`${here}/..`] } },
  build: { outDir: `${here}/../out/renderer`, emptyOutDir: true, chunkSizeWarningLimit: 4000, target: "es2022" },
});
