// The study matrix as the verdict pane shows it: only the verdicts the filters keep are counted,
// each cell takes the worst of them, rows without any are hidden, rows are grouped (by bus or line),
// and a totals row counts cells per scenario.
import type { MatrixRow, StudyMatrix, Verdict, VerdictKind } from "../../../src/study/types.ts";
import { VERDICT_KINDS } from "../../../src/study/types.ts";
import { VERDICT_STATUSES, worseStatus, type VerdictStatus } from "../shared/verdictStatus.ts";

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

/** Code of a verdict id not found in the verdict list. */
const MISSING = 255;
type Cell = StudyMatrix["cells"][number];
// Per cell, the (kind, status) code of each of its verdicts, computed once per verdict list so that
// toggling a filter costs array reads, not a map lookup per verdict.
const codeCache = new WeakMap<ReadonlyMap<string, Verdict>, WeakMap<Cell, Uint8Array>>();

function codesOf(cell: Cell, verdicts: ReadonlyMap<string, Verdict>): Uint8Array {
  let perList = codeCache.get(verdicts);
  if (!perList) codeCache.set(verdicts, (perList = new WeakMap()));
  let codes = perList.get(cell);
  if (!codes) {
    codes = new Uint8Array(cell.verdictIds.length);
    cell.verdictIds.forEach((id, j) => {
      const v = verdicts.get(id);
      codes![j] = v ? VERDICT_KINDS.indexOf(v.kind) * 3 + VERDICT_STATUSES.indexOf(v.status) : MISSING;
    });
    perList.set(cell, codes);
  }
  return codes;
}

/** Build the shown matrix. Verdict ids of a cell that are missing from `verdicts` are ignored (when a filter is on). */
export function buildShownMatrix(
  matrix: StudyMatrix,
  verdicts: ReadonlyMap<string, Verdict>,
  filter: VerdictFilter,
  groupOf: (row: MatrixRow) => { key: string; label: string } = defaultRowGroup,
): ShownMatrix {
  // Index cells by row, then by scenario position: no string keys in the hot loop.
  const scenarioIndex = new Map(matrix.scenarios.map((s, k) => [s.id, k]));
  const byRow = new Map<string, (StudyMatrix["cells"][number] | undefined)[]>();
  for (const c of matrix.cells) {
    const k = scenarioIndex.get(c.scenario);
    if (k === undefined) continue;
    let slots = byRow.get(c.row);
    if (!slots) byRow.set(c.row, (slots = new Array(matrix.scenarios.length)));
    slots[k] = c;
  }
  // With every status and kind kept, the study's own worst and counts are the answer.
  const keepsAll = VERDICT_STATUSES.every((st) => filter.statuses.has(st)) && VERDICT_KINDS.every((k) => filter.kinds.has(k));
  // Kept (kind, status) pairs as a bit mask over code = kindIndex * 3 + statusIndex.
  let mask = 0;
  VERDICT_KINDS.forEach((k, ki) => VERDICT_STATUSES.forEach((st, si) => {
    if (filter.kinds.has(k) && filter.statuses.has(st)) mask |= 1 << (ki * 3 + si);
  }));
  const totals = matrix.scenarios.map(zero);
  const groups = new Map<string, ShownGroup>();
  let rowCount = 0;

  for (const row of matrix.rows) {
    const slots = byRow.get(row.id);
    const cells = matrix.scenarios.map((s, k): ShownCell | null => {
      const c = slots?.[k];
      if (!c) return null;
      if (keepsAll) return { scenario: s.id, caseId: c.caseId, worst: c.worst, counts: c.counts, verdictIds: c.verdictIds };
      const counts = zero();
      const kept: string[] = [];
      let worst: VerdictStatus | null = null;
      const codes = codesOf(c, verdicts);
      for (let j = 0; j < codes.length; j++) {
        const code = codes[j];
        if (code === MISSING || ((mask >> code) & 1) === 0) continue;
        const status = VERDICT_STATUSES[code % 3];
        counts[status] += 1;
        kept.push(c.verdictIds[j]);
        worst = worseStatus(worst, status);
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
