// Names holding terminal escape sequences, CR, BEL, C1 and bidi controls (issue: they could hide lines of output)
// reach the terminal escaped from every command. The controls are the ones ECMA-48 and UAX #9 define (see
// terminalText.test.ts); the checker below is written from those lists, not from the module under test.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { validateCommand } from "../../../src/cli/commands/validate.ts";
import { summaryCommand } from "../../../src/cli/commands/summary.ts";
import { studyCommand } from "../../../src/cli/commands/study.ts";
import { reportCommand } from "../../../src/cli/commands/report.ts";

const root = fileURLToPath(new URL("../../../", import.meta.url));
const demoPath = join(root, "assets/demo/dairy-coop.islet");
// erase line, cursor up, carriage return, a forged verdict, BEL, RLO (reverses what follows), LRI, a one-byte C1 CSI
const HOSTILE = "\x1b[2K\x1b[1A\rALL CHECKS PASSED\x07\u202eSSAP\u2066\u009b31m";

let dir = "";
let hostilePath = "";
let invalidPath = "";

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "islet-hostile-"));
  const doc = JSON.parse(readFileSync(demoPath, "utf8"));
  doc.meta.name = `Site\n  every verdict passes${HOSTILE}`;
  doc.scenarios[0].name = `Grid${HOSTILE}`;
  doc.elements.find((e: { id: string }) => e.id === "MV-POC").name = `POC${HOSTILE}`;
  hostilePath = join(dir, "hostile.islet");
  writeFileSync(hostilePath, JSON.stringify(doc));
  doc.elements.find((e: { id: string }) => e.id === "C-INC").length_km = -1;
  doc.elements.find((e: { id: string }) => e.id === "C-INC").name = `Incomer${HOSTILE}\nerror: none`;
  invalidPath = join(dir, "invalid.islet");
  writeFileSync(invalidPath, JSON.stringify(doc));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));
afterEach(() => vi.restoreAllMocks());

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(console, "log").mockImplementation((...a: unknown[]) => void out.push(a.join(" ")));
  vi.spyOn(console, "error").mockImplementation((...a: unknown[]) => void err.push(a.join(" ")));
  return { out: () => out.join("\n"), err: () => err.join("\n") };
}

/** The characters a terminal would act on, other than line feed: C0, DEL, C1 (ECMA-48), bidi controls (UAX #9). */
function rawControls(text: string): string[] {
  const bad: string[] = [];
  for (const ch of text) {
    const c = ch.codePointAt(0)!;
    if ((c < 0x20 && c !== 0x0a) || (c >= 0x7f && c <= 0x9f) || (c >= 0x202a && c <= 0x202e) || (c >= 0x2066 && c <= 0x2069) || c === 0x200e || c === 0x200f || c === 0x061c || c === 0x2028 || c === 0x2029)
      bad.push(`U+${c.toString(16).padStart(4, "0")}`);
  }
  return bad;
}

describe("hostile names on the terminal", () => {
  it("validate: the name is shown escaped on its one line, in text and in JSON", async () => {
    const io = capture();
    expect(await validateCommand.run([hostilePath])).toBe(0);
    expect(rawControls(io.out())).toEqual([]);
    // the line feed in the name is escaped too: still exactly one line, so no line is forged
    expect(io.out().split("\n")).toHaveLength(1);
    expect(io.out()).toContain("Site\\x0A  every verdict passes\\x1B[2K\\x1B[1A\\x0DALL CHECKS PASSED\\x07\\u202ESSAP\\u2066\\u009B31m");
    const json = capture();
    expect(await validateCommand.run([hostilePath, "--json"])).toBe(0);
    expect(rawControls(json.out())).toEqual([]);
    expect(JSON.parse(json.out()).name).toBe(`Site\n  every verdict passes${HOSTILE}`);
  });

  it("validate: a problem naming a hostile element is one escaped line on stderr", async () => {
    const io = capture();
    expect(await validateCommand.run([invalidPath])).toBe(1);
    expect(rawControls(io.err())).toEqual([]);
    const lines = io.err().split("\n");
    expect(lines.filter((l) => l.startsWith("  error: "))).toHaveLength(1);
    expect(lines.find((l) => l.includes("length_km"))).toContain("Incomer\\x1B[2K");
  });

  it("summary and study: names escaped in the tables", async () => {
    const s = capture();
    expect(await summaryCommand.run([hostilePath])).toBe(0);
    expect(rawControls(s.out())).toEqual([]);
    expect(s.out()).toContain('Grid\\x1B[2K\\x1B[1A\\x0DALL CHECKS PASSED');
    const t = capture();
    expect(await studyCommand.run([hostilePath, "--scenario", "grid-all"])).toBe(0);
    expect(rawControls(t.out())).toEqual([]);
    expect(t.out()).toContain('"Grid\\x1B[2K');
    const j = capture();
    expect(await studyCommand.run([hostilePath, "--scenario", "grid-all", "--json"])).toBe(0);
    expect(rawControls(j.out())).toEqual([]);
    expect(JSON.parse(j.out()).runs[0].scenarioName).toBe(`Grid${HOSTILE}`);
  });

  it("report: the summary line escapes the project name", async () => {
    const io = capture();
    const out = join(dir, "report");
    expect(await reportCommand.run([hostilePath, "--out", out, "--format", "csv", "--date", "2026-12-04"])).toBe(0);
    expect(rawControls(io.out())).toEqual([]);
    expect(io.out()).toContain("Site\\x0A  every verdict passes\\x1B[2K");
  }, 300_000);

  it("usage errors escape what the user typed", async () => {
    const io = capture();
    expect(await studyCommand.run([hostilePath, `--x\x1b[2K`])).toBe(2);
    expect(rawControls(io.err())).toEqual([]);
    expect(io.err()).toContain("unknown option --x\\x1B[2K");
  });

  it("check, run as a user runs it: the verdict lines and the JSON Lines carry no raw control", () => {
    const run = (...args: string[]) => spawnSync(process.execPath, [join(root, "src/cli/islet.mjs"), "check", hostilePath, "--scenario", "grid-all", "--fault", "3ph", ...args], { cwd: root, encoding: "utf8", timeout: 300_000, maxBuffer: 1 << 28 });
    const text = run();
    expect([0, 1]).toContain(text.status);
    expect(rawControls(text.stdout)).toEqual([]);
    expect(rawControls(text.stderr)).toEqual([]);
    expect(text.stdout).toContain("(Grid\\x1B[2K\\x1B[1A\\x0DALL CHECKS PASSED");
    const json = run("--json");
    expect(rawControls(json.stdout)).toEqual([]);
    // JSON Lines: every line parses, and the scenario's name comes back exactly as the file holds it
    const values = json.stdout.trimEnd().split("\n").map((l) => JSON.parse(l) as { type?: string; label?: string });
    expect(values.some((v) => v.type === "case" && v.label?.includes(`(Grid${HOSTILE}, max)`))).toBe(true);
  }, 300_000);
});
