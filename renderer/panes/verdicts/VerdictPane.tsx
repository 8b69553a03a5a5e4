// The verdict pane: the study matrix (fault cases x scenarios) coloured by the worst verdict, filterable
// by status and kind, grouped by faulted bus or line and virtualised for thousands of cases, with the
// explanations of the selected cell underneath. Clicking a cell selects that case in every pane.
import { useEffect, useMemo, useRef, useState, type CSSProperties } from "react";
import type { MatrixRow, StudyMatrix, Verdict, VerdictKind } from "../../../src/study/types.ts";
import { VERDICT_KINDS } from "../../../src/study/types.ts";
import { buildShownMatrix, flattenGroups, type ShownCell, type VerdictFilter } from "./verdictRows.ts";
import { virtualWindow } from "./virtualWindow.ts";
import { STATUS_LABEL, VERDICT_STATUSES, type VerdictStatus } from "../shared/verdictStatus.ts";
import { useElementSize } from "../shared/useElementSize.ts";
import "../panes.css";

export interface VerdictPaneProps {
  /** The study matrix (src/study StudyMatrix); null before the first study run. */
  matrix: StudyMatrix | null;
  /** All verdicts of the study; the matrix cells refer to them by id. */
  verdicts: readonly Verdict[];
  /** Case selected anywhere in the studio; its cell is outlined and its verdicts listed. */
  selectedCaseId?: string | null;
  /** A cell was clicked: select this case (and scenario) on the canvas and in every pane. */
  onSelectCase?: (caseId: string, scenarioId: string) => void;
  /** A row's label (default: the study's label); the studio passes one with element names. */
  labelOfRow?: (row: MatrixRow) => string;
  /** What a row shows under its group's header (default: its label); the full label stays its tooltip. */
  captionOfRow?: (row: MatrixRow) => string;
  /** How rows are grouped (default: by the location part of the row id, i.e. the faulted bus or line). */
  groupOfRow?: (row: MatrixRow) => { key: string; label: string };
  /** Filters to start with (default: every status and every kind). */
  initialFilter?: Partial<VerdictFilter>;
  /** Shown in the header, e.g. "study of 02:14". */
  subtitle?: string;
}

/** Line height of the matrix in units of the pane's font size (the virtual list needs it in px). */
const ROW_EM = 2;
// keyed by string: a kind added to the study later still shows (by its key) until it has a title here
const KIND_TITLES: Record<string, string> = {
  sensitivity: "sensitivity",
  selectivity: "selectivity",
  backup: "backup",
  speed: "speed",
  blinding: "blinding",
  sympathetic: "sympathetic",
  load: "load",
};
const kindTitle = (k: VerdictKind): string => KIND_TITLES[k] ?? k;
const STATUS_GLYPH: Record<VerdictStatus, string> = { fail: "✕", warn: "!", pass: "✓" };

export function VerdictPane(props: VerdictPaneProps) {
  const { matrix, verdicts, selectedCaseId = null, onSelectCase } = props;
  const [statuses, setStatuses] = useState<ReadonlySet<VerdictStatus>>(() => new Set(props.initialFilter?.statuses ?? VERDICT_STATUSES));
  const [kinds, setKinds] = useState<ReadonlySet<VerdictKind>>(() => new Set(props.initialFilter?.kinds ?? VERDICT_KINDS));
  const [collapsed, setCollapsed] = useState<ReadonlySet<string>>(() => new Set());
  const [scrollTop, setScrollTop] = useState(0);
  const scrollRef = useRef<HTMLDivElement>(null);
  const { height: viewport } = useElementSize(scrollRef);

  const byId = useMemo(() => new Map(verdicts.map((v) => [v.id, v])), [verdicts]);
  const rowLabel = (row: MatrixRow) => props.labelOfRow?.(row) ?? row.label;
  const shown = useMemo(
    () => (matrix ? buildShownMatrix(matrix, byId, { statuses, kinds }, props.groupOfRow) : null),
    [matrix, byId, statuses, kinds, props.groupOfRow],
  );
  const items = useMemo(() => (shown ? flattenGroups(shown.groups, collapsed) : []), [shown, collapsed]);
  const fontPx = scrollRef.current ? parseFloat(getComputedStyle(scrollRef.current).fontSize) || 12 : 12;
  const rowH = Math.round(ROW_EM * fontPx);
  const win = virtualWindow(scrollTop, viewport, rowH, items.length);

  // A case selected elsewhere (canvas, chain) is brought into view, opening its group if needed.
  const pendingRow = useRef<string | null>(null);
  useEffect(() => {
    if (!matrix || !selectedCaseId) return;
    const rowId = matrix.cells.find((c) => c.caseId === selectedCaseId)?.row;
    if (!rowId) return;
    pendingRow.current = rowId;
    const group = shown?.groups.find((g) => g.rows.some((r) => r.row.id === rowId));
    if (group && collapsed.has(group.key)) {
      const next = new Set(collapsed);
      next.delete(group.key);
      setCollapsed(next);
    }
    // Only a new selection scrolls; later list changes must not fight the user's scrolling.
  }, [selectedCaseId, matrix]);
  useEffect(() => {
    const rowId = pendingRow.current;
    const el = scrollRef.current;
    if (!rowId || !el) return;
    const index = items.findIndex((it) => it.kind === "row" && it.row.row.id === rowId);
    if (index < 0) return;
    pendingRow.current = null;
    const top = index * rowH;
    if (top < el.scrollTop || top + rowH > el.scrollTop + el.clientHeight) el.scrollTop = Math.max(0, top - el.clientHeight / 2);
  }, [items, rowH]);

  const selectedCell = useMemo(() => (matrix && selectedCaseId ? matrix.cells.find((c) => c.caseId === selectedCaseId) ?? null : null), [matrix, selectedCaseId]);
  const selectedRow = selectedCell && matrix ? matrix.rows.find((r) => r.id === selectedCell.row) : undefined;
  const selectedScenario = selectedCell && matrix ? matrix.scenarios.find((s) => s.id === selectedCell.scenario) : undefined;
  const details = useMemo(() => {
    if (!selectedCell) return { kept: [] as Verdict[], hidden: 0 };
    const all = selectedCell.verdictIds.map((id) => byId.get(id)).filter((v): v is Verdict => v !== undefined);
    const kept = all.filter((v) => statuses.has(v.status) && kinds.has(v.kind));
    const rank = (s: VerdictStatus) => VERDICT_STATUSES.indexOf(s);
    kept.sort((a, b) => rank(a.status) - rank(b.status) || a.kind.localeCompare(b.kind));
    return { kept, hidden: all.length - kept.length };
  }, [selectedCell, byId, statuses, kinds]);

  const toggle = <T,>(set: ReadonlySet<T>, value: T, update: (s: ReadonlySet<T>) => void) => {
    const next = new Set(set);
    if (next.has(value)) next.delete(value);
    else next.add(value);
    update(next);
  };

  const nScen = matrix?.scenarios.length ?? 0;
  const gridStyle: CSSProperties = { gridTemplateColumns: `minmax(150px, 2.2fr) repeat(${nScen}, minmax(58px, 1fr))` };

  const kindWorst = (k: VerdictKind): VerdictStatus | null => {
    const t = matrix?.totals[k];
    if (!t) return null;
    return t.fail > 0 ? "fail" : t.warn > 0 ? "warn" : t.pass > 0 ? "pass" : null;
  };

  return (
    <section className="ap-pane verdict-pane" aria-label="Verdict matrix" style={{ "--verdict-row-h": `${rowH}px` } as CSSProperties}>
      <header className="ap-header">
        <h2 className="ap-title">Verdicts</h2>
        {props.subtitle ? <span className="ap-subtitle">{props.subtitle}</span> : null}
        <span className="ap-spacer" />
        {shown ? <span className="ap-chip">{shown.rowCount === matrix?.rows.length ? `${shown.rowCount} fault cases` : `${shown.rowCount} of ${matrix?.rows.length ?? 0} fault cases`}</span> : null}
      </header>
      <div className="verdict-filters">
        <div className="verdict-filter-group" role="group" aria-label="Filter by status">
          <span className="verdict-filter-label">Status</span>
          {VERDICT_STATUSES.map((s) => (
            <button key={s} type="button" className="ap-toggle" aria-pressed={statuses.has(s)} onClick={() => toggle(statuses, s, setStatuses)}>
              <span className={`ap-status-dot is-${s}`} />
              {STATUS_LABEL[s]}
            </button>
          ))}
        </div>
        <div className="verdict-filter-group" role="group" aria-label="Filter by kind">
          <span className="verdict-filter-label">Kind</span>
          {VERDICT_KINDS.map((k) => {
            const t = matrix?.totals[k];
            const worst = kindWorst(k);
            return (
              <button
                key={k}
                type="button"
                className="ap-toggle"
                aria-pressed={kinds.has(k)}
                title={t ? `${t.fail} fail, ${t.warn} warning, ${t.pass} pass` : undefined}
                onClick={() => toggle(kinds, k, setKinds)}
              >
                <span className={`ap-status-dot${worst ? ` is-${worst}` : ""}`} />
                {kindTitle(k)}
              </button>
            );
          })}
        </div>
      </div>
      {!matrix || !shown ? (
        <div className="ap-empty">Run the study to fill the matrix.</div>
      ) : (
        <div className="verdict-split">
          <div className="verdict-matrix">
            <div className="verdict-row verdict-head" style={gridStyle} role="row">
              <div>Fault case</div>
              {matrix.scenarios.map((s) => (
                <div key={s.id} title={s.name}>
                  {s.name}
                </div>
              ))}
            </div>
            <div className="verdict-scroll" ref={scrollRef} onScroll={(e) => setScrollTop(e.currentTarget.scrollTop)} role="grid" aria-rowcount={items.length}>
              {items.length === 0 ? <div className="ap-empty">No verdict matches the filters.</div> : null}
              <div style={{ height: win.padTop_px }} />
              {items.slice(win.start, win.end).map((item) =>
                item.kind === "group" ? (
                  <div
                    key={`g:${item.group.key}`}
                    className="verdict-row verdict-group"
                    style={gridStyle}
                    role="row"
                    aria-expanded={!item.collapsed}
                    onClick={() => toggle(collapsed, item.group.key, setCollapsed)}
                  >
                    <div style={{ gridColumn: `1 / span ${nScen + 1}` }}>
                      <span className="verdict-group-caret">{item.collapsed ? "▸" : "▾"}</span>
                      <span className={`ap-status-dot${item.group.worst ? ` is-${item.group.worst}` : ""}`} />
                      {item.group.label}
                      <span className="verdict-group-counts">
                        {item.group.rows.length} cases
                        {item.group.counts.fail ? ` · ${item.group.counts.fail} failing` : ""}
                        {item.group.counts.warn ? ` · ${item.group.counts.warn} with warnings` : ""}
                      </span>
                    </div>
                  </div>
                ) : (
                  <div key={`r:${item.row.row.id}`} className="verdict-row" style={gridStyle} role="row">
                    <div className="verdict-case-label" title={rowLabel(item.row.row)}>
                      {props.captionOfRow?.(item.row.row) ?? rowLabel(item.row.row)}
                    </div>
                    {item.row.cells.map((cell, k) => (
                      <MatrixCellButton key={matrix.scenarios[k].id} cell={cell} scenarioName={matrix.scenarios[k].name} caseLabel={rowLabel(item.row.row)} selected={cell !== null && cell.caseId === selectedCaseId} onSelect={onSelectCase} />
                    ))}
                  </div>
                ),
              )}
              <div style={{ height: win.padBottom_px }} />
            </div>
            <div className="verdict-row verdict-totals" style={gridStyle} role="row">
              <div title="Number of cells per scenario whose worst verdict is a fail (✕) or a warning (!)">Cells failing / warning</div>
              {shown.totals.map((t, k) => (
                <div key={matrix.scenarios[k].id} title={`${t.fail} fail, ${t.warn} warning, ${t.pass} pass`}>
                  {(["fail", "warn"] as const).map((s) => (
                    <span key={s} className={`verdict-count is-${s}`}>
                      {STATUS_GLYPH[s]}
                      {t[s]}
                    </span>
                  ))}
                </div>
              ))}
            </div>
          </div>
          <div className="verdict-details" aria-live="polite">
            {!selectedCell ? (
              <div className="ap-empty">Click a cell to list its verdicts.</div>
            ) : (
              <>
                <h3>
                  {selectedRow ? rowLabel(selectedRow) : selectedCell.caseId} — {selectedScenario?.name ?? selectedCell.scenario}
                </h3>
                {details.kept.length === 0 ? <div className="ap-empty">No verdict of this case matches the filters.</div> : null}
                {details.kept.map((v) => (
                  <div key={v.id} className="verdict-detail">
                    <span className={`ap-status-dot is-${v.status}`} title={STATUS_LABEL[v.status]} />
                    <span className="verdict-detail-kind">{kindTitle(v.kind)}</span>
                    <span>{v.explanation}</span>
                    {Object.keys(v.numbers).length > 0 ? (
                      <span className="verdict-detail-numbers">
                        {Object.entries(v.numbers)
                          .map(([k, n]) => `${k} = ${formatNumber(n)}`)
                          .join("   ")}
                      </span>
                    ) : null}
                  </div>
                ))}
                {details.hidden > 0 ? <div className="ap-empty">{details.hidden} more hidden by the filters.</div> : null}
              </>
            )}
          </div>
        </div>
      )}
    </section>
  );
}

function formatNumber(n: number): string {
  if (!Number.isFinite(n)) return String(n);
  const a = Math.abs(n);
  return a !== 0 && (a < 0.001 || a >= 1e6) ? n.toExponential(3) : String(Number(n.toPrecision(4)));
}

function MatrixCellButton(p: {
  cell: ShownCell | null;
  scenarioName: string;
  caseLabel: string;
  selected: boolean;
  onSelect?: (caseId: string, scenarioId: string) => void;
}) {
  const { cell } = p;
  if (!cell) {
    return (
      <div>
        <div className="verdict-cell is-none" title={`${p.caseLabel}: not studied in ${p.scenarioName}`}>
          –
        </div>
      </div>
    );
  }
  const worst = cell.worst;
  const count = worst ? cell.counts[worst] : 0;
  const label = worst
    ? `${p.caseLabel}, ${p.scenarioName}: ${cell.counts.fail} fail, ${cell.counts.warn} warning, ${cell.counts.pass} pass`
    : `${p.caseLabel}, ${p.scenarioName}: no verdict matches the filters`;
  return (
    <div>
      <button
        type="button"
        className={`verdict-cell ${worst ? `ap-status-bg is-${worst}` : "is-none"}${p.selected ? " is-selected" : ""}`}
        style={{ width: "calc(100% - 6px)" }}
        title={label}
        aria-label={label}
        aria-pressed={p.selected}
        onClick={() => p.onSelect?.(cell.caseId, cell.scenario)}
      >
        {worst ? (worst === "pass" ? STATUS_GLYPH.pass : `${STATUS_GLYPH[worst]} ${count}`) : ""}
      </button>
    </div>
  );
}
