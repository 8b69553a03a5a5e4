// Legend column of the time-current plot: devices (name, function, pickup, multiplier), equipment
// curves and points; entries shrink to fit short panes; a device entry selects the device.
import type { ReactElement } from "react";
import { ellipsis, type StaticProps } from "./plotTypes.ts";
import { formatCurrent_A, formatTime_s, trimNumber } from "../shared/formatQuantity.ts";

export function TccLegend(p: StaticProps) {
  const L = p.layout;
  const rows: { key: string; swatch: ReactElement; title: string; detail: string; setting?: string; highlight: boolean; deviceId?: string }[] = [];
  for (const b of p.bands) {
    const color = p.colors.get(b.deviceId) ?? "currentColor";
    const setting = [`${b.pickupLabel ?? "pickup"} ${formatCurrent_A(b.pickup_A)}`, b.multiplier !== undefined ? `multiplier ${trimNumber(b.multiplier, 3)}` : ""].filter(Boolean).join(" · ");
    rows.push({
      key: `${b.deviceId}/${b.functionId}`,
      swatch: (
        <g>
          <rect width={18} height={10} y={-8} className="tcc-band" style={{ fill: color }} />
          <line x1={0} x2={18} y1={-3} y2={-3} className="tcc-nominal" style={{ stroke: color }} />
        </g>
      ),
      title: b.deviceName,
      detail: b.functionLabel,
      setting,
      highlight: b.deviceId === p.highlightDeviceId,
      deviceId: b.deviceId,
    });
  }
  for (const e of p.equipment) {
    rows.push({
      key: e.id,
      swatch: (
        <g className={`tcc-equipment tcc-${e.kind}`}>
          {e.kind !== "motor-start" ? <rect width={18} height={10} y={-8} className="tcc-damage-region" fill={`url(#${p.uid}-hatch-${e.kind === "cable-damage" ? "cable" : "transformer"})`} /> : null}
          <line x1={0} x2={18} y1={-3} y2={-3} className="tcc-equipment-line" />
        </g>
      ),
      title: e.name,
      detail: e.detail ?? (e.kind === "transformer-damage" ? "through-fault withstand" : e.kind === "cable-damage" ? "conductor withstand I²t" : "motor starting"),
      highlight: false,
    });
  }
  for (const m of p.markers) {
    rows.push({
      key: m.id,
      swatch: (
        <g className="tcc-marker" transform="translate(9 -3)">
          <path d="M-5,0L0,-5L5,0L0,5Z" className="tcc-marker-shape" />
        </g>
      ),
      title: m.name,
      detail: `${formatCurrent_A(m.current_A)} for ${formatTime_s(m.time_s)}`,
      highlight: false,
    });
  }
  // Drawn in 12 px units and scaled by L.s as a whole, like the read-out box.
  // Full rows (name, function, setting); when they do not all fit, compact rows (name and setting);
  // then one line per entry, and "+ n more" for what is left.
  const room = (L.bottom - L.top) / L.s - 40;
  const fullHeight = (r: (typeof rows)[number]) => (r.setting ? 41 : 30);
  const total = (h: (r: (typeof rows)[number]) => number) => rows.reduce((a, r) => a + h(r), 0);
  const mode: "full" | "compact" | "line" = total(fullHeight) <= room ? "full" : rows.length * 30 <= room ? "compact" : "line";
  const rowHeight = mode === "full" ? fullHeight : mode === "compact" ? () => 30 : () => 16;
  const shown: typeof rows = [];
  const rowY: number[] = [];
  let used = 0;
  for (const r of rows) {
    if (used + rowHeight(r) > room + 12) break;
    rowY.push(30 + used);
    shown.push(r);
    used += rowHeight(r);
  }
  // Rough glyph widths at the legend's font sizes: 6.6 px bold titles, 5.4 px details.
  const titleChars = Math.max(10, Math.floor((L.legendWidth / L.s - 26) / 6.6));
  const maxChars = Math.max(12, Math.floor((L.legendWidth / L.s - 26) / 5.4));
  return (
    <g className="tcc-legend" transform={`translate(${L.legendX} ${L.top}) scale(${L.s})`} style={{ fontSize: "12px" }}>
      {rows.length > 0 ? (
        <text className="tcc-legend-heading" y={10}>
          Legend
        </text>
      ) : null}
      {shown.map((r, k) => (
        <g
          key={r.key}
          transform={`translate(0 ${rowY[k]})`}
          className={`tcc-legend-row${r.highlight ? " is-highlight" : ""}${r.deviceId ? " is-device" : ""}`}
          onClick={r.deviceId ? () => p.onLegendSelect(r.deviceId!) : undefined}
        >
          {r.swatch}
          <text x={24} y={0} className="tcc-legend-title">
            {ellipsis(r.title, titleChars)}
          </text>
          {mode !== "line" ? (
            <text x={24} y={12} className="tcc-legend-detail">
              {ellipsis(mode === "compact" && r.setting ? r.setting : r.detail, maxChars)}
            </text>
          ) : null}
          {r.setting && mode === "full" ? (
            <text x={24} y={23} className="tcc-legend-detail tcc-legend-setting">
              {ellipsis(r.setting, maxChars)}
            </text>
          ) : null}
        </g>
      ))}
      {rows.length > shown.length ? (
        <text className="tcc-legend-detail" y={30 + used}>
          + {rows.length - shown.length} more
        </text>
      ) : null}
    </g>
  );
}
