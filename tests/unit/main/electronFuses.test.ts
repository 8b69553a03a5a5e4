// Hardening report, item 13: the packaged binary's Electron fuses. electron-builder.yml's electronFuses is
// turned into the fuse wire by electron-builder's own generateFuseConfig, and the result is read with the
// option names of @electron/fuses (FuseV1Options), so a misspelt key or a fuse left on shows here.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const repo = resolve(fileURLToPath(new URL(".", import.meta.url)), "../../..");
const requireFromRepo = createRequire(join(repo, "package.json"));

describe("Electron fuses of the packaged app", () => {
  it("turn off running as Node, NODE_OPTIONS and --inspect, and turn on ASAR integrity and loading only from the ASAR", async () => {
    const yaml = requireFromRepo("js-yaml") as { load(text: string): unknown };
    const config = yaml.load(readFileSync(join(repo, "electron-builder.yml"), "utf8")) as { electronFuses: Record<string, boolean> };
    const { PlatformPackager } = requireFromRepo("app-builder-lib") as {
      PlatformPackager: { prototype: { generateFuseConfig(f: unknown): Promise<Record<string | number, unknown>> } };
    };
    const { FuseV1Options, FuseVersion } = (await import(requireFromRepo.resolve("@electron/fuses"))) as {
      FuseV1Options: Record<string, number>;
      FuseVersion: Record<string, unknown>;
    };
    const wire = await PlatformPackager.prototype.generateFuseConfig.call({}, config.electronFuses);
    expect(wire.version).toBe(FuseVersion.V1);
    expect(wire[FuseV1Options.RunAsNode]).toBe(false);
    expect(wire[FuseV1Options.EnableNodeOptionsEnvironmentVariable]).toBe(false);
    expect(wire[FuseV1Options.EnableNodeCliInspectArguments]).toBe(false);
    expect(wire[FuseV1Options.EnableEmbeddedAsarIntegrityValidation]).toBe(true);
    expect(wire[FuseV1Options.OnlyLoadAppFromAsar]).toBe(true);
    expect(wire[FuseV1Options.GrantFileProtocolExtraPrivileges]).toBe(false);
  });

  it("keep the CLI outside the archive, run by the system's Node (the app binary no longer runs it)", () => {
    const text = readFileSync(join(repo, "electron-builder.yml"), "utf8");
    expect(text).toContain("node <resources>/cli/islet.mjs");
    expect(text).not.toMatch(/ELECTRON_RUN_AS_NODE=1/);
    const yaml = requireFromRepo("js-yaml") as { load(text: string): unknown };
    const config = yaml.load(text) as { extraResources: { from: string; to: string }[]; files: string[] };
    expect(config.extraResources).toContainEqual({ from: "out/cli", to: "cli" });
    expect(config.files).toContain("!out/cli/**");
  });
});
