// Shared helpers of the benchmark scripts: median timing with warm-up, PASS/MISS target lines, memory figures.
// Target lines start with PASS or MISS so that tests/bench/run.mjs can count them; a miss is reported, never thrown.

export interface Timing {
  median_ms: number;
  min_ms: number;
  max_ms: number;
  runs: number;
}

export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Runs fn `warmup` times untimed, then `runs` times timed with performance.now(); returns the median.
 * A time budget keeps a slow function from stalling the benchmark: warm-up stops after a quarter of the budget,
 * timed runs stop once the budget is spent (at least one timed run), and when a single call takes more than half the
 * budget that first (cold) call is the only sample. `collect` runs a full garbage collection (untimed, when the
 * process has --expose-gc) before every call, so that no call pays for the garbage of earlier ones or of what the
 * benchmark did before.
 */
export function timeMedian(fn: () => unknown, opts: { warmup?: number; runs?: number; budget_ms?: number; collect?: boolean } = {}): Timing {
  const warmup = opts.warmup ?? 2;
  const runs = Math.max(1, opts.runs ?? 7);
  const budget = opts.budget_ms ?? 20000;
  const start = performance.now();
  const t: number[] = [];
  for (let i = 0; i < warmup && performance.now() - start < budget / 4; i++) {
    const t0 = performance.now();
    fn();
    const dt = performance.now() - t0;
    if (i === 0 && dt > budget / 2) return { median_ms: dt, min_ms: dt, max_ms: dt, runs: 1 };
  }
  const timedStart = performance.now();
  const gc = opts.collect ? (globalThis as { gc?: () => void }).gc : undefined;
  while (t.length < runs && (t.length === 0 || performance.now() - timedStart < budget)) {
    gc?.();
    const t0 = performance.now();
    fn();
    t.push(performance.now() - t0);
  }
  return { median_ms: median(t), min_ms: Math.min(...t), max_ms: Math.max(...t), runs: t.length };
}

/** timeMedian for an asynchronous function (each call awaited before the next). */
export async function timeMedianAsync(fn: () => Promise<unknown>, opts: { warmup?: number; runs?: number } = {}): Promise<Timing> {
  for (let i = 0; i < (opts.warmup ?? 2); i++) await fn();
  const t: number[] = [];
  for (let i = 0; i < Math.max(1, opts.runs ?? 7); i++) {
    const t0 = performance.now();
    await fn();
    t.push(performance.now() - t0);
  }
  return { median_ms: median(t), min_ms: Math.min(...t), max_ms: Math.max(...t), runs: t.length };
}

const fmt = (v: number) => (Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 10 ? v.toFixed(1) : v.toPrecision(3));

/** An informational figure. */
export function figure(label: string, value: number, unit: string, note = ""): void {
  console.log(`      ${label}: ${fmt(value)} ${unit}${note ? `  (${note})` : ""}`);
}

/** A figure with a target: prints PASS or MISS. `better` says whether lower or higher values are better. */
export function target(label: string, value: number, unit: string, better: "lower" | "higher", limit: number): boolean {
  const ok = Number.isFinite(value) && (better === "lower" ? value < limit : value >= limit);
  const op = better === "lower" ? "<" : ">=";
  console.log(`${ok ? "PASS" : "MISS"}  ${label}: ${fmt(value)} ${unit} (target ${op} ${fmt(limit)} ${unit})`);
  return ok;
}

/** Heap in use after a full collection when the process runs with --expose-gc (tests/bench/run.mjs passes it). */
export function heapUsed_MB(): number {
  const gc = (globalThis as { gc?: () => void }).gc;
  if (gc) gc();
  return process.memoryUsage().heapUsed / 2 ** 20;
}

/** Peak resident set size of the process so far. */
export function peakRss_MB(): number {
  return process.resourceUsage().maxRSS / 1024;
}

export function section(title: string): void {
  console.log(`\n-- ${title}`);
}
