import { describe, expect, it, vi, afterEach } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { studyCommand } from "../../../src/cli/commands/study.ts";
import { loadProject } from "../../../src/model/projectFile.ts";
import { compileNetwork, solveFault, CAUTION } from "../../../src/engine/index.ts";

const demo = join(__dirname, "../../../assets/demo/dairy-coop.islet");

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(console, "log").mockImplementation((...a: unknown[]) => void out.push(a.join(" ")));
  vi.spyOn(console, "error").mockImplementation((...a: unknown[]) => void err.push(a.join(" ")));
  return { out, err };
}
afterEach(() => vi.restoreAllMocks());

describe("islet study", () => {
  it("prints only JSON with --json, with every bus and fault type per scenario and limit", async () => {
    const io = capture();
    const code = await studyCommand.run([demo, "--json", "--scenario", "grid-all"]);
    expect(code).toBe(0);
    const doc = JSON.parse(io.out.join("\n"));
    expect(doc.ok).toBe(true);
    expect(doc.caution).toBe(CAUTION);
    const loaded = loadProject(readFileSync(demo, "utf8"));
    if (!loaded.ok) throw new Error("demo");
    const scenario = loaded.project.scenarios.find((s) => s.id === "grid-all")!;
    expect(doc.runs.map((r: { limit: string }) => r.limit)).toEqual(scenario.limits);
    const buses = loaded.project.elements.filter((e) => e.kind === "bus").map((e) => e.id);
    for (const run of doc.runs) {
      expect(run.buses.map((b: { bus: string }) => b.bus).sort()).toEqual([...buses].sort());
      // Each figure equals the single-fault solution (the sweep and the single solver are separate code paths).
      const c = compileNetwork(loaded.project, { scenario: "grid-all", limit: run.limit });
      if (!c.ok) throw new Error("compile");
      const row = run.buses[run.buses.length - 1];
      for (const t of ["3ph", "LL", "LG", "LLG"] as const) {
        expect(row.ikss_kA[t]).toBeCloseTo(solveFault(c.network, { kind: "bus", bus: row.bus }, t).ikss_kA, 9);
      }
    }
  });
  it("prints a table with the caution line", async () => {
    const io = capture();
    expect(await studyCommand.run([demo, "--scenario=grid-all"])).toBe(0);
    const text = io.out.join("\n");
    expect(text).toContain("3ph kA");
    expect(text).toContain(CAUTION);
  });
  it("refuses an unknown scenario and an unknown option (exit 2)", async () => {
    const io = capture();
    expect(await studyCommand.run([demo, "--scenario", "nope"])).toBe(2);
    expect(io.err.join("\n")).toMatch(/scenario "nope" not found/);
    expect(await studyCommand.run([demo, "--fast"])).toBe(2);
    expect(await studyCommand.run([demo, "--threads", "0"])).toBe(2);
    expect(io.err.join("\n")).toMatch(/--threads needs a whole number/);
  });
  it("gives the same JSON, figure for figure, with the sweeps shared among threads", async () => {
    const io = capture();
    expect(await studyCommand.run([demo, "--json"])).toBe(0);
    const one = io.out.join("\n");
    io.out.length = 0;
    expect(await studyCommand.run([demo, "--json", "--threads", "2"])).toBe(0);
    expect(io.out.join("\n")).toBe(one);
    expect(JSON.parse(one).runs.length).toBeGreaterThan(3);
  });
});
