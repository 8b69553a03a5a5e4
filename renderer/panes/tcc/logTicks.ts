// Decade gridding for log-log time-current plots.

export interface LogTicks {
  /** Powers of ten inside the domain (labelled, strong grid line). */
  major: number[];
  /** 2..9 times each power of ten inside the domain (light grid line). */
  minor: number[];
}

/** Ticks of a log axis over [lo, hi] (both > 0). Values are snapped to clean decimals. */
export function logTicks(lo: number, hi: number): LogTicks {
  if (!(lo > 0) || !(hi > 0)) throw new Error(`log axis domain must be positive (got ${lo}..${hi})`);
  const a = Math.min(lo, hi);
  const b = Math.max(lo, hi);
  const eps = 1e-9;
  const major: number[] = [];
  const minor: number[] = [];
  for (let k = Math.floor(Math.log10(a) + eps); k <= Math.ceil(Math.log10(b) - eps); k++) {
    for (let m = 1; m <= 9; m++) {
      const v = clean(m * 10 ** k);
      if (v < a * (1 - eps) || v > b * (1 + eps)) continue;
      (m === 1 ? major : minor).push(v);
    }
  }
  return { major, minor };
}

/** The smallest whole-decade interval holding every value, at least `minDecades` wide. */
export function decadeDomain(values: readonly number[], minDecades = 1, fallback: [number, number] = [1, 1000]): [number, number] {
  const pos = values.filter((v) => Number.isFinite(v) && v > 0);
  if (pos.length === 0) return fallback;
  const lo = Math.floor(Math.log10(Math.min(...pos)) + 1e-9);
  let hi = Math.ceil(Math.log10(Math.max(...pos)) - 1e-9);
  while (hi - lo < minDecades) hi += 1;
  return [clean(10 ** lo), clean(10 ** hi)];
}

/** Axis label of a tick: "0.01", "1", "100", "1k", "20k". */
export function tickLabel(v: number): string {
  if (v >= 1e6) return `${clean(v / 1e6)}M`;
  if (v >= 1e3) return `${clean(v / 1e3)}k`;
  return String(clean(v));
}

function clean(v: number): number {
  return Number(v.toPrecision(12));
}
