// A second guard beside ESLint's no-restricted-imports (DEVELOPERS.md, "Imports point inward
// only"): nothing in src/ or renderer/ imports main/ or electron, and the preload's bundle may
// only require "electron" (sandboxed preloads cannot load anything else: Electron docs, "Sandboxing").
import { describe, expect, it } from "vitest";
import { readFileSync, readdirSync } from "node:fs";
import { join, relative, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const repo = resolve(fileURLToPath(new URL(".", import.meta.url)), "../../..");

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  let entries;
  try {
    entries = readdirSync(dir, { withFileTypes: true });
  } catch {
    return out;
  }
  for (const e of entries) {
    if (e.name === "node_modules" || e.name.startsWith(".")) continue;
    const p = join(dir, e.name);
    if (e.isDirectory()) out.push(...sourceFiles(p));
    else if (/\.(ts|tsx|mts|js|mjs)$/.test(e.name)) out.push(p);
  }
  return out;
}

/** Every module specifier in import/export-from statements, dynamic import() and require(). */
function importedSpecifiers(text: string): string[] {
  const specs: string[] = [];
  const patterns = [/\b(?:import|export)\s[^'"]*?\bfrom\s*["']([^"']+)["']/g, /\bimport\s*["']([^"']+)["']/g, /\bimport\s*\(\s*["']([^"']+)["']\s*\)/g, /\brequire\s*\(\s*["']([^"']+)["']\s*\)/g];
  for (const re of patterns) for (const m of text.matchAll(re)) specs.push(m[1]);
  return specs;
}

function forbidden(spec: string): boolean {
  return spec === "electron" || spec.startsWith("electron/") || /(^|\/)main\//.test(spec) || /(^|\/)main$/.test(spec);
}

describe("layering", () => {
  it("finds the import forms it is meant to catch", () => {
    const sample = `import { a } from "../../main/ipc.ts";\nimport type { B } from 'electron';\nexport * from "../main/x.ts";\nconst c = await import("electron");\nrequire("../main/y");\nimport "../main/side.ts";`;
    expect(importedSpecifiers(sample).filter(forbidden)).toHaveLength(6);
    expect(forbidden("./mainMenu.ts")).toBe(false);
    expect(forbidden("../domain/x.ts")).toBe(false);
  });

  it.each(["src", "renderer"])("%s/ never imports main/ or electron", (folder) => {
    const files = sourceFiles(join(repo, folder));
    expect(files.length).toBeGreaterThan(0);
    const offenders = files.flatMap((f) =>
      importedSpecifiers(readFileSync(f, "utf8"))
        .filter(forbidden)
        .map((s) => `${relative(repo, f)} imports ${s}`),
    );
    expect(offenders).toEqual([]);
  });

  it("main/ never imports the renderer", () => {
    const offenders = sourceFiles(join(repo, "main")).flatMap((f) =>
      importedSpecifiers(readFileSync(f, "utf8"))
        .filter((s) => /(^|\/)renderer\//.test(s))
        .map((s) => `${relative(repo, f)} imports ${s}`),
    );
    expect(offenders).toEqual([]);
  });

  it("the preload imports nothing at run time but electron and its own channel list", () => {
    const text = readFileSync(join(repo, "main", "preload.ts"), "utf8");
    const runtime = text
      .split("\n")
      .filter((l) => /^import\s/.test(l) && !/^import\s+type\s/.test(l))
      .flatMap((l) => importedSpecifiers(l));
    expect(runtime.sort()).toEqual(["./channels.ts", "electron"]);
  });
});
