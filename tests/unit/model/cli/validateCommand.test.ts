// `islet validate` and `islet summary` run as a user runs them: src/cli/islet.mjs in a child process.
// Expected messages follow the house rule that every message names the element (id and name) and the field.
import { describe, it, expect, beforeAll, afterAll } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const demoPath = join(root, "assets/demo/dairy-coop.islet");
const demoText = readFileSync(demoPath, "utf8");
let dir = "";

function islet(...args: string[]) {
  const r = spawnSync(process.execPath, [join(root, "src/cli/islet.mjs"), ...args], { cwd: root, encoding: "utf8" });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

/** Writes a corrupted copy of the demo and returns its path. */
function corrupt(name: string, edit: (doc: Record<string, unknown> & { elements: Record<string, unknown>[] }) => void): string {
  const doc = JSON.parse(demoText);
  edit(doc);
  const path = join(dir, name);
  writeFileSync(path, JSON.stringify(doc, null, 2));
  return path;
}
const el = (doc: { elements: Record<string, unknown>[] }, id: string) => doc.elements.find((e) => e.id === id)!;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "islet-validate-"));
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

describe("islet validate", () => {
  it("exits 0 on the demo with a one-line OK and the counts", () => {
    const r = islet("validate", demoPath);
    expect(r.code).toBe(0);
    expect(r.out.trim().split("\n")).toHaveLength(1);
    expect(r.out).toMatch(/^OK .*dairy-coop\.islet: "Coastal dairy cooperative", \d+ elements \(13 buses, 17 protective devices\), 4 scenarios\n$/);
  });

  it("prints only JSON with --json", () => {
    const r = islet("validate", demoPath, "--json");
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j).toMatchObject({ ok: true, name: "Coastal dairy cooperative", counts: { buses: 13, scenarios: 4 } });
  });

  it("exits 1 on wrong types, naming element and field", () => {
    const path = corrupt("types.islet", (d) => {
      el(d, "T1").uk_pct = "6";
      el(d, "Q-BC").closed = "yes";
    });
    const r = islet("validate", path);
    expect(r.code).toBe(1);
    expect(r.err).toContain('error: Transformer T1 "Transformer 1 (1.6 MVA)": uk_pct must be a number (got "6")');
    expect(r.err).toContain('error: Switch Q-BC "Bus coupler": closed must be a boolean (got "yes")');
  });

  it("exits 1 on a negative length", () => {
    const path = corrupt("length.islet", (d) => {
      el(d, "C-WS").length_km = -3;
    });
    const r = islet("validate", path);
    expect(r.code).toBe(1);
    expect(r.err).toContain('error: Cable C-WS "Workshop feeder": length_km must be > 0 (got -3)');
  });

  it("exits 1 on an unknown element kind", () => {
    const path = corrupt("kind.islet", (d) => {
      el(d, "L-OF").kind = "heater";
    });
    const r = islet("validate", path);
    expect(r.code).toBe(1);
    expect(r.err).toContain('error: Element of kind "heater" L-OF "Offices and canteen": unknown kind "heater"; known kinds: "bus"');
  });

  it("exits 1 on truncated JSON, giving the position", () => {
    const path = join(dir, "truncated.islet");
    writeFileSync(path, demoText.slice(0, 2000));
    const r = islet("validate", path);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/error: Project file: not valid JSON at line \d+, column \d+ \(character 2000\): .*truncated/);
  });

  it("exits 1 on a newer formatVersion", () => {
    const path = corrupt("newer.islet", (d) => {
      d.formatVersion = 7;
    });
    const r = islet("validate", path);
    expect(r.code).toBe(1);
    expect(r.err).toContain("made by a newer Islet: formatVersion 7, this build reads up to 1");
  });

  it("exits 1 on a dangling bus reference", () => {
    const path = corrupt("dangling.islet", (d) => {
      el(d, "GEN1").bus = "LV-C";
    });
    const r = islet("validate", path);
    expect(r.code).toBe(1);
    expect(r.err).toContain('error: Generator GEN1 "Standby diesel genset": bus "LV-C" names no element in the project (dangling reference)');
  });

  it("reports the error as JSON with --json on a bad file", () => {
    const path = corrupt("dangling2.islet", (d) => {
      el(d, "GEN1").bus = "LV-C";
    });
    const r = islet("validate", path, "--json");
    expect(r.code).toBe(1);
    expect(JSON.parse(r.out).error.kind).toBe("invalidRecords");
  });

  it("exits 2 on a missing file or a bad option", () => {
    expect(islet("validate", join(dir, "nope.islet")).code).toBe(2);
    expect(islet("validate").code).toBe(2);
    expect(islet("validate", demoPath, "--fast").code).toBe(2);
  });
});

describe("islet summary", () => {
  it("lists counts by kind, buses per voltage level and each scenario's sources out of service", () => {
    const r = islet("summary", demoPath, "--json");
    expect(r.code).toBe(0);
    const s = JSON.parse(r.out);
    expect(s.countsByKind).toMatchObject({ bus: 13, transformer: 3, generator: 1, inverter: 2, motor: 2, switch: 1, grid: 1 });
    expect(s.busesByVoltage.map((v: { un_kV: number }) => v.un_kV)).toEqual([11, 0.4]);
    const inverterOnly = s.scenarios.find((x: { id: string }) => x.id === "island-inverters");
    expect(inverterOnly.sourcesOutOfService.sort()).toEqual(["GEN1", "GRID"]);
    expect(inverterOnly.sourcesInService.sort()).toEqual(["INV-BESS", "INV-PV"]);
  });

  it("prints a readable summary", () => {
    const r = islet("summary", demoPath);
    expect(r.code).toBe(0);
    expect(r.out).toContain("Buses by voltage level:");
    // the project's required caution wording (DEVELOPERS.md, rules of the house)
    expect(r.out).toContain("Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.");
    expect(r.out).toMatch(/island-inverters "Islanded: battery and PV only \(inverter-only\)"\n\s+sources in service:\s+INV-PV, INV-BESS\n\s+sources out of service: GRID, GEN1/);
  });
});
