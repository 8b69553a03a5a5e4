// The study matrix as the verdict pane shows it: only the verdicts the filters keep are counted,
// each cell takes the worst of them, rows without any are hidden, rows are grouped (by bus or line),
// and a totals row counts cells per scenario.
import type { MatrixRow, StudyMatrix, Verdict, VerdictKind } from "../../../src/study/types.ts";
import { worseStatus, type VerdictStatus } from "../shared/verdictStatus.ts";

export interface VerdictFilter {
  statuses: ReadonlySet<VerdictStatus>;
  kinds: ReadonlySet<VerdictKind>;
}

export interface ShownCell {
  scenario: string;
  caseId: string;
  worst: VerdictStatus | null;
  counts: Record<VerdictStatus, number>;
  /** Ids of the verdicts the filters keep. */
  verdictIds: string[];
}

export interface ShownRow {
  row: MatrixRow;
  group: string;
  /** One per matrix scenario, in the matrix's order; null where the case does not exist in that scenario. */
  cells: (ShownCell | null)[];
  worst: VerdictStatus | null;
}

export interface ShownGroup {
  key: string;
  label: string;
  rows: ShownRow[];
  worst: VerdictStatus | null;
  counts: Record<VerdictStatus, number>;
}

export interface ShownMatrix {
  groups: ShownGroup[];
  rowCount: number;
  /** Per scenario column: number of shown cells whose worst status is fail / warn / pass. */
  totals: Record<VerdictStatus, number>[];
}

/** Group of a matrix row: the faulted element of its id ("bus:LV-A|LL|min" -> bus LV-A; every point
 * along a line, "line:C1@50|LL|min", -> line C1). */
export function defaultRowGroup(row: MatrixRow): { key: string; label: string } {
  const location = row.id.split("|")[0] || row.id;
  const key = location.replace(/@.*$/, "");
  if (key.startsWith("bus:")) return { key, label: key.slice(4) };
  if (key.startsWith("line:")) return { key, label: `${key.slice(5)}, along the line` };
  return { key, label: key };
}

const zero = (): Record<VerdictStatus, number> => ({ fail: 0, warn: 0, pass: 0 });

/** Build the shown matrix. Verdict ids of a cell that are missing from `verdicts` are ignored. */
export function buildShownMatrix(
  matrix: StudyMatrix,
  verdicts: ReadonlyMap<string, Verdict>,
  filter: VerdictFilter,
  groupOf: (row: MatrixRow) => { key: string; label: string } = defaultRowGroup,
): ShownMatrix {
  const cellIndex = new Map<string, StudyMatrix["cells"][number]>();
  for (const c of matrix.cells) cellIndex.set(`${c.row}\u0000${c.scenario}`, c);
  const totals = matrix.scenarios.map(zero);
  const groups = new Map<string, ShownGroup>();
  let rowCount = 0;

  for (const row of matrix.rows) {
    const cells = matrix.scenarios.map((s): ShownCell | null => {
      const c = cellIndex.get(`${row.id}\u0000${s.id}`);
      if (!c) return null;
      const counts = zero();
      const kept: string[] = [];
      let worst: VerdictStatus | null = null;
      for (const id of c.verdictIds) {
        const v = verdicts.get(id);
        if (!v || !filter.kinds.has(v.kind) || !filter.statuses.has(v.status)) continue;
        counts[v.status] += 1;
        kept.push(id);
        worst = worseStatus(worst, v.status);
      }
      return { scenario: s.id, caseId: c.caseId, worst, counts, verdictIds: kept };
    });
    const rowWorst = cells.reduce<VerdictStatus | null>((w, c) => worseStatus(w, c?.worst ?? null), null);
    if (rowWorst === null) continue;
    cells.forEach((c, k) => {
      if (c?.worst) totals[k][c.worst] += 1;
    });
    const g = groupOf(row);
    let group = groups.get(g.key);
    if (!group) {
      group = { key: g.key, label: g.label, rows: [], worst: null, counts: zero() };
      groups.set(g.key, group);
    }
    group.rows.push({ row, group: g.key, cells, worst: rowWorst });
    group.worst = worseStatus(group.worst, rowWorst);
    group.counts[rowWorst] += 1;
    rowCount += 1;
  }
  return { groups: [...groups.values()], rowCount, totals };
}

/** A line of the virtual list: a group header or a case row. */
export type ListItem = { kind: "group"; group: ShownGroup; collapsed: boolean } | { kind: "row"; row: ShownRow };

/** Flatten groups into list lines, leaving out the rows of collapsed groups. */
export function flattenGroups(groups: readonly ShownGroup[], collapsed: ReadonlySet<string>): ListItem[] {
  const out: ListItem[] = [];
  for (const group of groups) {
    const isCollapsed = collapsed.has(group.key);
    out.push({ kind: "group", group, collapsed: isCollapsed });
    if (!isCollapsed) for (const row of group.rows) out.push({ kind: "row", row });
  }
  return out;
}
