import { describe, expect, it } from "vitest";
import type { StudyMatrix, Verdict, VerdictKind, VerdictStatus } from "../../../src/study/types.ts";
import { VERDICT_KINDS } from "../../../src/study/types.ts";
import { buildShownMatrix, defaultRowGroup, flattenGroups } from "../../../renderer/panes/verdicts/verdictRows.ts";

const v = (id: string, kind: VerdictKind, status: VerdictStatus, caseId: string): Verdict => ({
  id,
  kind,
  status,
  scenario: caseId.split("|")[0],
  caseId,
  device: "R1",
  other: null,
  numbers: {},
  explanation: id,
});

// Two scenarios, three fault rows on two buses; row 3 is not studied in the islanded scenario.
const verdicts = [
  v("a1", "selectivity", "fail", "grid|bus:LV-A|3ph|max"),
  v("a2", "sensitivity", "pass", "grid|bus:LV-A|3ph|max"),
  v("a3", "speed", "warn", "island|bus:LV-A|3ph|max"),
  v("b1", "sensitivity", "pass", "grid|bus:LV-A|LG|min"),
  v("b2", "sensitivity", "warn", "island|bus:LV-A|LG|min"),
  v("c1", "blinding", "fail", "grid|bus:MV-1|3ph|min"),
];
const matrix: StudyMatrix = {
  scenarios: [
    { id: "grid", name: "Grid-tied" },
    { id: "island", name: "Islanded" },
  ],
  rows: [
    { id: "bus:LV-A|3ph|max", label: "3ph max at LV-A" },
    { id: "bus:LV-A|LG|min", label: "LG min at LV-A" },
    { id: "bus:MV-1|3ph|min", label: "3ph min at MV-1" },
  ],
  cells: [
    { row: "bus:LV-A|3ph|max", scenario: "grid", caseId: "grid|bus:LV-A|3ph|max", worst: "fail", counts: { fail: 1, warn: 0, pass: 1 }, verdictIds: ["a1", "a2"] },
    { row: "bus:LV-A|3ph|max", scenario: "island", caseId: "island|bus:LV-A|3ph|max", worst: "warn", counts: { fail: 0, warn: 1, pass: 0 }, verdictIds: ["a3"] },
    { row: "bus:LV-A|LG|min", scenario: "grid", caseId: "grid|bus:LV-A|LG|min", worst: "pass", counts: { fail: 0, warn: 0, pass: 1 }, verdictIds: ["b1"] },
    { row: "bus:LV-A|LG|min", scenario: "island", caseId: "island|bus:LV-A|LG|min", worst: "warn", counts: { fail: 0, warn: 1, pass: 0 }, verdictIds: ["b2"] },
    { row: "bus:MV-1|3ph|min", scenario: "grid", caseId: "grid|bus:MV-1|3ph|min", worst: "fail", counts: { fail: 1, warn: 0, pass: 0 }, verdictIds: ["c1"] },
  ],
  totals: {} as StudyMatrix["totals"],
};
const byId = new Map(verdicts.map((x) => [x.id, x]));
const all = { statuses: new Set<VerdictStatus>(["fail", "warn", "pass"]), kinds: new Set<VerdictKind>(VERDICT_KINDS) };

describe("the verdict matrix as shown", () => {
  it("colours each cell by its worst verdict and groups rows by bus", () => {
    const m = buildShownMatrix(matrix, byId, all);
    expect(m.groups.map((g) => g.label)).toEqual(["LV-A", "MV-1"]);
    const first = m.groups[0].rows[0];
    // hand count of the fixture: fail + pass -> fail; warn -> warn
    expect(first.cells.map((c) => c?.worst)).toEqual(["fail", "warn"]);
    expect(m.groups[1].rows[0].cells[1]).toBeNull();
  });

  it("counts cells by worst verdict per scenario in the totals row", () => {
    const m = buildShownMatrix(matrix, byId, all);
    // hand count: grid column fail, pass, fail; islanded column warn, warn
    expect(m.totals).toEqual([
      { fail: 2, warn: 0, pass: 1 },
      { fail: 0, warn: 2, pass: 0 },
    ]);
  });

  it("counts only the kinds the filter keeps", () => {
    const m = buildShownMatrix(matrix, byId, { statuses: all.statuses, kinds: new Set<VerdictKind>(["sensitivity"]) });
    // only a2, b1, b2 are sensitivity verdicts; the MV-1 row has none and disappears
    expect(m.rowCount).toBe(2);
    expect(m.groups[0].rows[0].cells.map((c) => c?.worst ?? null)).toEqual(["pass", null]);
    expect(m.groups[0].rows[1].cells.map((c) => c?.worst ?? null)).toEqual(["pass", "warn"]);
  });

  it("shows only failing rows when only 'fail' is kept", () => {
    const m = buildShownMatrix(matrix, byId, { statuses: new Set<VerdictStatus>(["fail"]), kinds: all.kinds });
    expect(m.groups.flatMap((g) => g.rows.map((r) => r.row.id))).toEqual(["bus:LV-A|3ph|max", "bus:MV-1|3ph|min"]);
    expect(m.groups[0].rows[0].cells[0]?.verdictIds).toEqual(["a1"]);
  });

  it("groups a row id without a location prefix under itself", () => {
    expect(defaultRowGroup({ id: "odd", label: "odd" })).toEqual({ key: "odd", label: "odd" });
  });

  it("groups every point along a line under that line", () => {
    // row ids as src/study/faultCases.ts writes them: line:<id>@<pct>|<type>|<limit>
    const a = defaultRowGroup({ id: "line:C1@10|LL|min", label: "" });
    const b = defaultRowGroup({ id: "line:C1@90|3ph|max", label: "" });
    expect(a.key).toBe(b.key);
    expect(a.label).toBe("C1, along the line");
  });

  it("leaves the rows of a collapsed group out of the list", () => {
    const m = buildShownMatrix(matrix, byId, all);
    const open = flattenGroups(m.groups, new Set());
    const shut = flattenGroups(m.groups, new Set(["bus:LV-A"]));
    // 2 headers + 3 rows open; 2 headers + the 1 MV-1 row when LV-A is collapsed
    expect(open).toHaveLength(5);
    expect(shut).toHaveLength(3);
  });

  it("handles a study of several thousand cases", () => {
    const rows = Array.from({ length: 3000 }, (_, k) => ({ id: `bus:B${k % 40}|3ph|max|${k}`, label: `case ${k}` }));
    const status = (k: number): VerdictStatus => (k % 3 === 0 ? "fail" : "pass");
    const cells = rows.map((r, k) => ({
      row: r.id,
      scenario: "grid",
      caseId: `c${k}`,
      worst: status(k),
      counts: { fail: k % 3 === 0 ? 1 : 0, warn: 0, pass: k % 3 === 0 ? 0 : 1 },
      verdictIds: [`v${k}`],
    }));
    const big: StudyMatrix = { scenarios: [{ id: "grid", name: "Grid" }], rows, cells, totals: matrix.totals };
    const vs = new Map(cells.map((c, k) => [`v${k}`, v(`v${k}`, "speed", status(k), c.caseId)]));
    const m = buildShownMatrix(big, vs, all);
    // 40 buses; k % 3 === 0 holds for 1000 of 3000 cases (hand count)
    expect(m.groups).toHaveLength(40);
    expect(m.totals[0]).toEqual({ fail: 1000, warn: 0, pass: 2000 });
    // the same answer through the filtered path (only speed kept, every status)
    const speedOnly = buildShownMatrix(big, vs, { statuses: all.statuses, kinds: new Set<VerdictKind>(["speed"]) });
    expect(speedOnly.totals[0]).toEqual({ fail: 1000, warn: 0, pass: 2000 });
  });
});
