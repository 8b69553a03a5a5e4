// The report's own palette: ink for print, one hue per voltage class, and the three verdict states.
export const REPORT_COLORS = {
  ink: "#1d2430",
  muted: "#5b6573",
  rule: "#c9d0d9",
  paper: "#ffffff",
  wash: "#f3f5f8",
  accent: "#0f5c6e",
  mv: "#0f5c6e",
  lv: "#9a4d0b",
  device: "#4a3a86",
  fail: "#b3261e",
  warn: "#8a6100",
  pass: "#2e6b34",
  failWash: "#fbe9e7",
  warnWash: "#fdf3d8",
  passWash: "#e8f3e8",
} as const;

/** Colour of a conductor at this nominal voltage: medium voltage above 1 kV, low voltage at or below. */
export function voltageColor(un_kV: number | undefined): string {
  return un_kV !== undefined && un_kV > 1 ? REPORT_COLORS.mv : REPORT_COLORS.lv;
}
