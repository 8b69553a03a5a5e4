// Packaging and launch scripts: electron-builder.yml checked by electron-builder's own schema
// validator, the icon's size read from its PNG header (PNG spec, ISO/IEC 15948: IHDR holds width
// and height as big-endian 32-bit integers at bytes 16-23), the main bundle matching package.json,
// and the CI script's syntax checked by bash itself.
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, utimesSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { useTempDir } from "./tempDir.ts";

const repo = resolve(fileURLToPath(new URL(".", import.meta.url)), "../../..");
const requireFromRepo = createRequire(join(repo, "package.json"));
const newDir = useTempDir();

type BuilderConfig = Record<string, unknown> & {
  files: string[];
  extraResources: Array<{ from: string; to: string }>;
  fileAssociations: Array<{ ext: string }>;
  linux: { target: string[]; category: string; maintainer: string; icon: string };
  win: { target: string[]; icon: string };
  mac: { target: string[]; icon: string };
};

function builderConfig(): BuilderConfig {
  const yaml = requireFromRepo("js-yaml") as { load(text: string): unknown };
  return yaml.load(readFileSync(join(repo, "electron-builder.yml"), "utf8")) as BuilderConfig;
}

async function importScript<T>(name: string): Promise<T> {
  return (await import(pathToFileURL(join(repo, "main", "scripts", name)).href)) as T;
}

describe("electron-builder.yml", () => {
  it("passes electron-builder's own configuration check", async () => {
    const { validateConfiguration } = requireFromRepo("app-builder-lib/out/util/config/config.js") as {
      validateConfiguration(config: unknown, log: { isEnabled: boolean; add(): void }): Promise<void>;
    };
    await expect(validateConfiguration(builderConfig(), { isEnabled: false, add() {} })).resolves.toBeUndefined();
    await expect(validateConfiguration({ ...builderConfig(), notAnOption: 1 }, { isEnabled: false, add() {} })).rejects.toThrow(/Invalid configuration/);
  });

  it("names the app and ships only the build output and the manifest, plus the demo and templates", () => {
    const c = builderConfig();
    expect(c.appId).toBe("org.islet.studio");
    expect(c.productName).toBe("Islet");
    expect(c.files).toEqual(expect.arrayContaining(["out/**", "package.json"]));
    expect(c.extraResources).toEqual(expect.arrayContaining([{ from: "assets/demo", to: "demo" }, { from: "assets/templates", to: "templates" }]));
  });

  it("builds AppImage and deb, an NSIS installer and a dmg, and opens .islet files", () => {
    const c = builderConfig();
    expect(c.linux.target).toEqual(["AppImage", "deb"]);
    expect(c.linux.category).toBe("Science");
    expect(c.linux.maintainer).toMatch(/<.+@.+>/);
    expect(c.win.target).toEqual(["nsis"]);
    expect(c.mac.target).toEqual(["dmg"]);
    expect(c.fileAssociations.map((a) => a.ext)).toEqual(["islet"]);
  });

  it("uses a 512 x 512 icon that exists", () => {
    const c = builderConfig();
    for (const icon of new Set([c.linux.icon, c.win.icon, c.mac.icon])) {
      const png = readFileSync(join(repo, icon));
      expect(png.subarray(1, 4).toString("latin1")).toBe("PNG");
      expect([png.readUInt32BE(16), png.readUInt32BE(20)]).toEqual([512, 512]);
    }
  });
});

describe("main bundle", () => {
  it("is CommonJS with electron left external, at the path package.json names", async () => {
    const { mainBuildOptions } = await importScript<{ mainBuildOptions(root: string): Array<Record<string, unknown>> }>("build-main.mjs");
    const [main, preload] = mainBuildOptions("/r");
    const pkg = JSON.parse(readFileSync(join(repo, "package.json"), "utf8")) as { main: string };
    expect(resolve("/r", pkg.main)).toBe(main.outfile);
    for (const o of [main, preload]) {
      expect(o.format).toBe("cjs");
      expect(o.bundle).toBe(true);
      expect(o.external).toEqual(["electron"]);
    }
    expect(preload.outfile).toBe(join("/r", "out", "main", "preload.cjs"));
    // main.ts must look for the preload under the name the build gives it
    expect(readFileSync(join(repo, "main", "main.ts"), "utf8")).toContain('"preload.cjs"');
  });
});

describe("CI script", () => {
  const ci = readFileSync(join(repo, ".ci", "run"), "utf8");

  it("is valid bash", () => {
    expect(spawnSync("bash", ["-n", join(repo, ".ci", "run")]).status).toBe(0);
  });

  it("stops on errors, installs the browser and the PDF renderer only when missing, skips the Electron download and runs npm test", () => {
    expect(ci).toMatch(/^set -euo pipefail$/m);
    expect(ci).toContain("[ -x /usr/bin/chromium ] || need+=(chromium)");
    expect(ci).toContain("command -v pdftoppm >/dev/null 2>&1 || need+=(poppler-utils)");
    expect(ci).toContain('apt-get install -y "${need[@]}"');
    expect(ci).toMatch(/^export ELECTRON_SKIP_BINARY_DOWNLOAD=1$/m);
    expect(ci.indexOf("npm ci")).toBeLessThan(ci.indexOf("npm test"));
  });
});

describe("browser studio launcher", () => {
  interface Web {
    STUDIO_URL: string;
    rendererBuildReason(root: string): string | null;
  }

  it("serves on the fixed local address", async () => {
    expect((await importScript<Web>("web.mjs")).STUDIO_URL).toBe("http://127.0.0.1:5178/");
  });

  it("rebuilds when out/renderer is missing or older than its sources, and not otherwise", async () => {
    const { rendererBuildReason } = await importScript<Web>("web.mjs");
    const root = newDir();
    mkdirSync(join(root, "renderer"));
    writeFileSync(join(root, "renderer", "main.tsx"), "");
    writeFileSync(join(root, "package.json"), "{}");
    expect(rendererBuildReason(root)).toBe("out/renderer is missing");
    mkdirSync(join(root, "out", "renderer"), { recursive: true });
    writeFileSync(join(root, "out", "renderer", "index.html"), "");
    // file times tick coarsely (milliseconds apart may share one), so place them clearly apart
    const sourcesAt = new Date(Date.now() - 60_000);
    const builtAt = new Date(Date.now() - 30_000);
    for (const p of ["renderer/main.tsx", "renderer", "package.json"]) utimesSync(join(root, p), sourcesAt, sourcesAt);
    utimesSync(join(root, "out", "renderer", "index.html"), builtAt, builtAt);
    expect(rendererBuildReason(root)).toBeNull();
    mkdirSync(join(root, "src", "engine"), { recursive: true });
    writeFileSync(join(root, "src", "engine", "faults.ts"), "");
    expect(rendererBuildReason(root)).toBe("src/engine changed since the last build");
  });
});

describe("npm start", () => {
  interface Start {
    RUNTIME_MISSING_LINE: string;
    electronBinary(root: string): string | null;
    desktopArgs(args: string[]): string[];
  }

  function fakeElectronPackage(root: string, index: string) {
    mkdirSync(join(root, "node_modules", "electron"), { recursive: true });
    writeFileSync(join(root, "package.json"), "{}");
    writeFileSync(join(root, "node_modules", "electron", "package.json"), '{"name":"electron","main":"index.js"}');
    writeFileSync(join(root, "node_modules", "electron", "index.js"), index);
  }

  it("says in one line that the desktop runtime is missing and how it arrives", async () => {
    const { RUNTIME_MISSING_LINE } = await importScript<Start>("start.mjs");
    expect(RUNTIME_MISSING_LINE).not.toContain("\n");
    expect(RUNTIME_MISSING_LINE).toContain("npm install");
    expect(RUNTIME_MISSING_LINE).toContain("ELECTRON_SKIP_BINARY_DOWNLOAD");
  });

  it("finds no runtime when the electron package has no binary (as after ELECTRON_SKIP_BINARY_DOWNLOAD)", async () => {
    const { electronBinary } = await importScript<Start>("start.mjs");
    const root = newDir();
    fakeElectronPackage(root, "throw new Error('Electron failed to install correctly');");
    expect(electronBinary(root)).toBeNull();
    const dangling = newDir();
    fakeElectronPackage(dangling, `module.exports = ${JSON.stringify(join(dangling, "no-such-binary"))};`);
    expect(electronBinary(dangling)).toBeNull();
  });

  it("finds the runtime when the electron package points at an existing binary", async () => {
    const { electronBinary } = await importScript<Start>("start.mjs");
    const root = newDir();
    const binary = join(root, "electron-binary");
    writeFileSync(binary, "");
    fakeElectronPackage(root, `module.exports = ${JSON.stringify(binary)};`);
    expect(electronBinary(root)).toBe(binary);
  });

  it("opens the demo unless files are given", async () => {
    const { desktopArgs } = await importScript<Start>("start.mjs");
    expect(desktopArgs([])).toEqual([".", "--demo"]);
    expect(desktopArgs(["/s/a.islet"])).toEqual([".", "/s/a.islet"]);
  });
});

describe("browser studio port check", () => {
  it("reports a port in use instead of printing an address that is not ours", async () => {
    const { portIsFree } = await importScript<{ portIsFree(port: number, host?: string): Promise<boolean> }>("web.mjs");
    const { createServer } = await import("node:net");
    const holder = createServer();
    await new Promise<void>((ok) => holder.listen(0, "127.0.0.1", () => ok()));
    const port = (holder.address() as { port: number }).port;
    expect(await portIsFree(port)).toBe(false);
    await new Promise<void>((ok) => holder.close(() => ok()));
    expect(await portIsFree(port)).toBe(true);
  });
});
