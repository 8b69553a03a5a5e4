// Number formatting for the report. toFixed/toPrecision do not depend on the locale, so the same
// input always gives the same text (reproducible reports); a missing value prints as an en dash.

/** toFixed accepts 0 to 100 decimals; more would throw. */
const MAX_DECIMALS = 100;
/** Below this magnitude three significant figures would need more decimals than a reader can count: exponent form. */
const SMALLEST_FIXED = 1e-9;

/** Fixed decimals (0 to 100); "–" for null, NaN or an infinite value. Negative zero prints as 0. */
export function formatNumber(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  const text = value.toFixed(Math.min(MAX_DECIMALS, Math.max(0, Math.round(decimals))));
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** Three significant figures for values that span decades (currents, times); exponent notation only below 1e-9. */
export function formatSignificant(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  if (value === 0) return "0";
  const d = Math.min(MAX_DECIMALS, Math.max(1, Math.round(digits)));
  if (Math.abs(value) < SMALLEST_FIXED) return value.toExponential(d - 1);
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, d - 1 - magnitude);
  return formatNumber(value, decimals);
}
