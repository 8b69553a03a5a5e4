import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { handleStudyRequest } from "../../../src/study/rpc/handleStudyRequest.ts";
import type { StudyProgress } from "../../../src/study/types.ts";

const text = readFileSync(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8");

describe("the study worker's request handler", () => {
  it("runs a full study from the file text, reporting progress up to the total", async () => {
    const progress: StudyProgress[] = [];
    const r = await handleStudyRequest(
      { kind: "full", requestId: "a", project: text, options: { scenarios: ["grid-no-inverters"], faultTypes: ["3ph"], limits: ["max"] } },
      { onProgress: (p) => progress.push(p), yieldNow: async () => {} },
    );
    expect(r.kind).toBe("full");
    if (r.kind !== "full") return;
    expect(r.result.cases.length).toBeGreaterThan(0);
    expect(progress.at(-1)!.done).toBe(progress.at(-1)!.total);
    expect(r.result.matrix.cells.length).toBe(r.result.cases.length);
  });

  it("stops between cases when the signal is aborted", async () => {
    const signal = { aborted: false };
    const r = await handleStudyRequest(
      { kind: "full", requestId: "b", project: text, options: { scenarios: ["grid-no-inverters"], limits: ["max"] } },
      { signal, onProgress: () => void (signal.aborted = true), yieldNow: async () => {} },
    );
    expect(r).toEqual({ kind: "cancelled", requestId: "b", ok: false });
  });

  it("answers one case with its chains and device responses", async () => {
    const r = await handleStudyRequest({ kind: "case", requestId: "c", project: text, caseId: "grid-no-inverters|bus:LV-CS|3ph|max" });
    if (r.kind !== "case") throw new Error(r.kind);
    // the cold store feeder breaker alone isolates its board from the grid and the genset behind it
    expect(r.result.operation.ideal).toEqual(["Q-CS"]);
    expect(r.result.chains.paths).toHaveLength(1);
    expect([...r.result.chains.paths[0].links.map((l) => l.device)].slice(0, 1)).toEqual(["Q-CS"]);
    expect([...r.result.responses.find((x) => x.device === "Q-CS")!.onPathsOf].sort()).toEqual(["GEN1", "GRID"]);
    // the case request runs the same verdict kinds as the full study
    const kinds = new Set(r.verdicts.map((v) => v.kind));
    for (const k of ["sensitivity", "backup", "speed"] as const) expect(kinds.has(k)).toBe(true);
    expect(r.verdicts.every((v) => v.caseId === "grid-no-inverters|bus:LV-CS|3ph|max")).toBe(true);
  });

  it("names what is wrong with a broken project instead of throwing", async () => {
    const r = await handleStudyRequest({ kind: "full", requestId: "d", project: "{ not json" });
    expect(r.kind).toBe("error");
    if (r.kind === "error") expect(r.message).toMatch(/not valid JSON/);
  });
});
