// Dev server for the panes preview only (the studio has its own config in renderer/vite.config.ts):
//   node_modules/.bin/vite --config renderer/panes/dev/vite.config.ts
// then open http://127.0.0.1:5191/panesPreview.html
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";

const here = new URL(".", import.meta.url).pathname;
const repo = new URL("../../../", import.meta.url).pathname;

export default defineConfig({
  root: here,
  publicDir: false,
  plugins: [react()],
  server: { host: "127.0.0.1", port: 5191, strictPort: true, fs: { allow: [repo] } },
  logLevel: "warn",
});
