// The current axis range the time-current pane picks when the shell does not give one.
import type { TccBand, TccEquipmentCurve, TccFaultMark, TccMarkerPoint } from "./tccTypes.ts";
import { decadeDomain } from "./logTicks.ts";

/** Whole decades from half the lowest curve start (or the lowest equipment current) up to three times
 * the largest fault current, and at least ten times the highest curve start so every curve shows its
 * knee; without fault marks, up to the end of the longest curve. Equipment never widens the range upwards. */
export function autoCurrentDomain(
  bands: readonly TccBand[],
  equipment: readonly TccEquipmentCurve[],
  marks: readonly TccFaultMark[],
  markers: readonly TccMarkerPoint[],
): [number, number] {
  // referred currents only (a band's pickup_A is device-side)
  const starts = bands.map((b) => Math.min(b.nominal[0]?.[0] ?? Infinity, b.min[0]?.[0] ?? Infinity)).filter(Number.isFinite);
  const lows = [...starts.map((i) => i * 0.5), ...markers.map((m) => m.current_A)];
  for (const e of equipment) if (e.points.length > 0) lows.push(Math.min(...e.points.map((p) => p[0])) * 0.8);
  const highs = marks.length > 0 ? [...marks.map((m) => m.current_A * 3), ...starts.map((i) => i * 10)] : bands.map((b) => b.max[b.max.length - 1]?.[0] ?? 0);
  highs.push(...markers.map((m) => m.current_A * 1.5));
  const pos = (v: number[]) => v.filter((x) => Number.isFinite(x) && x > 0);
  const lo = Math.min(...pos(lows));
  const hi = Math.max(...pos(highs));
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return [10, 10000];
  return decadeDomain([lo, Math.max(hi, lo * 10)], 2, [10, 10000]);
}
