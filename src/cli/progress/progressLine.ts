// A one-line progress display for stderr on a terminal: the phase, cases done of total, elapsed time and an
// estimate of the time left. It redraws in place (carriage return, then erase the line), at most once per
// `minInterval_ms` (a few times a second), never wider than the terminal (a wrapped line could not be erased), and
// erases itself with clear(). The clock and the writer are passed in, so it is tested without a terminal.

export interface ProgressLineOptions {
  /** Writes to the terminal (stderr). */
  write(text: string): void;
  /** Milliseconds, monotonic. */
  now(): number;
  /** The terminal's width in columns, when known. */
  columns?: () => number | undefined;
  /** Shortest time between two drawings; 250 ms gives at most four a second. */
  minInterval_ms?: number;
  /** What runs, e.g. "islet check". */
  label: string;
}

/** Carriage return, then ECMA-48 EL (erase in line, parameter 2: the whole line). ECMA-48, 8.3.41. */
export const ERASE_LINE = "\r\x1b[2K";

export interface ProgressFigures {
  label: string;
  phase: string;
  done: number;
  /** 0 when the phase has no count. */
  total: number;
  elapsed_ms: number;
  /** null when there is not yet enough to go on. */
  left_ms: number | null;
}

/** 0:07, 12:34, 1:02:03. */
export function formatDuration(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const sec = String(s % 60).padStart(2, "0");
  return h > 0 ? `${h}:${String(m).padStart(2, "0")}:${sec}` : `${m}:${sec}`;
}

const count = (n: number) => Math.floor(n).toLocaleString("en-US");

export function formatProgress(f: ProgressFigures): string {
  const parts = [`${f.label}: ${f.phase}`];
  if (f.total > 0) parts[0] += ` ${count(Math.min(f.done, f.total))} of ${count(f.total)} (${Math.floor((100 * Math.min(f.done, f.total)) / f.total)}%)`;
  parts.push(`${formatDuration(f.elapsed_ms)} elapsed`);
  if (f.left_ms !== null) parts.push(`about ${formatDuration(f.left_ms)} left`);
  return parts.join(", ");
}

/**
 * Time left from the rate so far: `done` cases in `elapsed_ms` since the count started (the study's phases share
 * one cumulative count of fault cases), so elapsed x (total - done) / done. Nothing before a second has passed or
 * a case is done, nor once all are.
 */
export function estimateLeft_ms(done: number, total: number, elapsed_ms: number): number | null {
  // with every case done the rest of the phase (verdicts, timelines) has no count to go by
  if (total <= 0 || done <= 0 || done >= total || elapsed_ms < 1000) return null;
  return (elapsed_ms * (total - done)) / done;
}

export class ProgressLine {
  private readonly options: ProgressLineOptions;
  private readonly start_ms: number;
  private readonly minInterval_ms: number;
  private lastDrawn_ms: number;
  private shown = false;
  private drawn = 0;
  /** Where the current count started (its first update): the rate leaves out the loading before it. */
  private countStart: { t_ms: number; done: number; total: number } | null = null;

  constructor(options: ProgressLineOptions) {
    this.options = options;
    this.start_ms = options.now();
    this.minInterval_ms = options.minInterval_ms ?? 250;
    // the first drawing waits one interval too, so a short run shows nothing at all
    this.lastDrawn_ms = this.start_ms;
  }

  /** How many times the line has been drawn. */
  get drawings(): number {
    return this.drawn;
  }

  /** Notes progress; draws only when the last drawing is at least minInterval_ms old. */
  update(phase: string, done: number, total: number): void {
    const t = this.options.now();
    // a new total is a new count (a report's timelines after its study)
    if (this.countStart === null || this.countStart.total !== total) this.countStart = { t_ms: t, done, total };
    if (t - this.lastDrawn_ms < this.minInterval_ms) return;
    this.lastDrawn_ms = t;
    const elapsed_ms = t - this.start_ms;
    const c = this.countStart;
    const left_ms = estimateLeft_ms(done - c.done, total - c.done, t - c.t_ms);
    let text = formatProgress({ label: this.options.label, phase, done, total, elapsed_ms, left_ms });
    const width = this.options.columns?.();
    // one column short of the width: a terminal that wraps at the last column would push the cursor to a new line
    if (width && width > 1 && text.length > width - 1) text = text.slice(0, width - 1);
    this.options.write(ERASE_LINE + text);
    this.shown = true;
    this.drawn++;
  }

  /** Erases the line (if drawn), e.g. before other output or at the end; a later update draws it again. */
  clear(): void {
    if (!this.shown) return;
    this.options.write(ERASE_LINE);
    this.shown = false;
  }
}

/** Where a command reports progress; `silentProgress` when stderr is not a terminal or with --quiet. */
export interface ProgressSink {
  update(phase: string, done: number, total: number): void;
  clear(): void;
}

export const silentProgress: ProgressSink = { update() {}, clear() {} };

/** The stream a progress line goes to (process.stderr, or a stand-in in tests). */
export interface ProgressStream {
  isTTY?: boolean;
  columns?: number;
  write(text: string): unknown;
}

/** A progress line on `stream` when it is a terminal and not `quiet`; otherwise nothing at all. */
export function progressFor(label: string, stream: ProgressStream, quiet: boolean, now: () => number = () => performance.now()): ProgressSink {
  if (quiet || stream.isTTY !== true) return silentProgress;
  return new ProgressLine({ label, now, write: (t) => void stream.write(t), columns: () => stream.columns });
}
