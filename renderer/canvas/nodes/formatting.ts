// Number formatting for labels on the one-line: few digits, units always shown.
export function fmt(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return "–";
  const abs = Math.abs(value);
  if (abs < 1e-9) return "0";
  if (abs >= 1000) return value.toFixed(0);
  return Number(value.toPrecision(digits)).toString();
}

export function fmtTime(t_s: number | null): string {
  if (t_s === null) return "no trip";
  return t_s < 1 ? `${(t_s * 1000).toFixed(0)} ms` : `${fmt(t_s)} s`;
}
