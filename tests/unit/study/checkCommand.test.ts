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
    expect(a.ok && a.value).toEqual({ file: "f.islet", json: true, scenarios: ["s1"], buses: ["B1", "B2"], faults: ["LG"] });
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

  it("prints JSON with every device's current, pickup state, times and role, and exits 1 exactly when a verdict fails", async () => {
    const io = capture();
    const code = await checkCommand.run([DEMO, "--scenario", "grid-all", "--bus", "LV-A", "--fault", "3ph", "--json"]);
    const json = JSON.parse(io.out.join("\n"));
    expect(code).toBe(json.summary.failed > 0 ? 1 : 0);
    expect(json.ok).toBe(json.summary.failed === 0);
    expect(json.caution).toMatch(/licensed engineer/);
    const lvA = json.cases.find((c: { id: string }) => c.id === "grid-all|bus:LV-A|3ph|max");
    expect(lvA.location).toEqual({ kind: "bus", bus: "LV-A" });
    const incomer = lvA.devices.find((d: { device: string }) => d.device === "Q-T1");
    expect(Object.keys(incomer).sort()).toEqual(
      ["current_A", "device", "direction", "negative_A", "operatingElement", "pickedUp", "residual_A", "role", "tClearMax_s", "tClearMin_s", "tClear_s", "tOperate_s"].sort(),
    );
    expect(incomer.role).toBe("primary");
    // every verdict id a case lists is in the verdict list
    const ids = new Set(json.verdicts.map((v: { id: string }) => v.id));
    for (const c of json.cases) for (const id of c.verdicts) expect(ids.has(id)).toBe(true);
  });

  it("prints the caution line in the human report", async () => {
    const io = capture();
    await checkCommand.run([DEMO, "--scenario", "grid-all", "--bus", "LV-B", "--fault", "LL"]);
    expect(io.out.at(-1)).toBe("Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.");
    expect(io.out.join("\n")).toMatch(/Totals:/);
  });
});
