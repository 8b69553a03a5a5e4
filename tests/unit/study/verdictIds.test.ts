import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { loadProject } from "../../../src/model/projectFile.ts";
import type { Project } from "../../../src/model/schema.ts";
import { studyProject } from "../../../src/study/studyProject.ts";
import { FAULT_TYPES, type StudyResult, type VerdictStatus } from "../../../src/study/types.ts";
import { verdictIdsDistinct } from "../../../src/study/verdictIds.ts";

const loaded = loadProject(readFileSync(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8"));
if (!loaded.ok) throw new Error(loaded.error.messages.join("\n"));
const demo = loaded.project;

/** Each verdict listed once, and each matrix cell counting the statuses of the verdicts its case lists (recounted here). */
function expectConsistent(r: StudyResult): void {
  const ids = r.verdicts.map((v) => v.id);
  expect(new Set(ids).size).toBe(ids.length);
  const byId = new Map(r.verdicts.map((v) => [v.id, v] as const));
  for (const cell of r.matrix.cells) {
    const counts: Record<VerdictStatus, number> = { pass: 0, warn: 0, fail: 0 };
    for (const id of cell.verdictIds) counts[byId.get(id)!.status]++;
    expect(cell.counts).toEqual(counts);
  }
}

describe("verdict ids", () => {
  it("cannot repeat in the demo, whose ids hold no separator", async () => {
    expect(verdictIdsDistinct(demo, demo.scenarios, FAULT_TYPES, (s) => s.limits)).toBe(true);
    expectConsistent(await studyProject(demo, { scenarios: ["grid-all", "island-genset"] }));
  });

  it("are looked up for repeats when device ids hold separators or a fault type is asked for twice", async () => {
    // every relay id gets "|" and ">" (the separators of verdict ids), everywhere it is referred to
    const text = JSON.stringify(demo).replace(/"(R-[A-Z0-9-]+)"/g, (_m, id: string) => `"${id}|a>b"`);
    const odd = JSON.parse(text) as Project;
    expect(odd.elements.some((e) => e.id === "R-T1|a>b")).toBe(true);
    expect(verdictIdsDistinct(odd, odd.scenarios, FAULT_TYPES, (s) => s.limits)).toBe(false);
    expect(verdictIdsDistinct(demo, demo.scenarios, ["LG", "3ph", "LG"], (s) => s.limits)).toBe(false);
    const r = await studyProject(odd, { scenarios: ["grid-all"], faultTypes: ["LG", "3ph", "LG"] });
    expect(r.verdicts.length).toBeGreaterThan(0);
    expectConsistent(r);
  });
});
