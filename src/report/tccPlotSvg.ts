// A time-current (TCC) plot as a self-contained SVG: log-log axes by decades, each device's tolerance band
// (shaded between its fast and slow edges) with its nominal curve, equipment withstand curves, and
// fault-current marks. Currents are already referred to the plot's reference voltage.
import type { Polyline } from "../protection/index.ts";
import { escapeHtml } from "./escapeHtml.ts";
import { REPORT_COLORS } from "./reportColors.ts";
import { n, svgText } from "./svgText.ts";

export interface TccCurve {
  label: string;
  color: string;
  nominal: Polyline;
  min: Polyline;
  max: Polyline;
}
export interface TccReferenceCurve {
  label: string;
  points: Polyline;
  /** "damage" curves are drawn dashed; "start" (motor starting) dotted. */
  style: "damage" | "start";
}
export interface TccMark {
  label: string;
  current_A: number;
}
export interface TccPlotInput {
  title: string;
  /** What the current axis measures, e.g. "Current" or "Residual current 3I0". Default "Current". */
  currentLabel?: string;
  reference_kV: number;
  iMin_A: number;
  iMax_A: number;
  tMin_s: number;
  tMax_s: number;
  curves: TccCurve[];
  references: TccReferenceCurve[];
  marks: TccMark[];
  /** Points such as transformer inrush, drawn as a small cross. */
  points: { label: string; current_A: number; time_s: number }[];
}

const W = 860;
const H = 560;
const PLOT = { left: 64, top: 40, width: 560, height: 470 } as const;
const LEGEND_X = PLOT.left + PLOT.width + 20;

export function tccPlotSvg(p: TccPlotInput): string {
  const lx0 = Math.log10(p.iMin_A);
  const lx1 = Math.log10(p.iMax_A);
  const ly0 = Math.log10(p.tMin_s);
  const ly1 = Math.log10(p.tMax_s);
  const X = (i: number) => PLOT.left + ((Math.log10(i) - lx0) / (lx1 - lx0)) * PLOT.width;
  const Y = (t: number) => PLOT.top + PLOT.height - ((Math.log10(t) - ly0) / (ly1 - ly0)) * PLOT.height;
  const inside = (i: number) => i >= p.iMin_A * 0.999 && i <= p.iMax_A * 1.001;
  const path = (pts: Polyline) => {
    const shown = pts.filter(([i]) => inside(i));
    return shown.map(([i, t], k) => `${k ? "L" : "M"}${n(X(i))} ${n(Y(Math.min(p.tMax_s, Math.max(p.tMin_s, t))))}`).join("");
  };
  const out: string[] = [];
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" class="tcc" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" font-family="'Segoe UI', 'Helvetica Neue', Arial, sans-serif">`,
    `<title>${escapeHtml(p.title)}</title>`,
    `<rect width="${W}" height="${H}" fill="${REPORT_COLORS.paper}"/>`,
    svgText(PLOT.left, 22, p.title, `font-size="13" font-weight="600" fill="${REPORT_COLORS.ink}"`),
    `<defs><clipPath id="plot-area"><rect x="${PLOT.left}" y="${PLOT.top}" width="${PLOT.width}" height="${PLOT.height}"/></clipPath></defs>`,
  );
  // grid: decades strong, 2..9 faint
  const grid: string[] = [];
  const ticks: string[] = [];
  for (let d = Math.floor(lx0); d <= Math.ceil(lx1); d++)
    for (let m = 1; m <= 9; m++) {
      const i = m * Math.pow(10, d);
      if (!inside(i)) continue;
      const x = X(i);
      grid.push(`<path d="M${n(x)} ${PLOT.top}V${PLOT.top + PLOT.height}" stroke="${m === 1 ? "#aab3bf" : "#e3e7ec"}" stroke-width="${m === 1 ? 0.9 : 0.6}"/>`);
      if (m === 1) ticks.push(svgText(x, PLOT.top + PLOT.height + 16, decadeLabel(d), `font-size="10.5" text-anchor="middle" fill="${REPORT_COLORS.muted}"`));
    }
  for (let d = Math.floor(ly0); d <= Math.ceil(ly1); d++)
    for (let m = 1; m <= 9; m++) {
      const t = m * Math.pow(10, d);
      if (t < p.tMin_s * 0.999 || t > p.tMax_s * 1.001) continue;
      const y = Y(t);
      grid.push(`<path d="M${PLOT.left} ${n(y)}H${PLOT.left + PLOT.width}" stroke="${m === 1 ? "#aab3bf" : "#e3e7ec"}" stroke-width="${m === 1 ? 0.9 : 0.6}"/>`);
      if (m === 1) ticks.push(svgText(PLOT.left - 6, y + 3.5, decadeLabel(d), `font-size="10.5" text-anchor="end" fill="${REPORT_COLORS.muted}"`));
    }
  out.push(`<g class="grid">${grid.join("")}</g>`, `<g class="ticks">${ticks.join("")}</g>`);
  out.push(
    `<rect x="${PLOT.left}" y="${PLOT.top}" width="${PLOT.width}" height="${PLOT.height}" fill="none" stroke="${REPORT_COLORS.ink}" stroke-width="1"/>`,
    svgText(PLOT.left + PLOT.width / 2, H - 12, `${p.currentLabel ?? "Current"} in A at ${trim(p.reference_kV)} kV`, `font-size="11" text-anchor="middle" fill="${REPORT_COLORS.ink}"`),
    svgText(16, PLOT.top + PLOT.height / 2, "Time in s", `font-size="11" text-anchor="middle" fill="${REPORT_COLORS.ink}" transform="rotate(-90 16 ${PLOT.top + PLOT.height / 2})"`),
  );
  const body: string[] = [];
  for (const c of p.curves) {
    if (c.min.length > 1 && c.max.length > 1) {
      const lo = c.min.filter(([i]) => inside(i));
      const hi = c.max.filter(([i]) => inside(i));
      const pts = [...lo, ...[...hi].reverse()];
      if (pts.length > 2)
        body.push(`<path d="${path(lo)}${path([...hi].reverse()).replace(/^M/, "L")}Z" fill="${c.color}" fill-opacity="0.16" stroke="none"/>`);
    }
    body.push(`<path d="${path(c.nominal)}" fill="none" stroke="${c.color}" stroke-width="1.8"/>`);
  }
  for (const r of p.references) {
    const first = r.points.find(([i, t]) => inside(i) && t <= p.tMax_s && t >= p.tMin_s);
    if (first) body.push(svgText(X(first[0]) + 4, Y(first[1]) + 10, r.label.split(" ")[0], `font-size="9" fill="${REPORT_COLORS.ink}"`));
    body.push(`<path d="${path(r.points)}" fill="none" stroke="${REPORT_COLORS.ink}" stroke-width="1.3" stroke-dasharray="${r.style === "damage" ? "6 3" : "1.5 2.5"}"/>`);
  }
  for (const pt of p.points)
    if (inside(pt.current_A)) {
      const x = X(pt.current_A);
      const y = Y(pt.time_s);
      body.push(`<path d="M${n(x - 4)} ${n(y - 4)}L${n(x + 4)} ${n(y + 4)}M${n(x + 4)} ${n(y - 4)}L${n(x - 4)} ${n(y + 4)}" stroke="${REPORT_COLORS.ink}" stroke-width="1.4"/>`);
    }
  const markLabels: string[] = [];
  p.marks.forEach((m, k) => {
    if (!inside(m.current_A)) return;
    const x = X(m.current_A);
    body.push(`<path d="M${n(x)} ${PLOT.top}V${PLOT.top + PLOT.height}" stroke="${REPORT_COLORS.fail}" stroke-width="1.2" stroke-dasharray="4 3"/>`);
    const right = x > PLOT.left + 0.8 * PLOT.width;
    markLabels.push(svgText(right ? x - 3 : x + 3, PLOT.top + 12 + 12 * k, `${m.label} ${sig(m.current_A)} A`, `font-size="9.5" fill="${REPORT_COLORS.fail}"${right ? ' text-anchor="end"' : ""}`));
  });
  out.push(`<g clip-path="url(#plot-area)">${body.join("")}</g>`, `<g class="marks">${markLabels.join("")}</g>`);
  // legend
  const legend: string[] = [];
  let y = PLOT.top + 6;
  for (const c of p.curves) {
    legend.push(`<rect x="${LEGEND_X}" y="${n(y)}" width="18" height="9" fill="${c.color}" fill-opacity="0.25" stroke="${c.color}"/>`);
    y = wrapLegend(legend, c.label, y);
  }
  for (const r of p.references) {
    legend.push(`<path d="M${LEGEND_X} ${n(y + 5)}H${LEGEND_X + 18}" stroke="${REPORT_COLORS.ink}" stroke-width="1.3" stroke-dasharray="${r.style === "damage" ? "6 3" : "1.5 2.5"}"/>`);
    y = wrapLegend(legend, r.label, y);
  }
  for (const pt of p.points) {
    legend.push(`<path d="M${LEGEND_X + 5} ${n(y + 1)}L${LEGEND_X + 13} ${n(y + 9)}M${LEGEND_X + 13} ${n(y + 1)}L${LEGEND_X + 5} ${n(y + 9)}" stroke="${REPORT_COLORS.ink}" stroke-width="1.3"/>`);
    y = wrapLegend(legend, pt.label, y);
  }
  if (p.marks.length) {
    legend.push(`<path d="M${LEGEND_X + 9} ${n(y - 1)}V${n(y + 11)}" stroke="${REPORT_COLORS.fail}" stroke-width="1.2" stroke-dasharray="3 2"/>`);
    wrapLegend(legend, p.currentLabel && p.currentLabel !== "Current" ? "earth-fault 3I0 through the primary device" : "fault current through the primary device", y);
  }
  out.push(`<g class="legend">${legend.join("")}</g>`, `</svg>`);
  return out.join("\n");
}

/** Writes a legend label beside its key, wrapped to the legend width; returns the next row's y. */
function wrapLegend(out: string[], label: string, y: number): number {
  const lines: string[] = [];
  let line = "";
  for (const word of label.split(" ")) {
    if (line && (line + " " + word).length > 26) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  lines.forEach((l, k) => out.push(svgText(LEGEND_X + 24, y + 8.5 + 12 * k, l, `font-size="10" fill="${REPORT_COLORS.ink}"`)));
  return y + 12 * lines.length + 8;
}

function decadeLabel(d: number): string {
  return d >= 0 ? String(Math.pow(10, d)) : Math.pow(10, d).toFixed(-d);
}

function trim(x: number): string {
  return String(Number(x.toPrecision(4)));
}

function sig(x: number): string {
  return x >= 100 ? String(Math.round(x)) : x.toPrecision(3);
}
