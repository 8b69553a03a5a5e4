import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { checkCommand, parseCheckArgs } from "../../../src/cli/commands/check.ts";

const DEMO = new URL("../../../assets/demo/dairy-coop.islet", import.meta.url).pathname;

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(console, "log").mockImplementation((...a: unknown[]) => void out.push(a.join(" ")));
  vi.spyOn(console, "error").mockImplementation((...a: unknown[]) => void err.push(a.join(" ")));
  return { out, err };
}

afterEach(() => vi.restoreAllMocks());

describe("islet check", () => {
  it("reads repeated filters and refuses unknown options and fault types", () => {
    const a = parseCheckArgs(["f.islet", "--scenario", "s1", "--bus", "B1", "--bus", "B2", "--fault", "lg", "--json"]);
    expect(a.ok && a.value).toEqual({ file: "f.islet", json: true, scenarios: ["s1"], buses: ["B1", "B2"], faults: ["LG"], quiet: false });
    expect(parseCheckArgs(["f.islet", "--fault", "2ph"]).ok).toBe(false);
    expect(parseCheckArgs(["f.islet", "--colour"]).ok).toBe(false);
    expect(parseCheckArgs(["--json"]).ok).toBe(false);
  });

  it("exits 2 on a file that is not a project, naming the problem", async () => {
    const dir = mkdtempSync(join(tmpdir(), "islet-check-"));
    const bad = join(dir, "bad.islet");
    writeFileSync(bad, '{"format": "something-else"}');
    const io = capture();
    expect(await checkCommand.run([bad])).toBe(2);
    expect(io.err.join("\n")).toMatch(/not a valid Islet project/);
    expect(await checkCommand.run([join(dir, "missing.islet")])).toBe(2);
  });

  it("exits 2 on a scenario the file does not have", async () => {
    const io = capture();
    expect(await checkCommand.run([DEMO, "--scenario", "no-such-scenario"])).toBe(2);
    expect(io.err.join("\n")).toMatch(/scenario no-such-scenario is not in/);
  });

  it("streams JSON Lines: a header, one line per case with its expected and simulated operation, the verdicts and a summary; exit 1 exactly when a verdict fails", async () => {
    const io = capture();
    const written: string[] = [];
    vi.spyOn(process.stdout, "write").mockImplementation(((chunk: string) => {
      written.push(String(chunk));
      return true;
    }) as typeof process.stdout.write);
    const code = await checkCommand.run([DEMO, "--scenario", "grid-all", "--bus", "LV-A", "--fault", "3ph", "--json"]);
    expect(io.out).toEqual([]);
    // one JSON object per line, each line written on its own (never one giant string)
    expect(written.every((w) => w.endsWith("\n") && w.indexOf("\n") === w.length - 1)).toBe(true);
    const lines = written.map((w) => JSON.parse(w));
    expect(lines[0]).toMatchObject({ type: "header", format: "islet-check", formatVersion: 2 });
    expect(lines[0].caution).toMatch(/licensed engineer/);
    const summary = lines.at(-1);
    expect(summary.type).toBe("summary");
    expect(code).toBe(summary.failed > 0 ? 1 : 0);
    expect(summary.ok).toBe(summary.failed === 0);
    const cases = lines.filter((l) => l.type === "case");
    const verdicts = lines.filter((l) => l.type === "verdict");
    expect(summary.cases).toBe(cases.length);
    expect(summary.verdicts).toBe(verdicts.length);
    const lvA = cases.find((c) => c.id === "grid-all|bus:LV-A|3ph|max");
    expect(lvA.location).toEqual({ kind: "bus", bus: "LV-A" });
    for (const field of ["ideal", "backups", "operations", "isolated_s", "unwanted", "loadLost_kW", "idealLoadLost_kW"]) expect(lvA).toHaveProperty(field);
    // the board's two sections are one zone (the coupler has no protection): the incomers of both transformers and
    // the breakers of the genset and the grid-forming battery bound it; the grid-following PV ceases on its own
    expect(lvA.zoneBuses.sort()).toEqual(["LV-A", "LV-B"]);
    expect([...lvA.ideal].sort()).toEqual(["Q-BESS", "Q-GEN", "Q-T1", "Q-T2"]);
    expect(lvA.selfCeasing).toEqual(["INV-PV"]);
    for (const op of lvA.operations) expect(typeof op.device === "string" && typeof op.t_s === "number").toBe(true);
    // every verdict id a case lists is in the verdict lines
    const ids = new Set(verdicts.map((v) => v.id));
    for (const c of cases) for (const id of c.verdicts) expect(ids.has(id)).toBe(true);
  });

  it("prints the caution line in the human report", async () => {
    const io = capture();
    await checkCommand.run([DEMO, "--scenario", "grid-all", "--bus", "LV-B", "--fault", "LL"]);
    expect(io.out.join("\n").split("\n").at(-1)).toBe("Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.");
    expect(io.out.join("\n")).toMatch(/Totals:/);
  });
});
