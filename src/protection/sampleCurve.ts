// Curve data for plotting: nominal, min and max polylines on log axes, currents referred to a plot voltage.
import type { Band, CurveBand, Polyline, ProtectiveDevice, SampleOptions } from "./types.ts";
import { deviceCurve } from "./deviceCurve.ts";

const BANDS: readonly Band[] = ["nominal", "min", "max"];
const EPS = 1e-9;

/** Current scale from the device's voltage to the plot's reference voltage (I_ref = I_dev * kV_dev / kV_ref). */
export function referScale(device_kV?: number, reference_kV?: number): number {
  if (device_kV === undefined || reference_kV === undefined) return 1;
  if (!(device_kV > 0) || !(reference_kV > 0)) throw new RangeError(`voltages must be > 0 (got device_kV ${device_kV}, reference_kV ${reference_kV})`);
  return device_kV / reference_kV;
}

/**
 * Samples the device curve for `opts.quantity` on log axes: a uniform log grid (pointsPerDecade) plus every
 * pickup, corner and table point exactly; a step (pickup, definite-time change) is a vertical segment drawn as
 * two points at the same current. Times are clipped to [tMin_s, tMax_s] of the plot so every point is drawable.
 */
export function sampleCurve(device: ProtectiveDevice, opts: SampleOptions = {}): CurveBand {
  const curve = deviceCurve(device, opts.quantity ?? "phase", opts.restraint_pu ?? 1, opts.elementIds);
  const scale = referScale(opts.device_kV, opts.reference_kV);
  const tTop = opts.tMax_s ?? 1000;
  const tBottom = opts.tMin_s ?? 0.01;
  const ppd = Math.max(4, Math.round(opts.pointsPerDecade ?? 60));
  if (curve.elements.length === 0) return { nominal: [], min: [], max: [] };
  const pNominal = curve.pickup_A("nominal");
  const pLow = Math.min(...BANDS.map((b) => curve.pickup_A(b)));
  const allBreaks = BANDS.flatMap((b) => curve.breakpoints_A(b));
  const iMin = opts.iMin_A ?? 0.5 * pLow;
  const iMax = opts.iMax_A ?? Math.max(100 * pNominal, 2 * Math.max(...allBreaks));
  if (!(iMin > 0) || !(iMax > iMin)) throw new RangeError(`plot current range must satisfy 0 < iMin_A < iMax_A (got ${iMin}, ${iMax})`);

  const n = Math.ceil(Math.log10(iMax / iMin) * ppd);
  const grid: number[] = [];
  for (let k = 0; k <= n; k++) grid.push(Math.min(iMax, iMin * Math.pow(10, k / ppd)));

  const out = {} as CurveBand;
  for (const band of BANDS) {
    const t = (i: number) => (opts.includeClearing ? curve.clearing_s(i, band) : curve.time_s(i, band));
    const clip = (x: number) => Math.min(tTop, Math.max(tBottom, x));
    const breaks = curve.breakpoints_A(band).filter((b) => b >= iMin && b <= iMax);
    const isBreak = new Set(breaks);
    const currents = [...new Set([...grid, ...breaks])].sort((a, b) => a - b);
    const raw: [number, number][] = [];
    for (const i of currents) {
      if (isBreak.has(i)) {
        const left = clip(t(i * (1 - EPS)));
        const right = clip(t(i * (1 + EPS)));
        raw.push([i, left]);
        if (right !== left) raw.push([i, right]);
      } else raw.push([i, clip(t(i))]);
    }
    out[band] = tidy(refine(raw, t, clip), tTop).map(([i, s]) => [i * scale, s] as const);
  }
  return out;
}

/** Largest change of log10(time) between neighbouring points before a segment is split (about 0.05 decade). */
const MAX_STEP_DECADES = 0.05;
const MAX_DEPTH = 24;

/** Splits segments where the curve bends fast (near an inverse curve's asymptote) so the polyline follows it. */
function refine(raw: [number, number][], t: (i: number) => number, clip: (x: number) => number): [number, number][] {
  const out: [number, number][] = [];
  const split = (a: [number, number], b: [number, number], depth: number) => {
    if (depth >= MAX_DEPTH || a[0] === b[0] || Math.abs(Math.log10(b[1] / a[1])) <= MAX_STEP_DECADES) return;
    const mid = Math.sqrt(a[0] * b[0]);
    const m: [number, number] = [mid, clip(t(mid))];
    split(a, m, depth + 1);
    out.push(m);
    split(m, b, depth + 1);
  };
  raw.forEach((p, k) => {
    if (k > 0) split(raw[k - 1], p, 0);
    out.push(p);
  });
  return out;
}

/** Drops the run of points sitting at the top of the plot before the curve starts (keeping its last) and repeats. */
function tidy(raw: [number, number][], tTop: number): Polyline {
  let start = 0;
  while (start + 1 < raw.length && raw[start + 1][1] === tTop && raw[start][1] === tTop) start++;
  const out: Polyline = [];
  for (const p of raw.slice(start)) {
    const last = out[out.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) out.push(p);
  }
  return out;
}
