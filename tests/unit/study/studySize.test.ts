// A study's size is worked out before it runs, and a study over the case budget is refused with its numbers.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { checkCommand } from "../../../src/cli/commands/check.ts";
import { serializeProject } from "../../../src/model/projectFile.ts";
import { handleStudyRequest } from "../../../src/study/rpc/handleStudyRequest.ts";
import { studyProject } from "../../../src/study/studyProject.ts";
import { checkStudySize, studySize, StudyTooLarge } from "../../../src/study/studySize.ts";
import { enumerateFaultCases } from "../../../src/study/faultCases.ts";
import { makeProject } from "./fixtures.ts";

const cable = { length_km: 0.1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.4, x0_ohmPerKm: 0.3, csa_mm2: 240, ampacity_A: 400 };
/** A grid, a bus and a cable; `scenarios` scenarios each at both limits, 19 points along the cable. */
function site(scenarios: number) {
  return makeProject(
    [
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "B", un_kV: 11 },
      { kind: "grid", id: "G", bus: "A", skMax_MVA: 200, skMin_MVA: 150 },
      { kind: "line", id: "L", fromBus: "A", toBus: "B", ...cable },
    ],
    Array.from({ length: scenarios }, (_, k) => ({ id: `s${k}`, name: `Mode ${k}`, limits: ["max", "min"] })),
    { linePoints_pct: Array.from({ length: 19 }, (_, k) => 5 * (k + 1)) },
  );
}

afterEach(() => vi.restoreAllMocks());

describe("the size of a study", () => {
  it("counts what the study would simulate: scenarios x locations x fault types x limits", () => {
    const p = site(3);
    // 2 buses + 19 line points = 21 locations, 4 fault types, 2 limits, 3 scenarios = 504 cases
    expect(studySize(p)).toEqual({ cases: 504, scenarios: 3, locations: 21, faultTypes: 4 });
    expect(studySize(p).cases).toBe(enumerateFaultCases(p).length);
    expect(studySize(p, { faultTypes: ["LG"], scenarios: ["s1"] }).cases).toBe(42);
  });

  it("refuses a study over the budget, with its numbers, before running anything", async () => {
    const p = site(3);
    expect(() => checkStudySize(p, {}, 500)).toThrow(StudyTooLarge);
    expect(() => checkStudySize(p, {}, 500)).toThrow(/504 fault cases \(3 scenario\(s\), up to 21 fault locations each, 4 fault type\(s\).*over the budget of 500/);
    await expect(studyProject(p, {}, {}, 500)).rejects.toThrow(StudyTooLarge);
    // within budget it runs
    expect((await studyProject(p, {}, {}, 504)).cases).toHaveLength(504);
  });

  it("makes islet check exit 2 with the numbers, and the studio's worker answer with them", async () => {
    // a 50-bus chain, 19 points on each of its 49 cables (981 locations), 256 scenarios (the schema's limit) at both
    // limits: 981 x 4 x 2 x 256 = 2,009,088 cases, over the budget of 1,000,000
    const elements: unknown[] = [{ kind: "grid", id: "G", bus: "B0", skMax_MVA: 200, skMin_MVA: 150 }];
    for (let k = 0; k < 50; k++) elements.push({ kind: "bus", id: `B${k}`, un_kV: 11 });
    for (let k = 1; k < 50; k++) elements.push({ kind: "line", id: `L${k}`, fromBus: `B${k - 1}`, toBus: `B${k}`, ...cable });
    const big = makeProject(
      elements,
      Array.from({ length: 256 }, (_, k) => ({ id: `s${k}`, name: `Mode ${k}`, limits: ["max", "min"] })),
      { linePoints_pct: Array.from({ length: 19 }, (_, k) => 5 * (k + 1)) },
    );
    expect(studySize(big).cases).toBe(2_009_088);
    const dir = mkdtempSync(join(tmpdir(), "islet-size-"));
    const file = join(dir, "big.islet");
    writeFileSync(file, serializeProject(big));
    const err: string[] = [];
    vi.spyOn(console, "error").mockImplementation((...a: unknown[]) => void err.push(a.join(" ")));
    vi.spyOn(console, "log").mockImplementation(() => {});
    expect(await checkCommand.run([file, "--quiet"])).toBe(2);
    expect(err.join("\n")).toMatch(/islet check: The study would have 2,009,088 fault cases .* over the budget of 1,000,000/);
    const answer = await handleStudyRequest({ kind: "full", requestId: "r", project: big });
    expect(answer.kind).toBe("error");
    if (answer.kind === "error") expect(answer.message).toMatch(/2,009,088 fault cases/);
  });
});
