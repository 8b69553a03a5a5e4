// Progress belongs to stderr on a terminal only: with stderr a pipe it carries none, with stderr a terminal the
// line is drawn and erased, and in every case stdout holds exactly what the library prints (the table or the JSON
// composed here, in-process, from the engine's own functions, as the command printed it before progress existed).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { generateRadialNetwork } from "../../../src/model/generateNetwork.ts";
import { loadProject } from "../../../src/model/projectFile.ts";
import { busFaultTable, formatBusFaultTable } from "../../../src/engine/index.ts";
import { ERASE_LINE } from "../../../src/cli/progress/progressLine.ts";
import { HAS_SCRIPT, ptyRun, sh } from "./ptyRun.ts";

const root = fileURLToPath(new URL("../../../", import.meta.url));
const cli = join(root, "src/cli/islet.mjs");
let dir = "";
let big = "";
let expectedTable = "";
let expectedJson = "";

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "islet-progress-"));
  big = join(dir, "radial-2000.islet");
  writeFileSync(big, JSON.stringify(generateRadialNetwork({ buses: 2000, devices: 200, seed: 11 })));
  const loaded = loadProject(readFileSync(big, "utf8"));
  if (!loaded.ok) throw new Error(loaded.error.messages.join("\n"));
  const table = busFaultTable(loaded.project);
  expectedTable = [...loaded.warnings.map((w) => `warning: ${w}`), formatBusFaultTable(table)].join("\n") + "\n";
  expectedJson = JSON.stringify({ ok: table.runs.every((r) => r.ok), file: big, caution: table.caution, warnings: loaded.warnings, runs: table.runs }, null, 2) + "\n";
}, 300_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function islet(...args: string[]) {
  return spawnSync(process.execPath, [cli, ...args], { cwd: root, encoding: "utf8", timeout: 300_000, maxBuffer: 1 << 28 });
}

describe("progress and standard output", () => {
  it("with stderr not a terminal: no progress on stderr, and stdout byte-identical to the library's table and JSON", () => {
    const table = islet("study", big);
    expect(table.status).toBe(0);
    expect(table.stderr).toBe("");
    expect(table.stdout).toBe(expectedTable);
    const json = islet("study", big, "--json", "--threads", "2");
    expect(json.status).toBe(0);
    expect(json.stderr).toBe("");
    expect(json.stdout).toBe(expectedJson);
  }, 300_000);

  it.skipIf(!HAS_SCRIPT)("with stderr a terminal: the progress line is drawn and erased there, and stdout is unchanged", async () => {
    const out = join(dir, "tty-table.txt");
    const r = await ptyRun(`${sh(process.execPath)} ${sh(cli)} study ${sh(big)} > ${sh(out)}`);
    expect(r.code).toBe(0);
    expect(readFileSync(out, "utf8")).toBe(expectedTable);
    const frames = r.screen.split(ERASE_LINE).filter((f) => f.length > 0);
    expect(frames.length).toBeGreaterThan(0);
    for (const f of frames) expect(f).toMatch(/^islet study: bus faults [\d,]+ of [\d,]+ \(\d+%\), \d+:\d\d elapsed/);
    // the last thing on the terminal erases the line
    expect(r.screen.endsWith(ERASE_LINE)).toBe(true);
  }, 300_000);

  it.skipIf(!HAS_SCRIPT)("with --quiet nothing is drawn even on a terminal", async () => {
    const out = join(dir, "quiet.json");
    const r = await ptyRun(`${sh(process.execPath)} ${sh(cli)} study ${sh(big)} --json --quiet > ${sh(out)}`);
    expect(r.code).toBe(0);
    expect(r.screen).toBe("");
    expect(readFileSync(out, "utf8")).toBe(expectedJson);
  }, 300_000);
});
