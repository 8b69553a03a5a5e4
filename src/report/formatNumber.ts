// Number formatting for the report. toFixed/toPrecision do not depend on the locale, so the same
// input always gives the same text (reproducible reports); a missing value prints as an en dash.

/** Fixed decimals; "–" for null, NaN or an infinite value. Negative zero prints as 0. */
export function formatNumber(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** Three significant figures for values that span decades (currents, times), without exponent notation. */
export function formatSignificant(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  if (value === 0) return "0";
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, digits - 1 - magnitude);
  return formatNumber(value, decimals);
}
