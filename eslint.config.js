// Lint and layer rules. Imports point inward only: renderer and main may import src;
// src never imports them; the core (src except src/cli) never imports Node built-ins.
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import globals from "globals";

const nodeBuiltins = ["node:*", "fs", "path", "os", "child_process", "crypto", "url", "worker_threads", "electron"];

export default tseslint.config(
  { ignores: ["node_modules/", "out/", "dist/", "release/", "coverage/", ".tmp/", "report/", "tests/e2e/artifacts/", "assets/**/*.json"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.es2022 } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-explicit-any": "error",
    },
  },
  {
    files: ["src/**/*.ts"],
    ignores: ["src/cli/**"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["**/renderer/**", "**/main/**", "../../renderer/*", "../../main/*"], message: "The core never imports the renderer or main." },
            { group: ["**/cli/**"], message: "The core never imports the CLI." },
            { group: nodeBuiltins, message: "The core is pure: no Node built-ins (only src/cli may use them)." },
          ],
        },
      ],
    },
  },
  {
    files: ["src/cli/**/*.ts"],
    languageOptions: { globals: { ...globals.node } },
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["**/renderer/**", "**/main/**"], message: "src never imports renderer or main." }] }],
    },
  },
  {
    files: ["renderer/**/*.{ts,tsx}"],
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [{ group: ["**/main/**", "electron", "node:*"], message: "The renderer never imports main, Electron or Node: go through the host adapter." }] },
      ],
    },
  },
  {
    files: ["main/**/*.ts"],
    languageOptions: { globals: { ...globals.node } },
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["**/renderer/**"], message: "main never imports the renderer." }] }],
    },
  },
  {
    files: ["tests/**/*.{ts,tsx,mjs}", "main/scripts/**/*.mjs", "src/cli/**/*.mjs", "*.config.{js,ts}"],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
  },
);
