// Compact, unit-bearing number formatting shared by the panes (readouts, tables, legends).

/** Current in amperes: "850 A", "12.4 kA". */
export function formatCurrent_A(i_A: number | null | undefined): string {
  if (i_A === null || i_A === undefined || !Number.isFinite(i_A)) return "—";
  const abs = Math.abs(i_A);
  if (abs >= 1000) return `${trimNumber(i_A / 1000, 3)} kA`;
  return `${trimNumber(i_A, 3)} A`;
}

/** Time in seconds: "35 ms" below 1 s, "1.72 s" above. */
export function formatTime_s(t_s: number | null | undefined): string {
  if (t_s === null || t_s === undefined || !Number.isFinite(t_s)) return "—";
  if (Math.abs(t_s) < 1) return `${trimNumber(t_s * 1000, 3)} ms`;
  return `${trimNumber(t_s, 3)} s`;
}

/** A number to `significant` significant digits without exponent notation or trailing zeros. */
export function trimNumber(x: number, significant: number): string {
  if (x === 0) return "0";
  const digits = Math.max(0, significant - 1 - Math.floor(Math.log10(Math.abs(x))));
  return Number(x.toFixed(Math.min(digits, 6))).toString();
}
