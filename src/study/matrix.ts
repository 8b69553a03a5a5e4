// The study matrix: fault cases (location, type, limit) by scenarios, the worst verdict in each cell,
// and totals by verdict kind and status.
import type { Scenario } from "../model/schema.ts";
import { caseRowId, locationLabel } from "./faultCases.ts";
import type { Element } from "../model/schema.ts";
import { VERDICT_KINDS, type CaseResult, type MatrixCell, type MatrixRow, type StudyMatrix, type Verdict, type VerdictKind, type VerdictStatus } from "./types.ts";

const RANK: Record<VerdictStatus, number> = { pass: 0, warn: 1, fail: 2 };

export function worstStatus(statuses: Iterable<VerdictStatus>): VerdictStatus | null {
  let worst: VerdictStatus | null = null;
  for (const s of statuses) if (worst === null || RANK[s] > RANK[worst]) worst = s;
  return worst;
}

/** What the caller may already hold (a large study has 10^5 verdicts): the verdicts by id, or each case's counts. */
export interface MatrixInputs {
  verdictById?: ReadonlyMap<string, Verdict>;
  /** Per case (in `cases` order), the statuses of the verdicts its verdictIds list; each becomes its cell's counts. */
  caseCounts?: Record<VerdictStatus, number>[];
}

export function studyMatrix(scenarios: Scenario[], cases: CaseResult[], verdicts: Verdict[], elements: ReadonlyMap<string, Element>, known: MatrixInputs = {}): StudyMatrix {
  const { caseCounts } = known;
  const byId = caseCounts ? null : (known.verdictById ?? new Map(verdicts.map((v) => [v.id, v] as const)));
  const rows: MatrixRow[] = [];
  const rowSeen = new Set<string>();
  const cells: MatrixCell[] = [];
  const used = new Set<string>();
  cases.forEach((c, i) => {
    const fc = c.faultCase;
    const row = caseRowId(fc);
    if (!rowSeen.has(row)) {
      rowSeen.add(row);
      rows.push({ id: row, label: `${fc.faultType} fault on ${locationLabel(fc.location, elements)} (${fc.limit})` });
    }
    used.add(fc.scenario);
    let counts: Record<VerdictStatus, number>;
    if (byId) {
      counts = { pass: 0, warn: 0, fail: 0 };
      for (const id of c.verdictIds) {
        const v = byId.get(id);
        if (v) counts[v.status]++;
      }
    } else counts = caseCounts![i];
    const worst = counts.fail ? "fail" : counts.warn ? "warn" : counts.pass ? "pass" : null;
    cells.push({ row, scenario: fc.scenario, caseId: fc.id, worst, counts, verdictIds: c.verdictIds });
  });
  const totals = Object.fromEntries(VERDICT_KINDS.map((k) => [k, { pass: 0, warn: 0, fail: 0 }])) as Record<VerdictKind, Record<VerdictStatus, number>>;
  for (const v of verdicts) totals[v.kind][v.status]++;
  return {
    scenarios: scenarios.filter((s) => used.has(s.id)).map((s) => ({ id: s.id, name: s.name })),
    rows,
    cells,
    totals,
  };
}
