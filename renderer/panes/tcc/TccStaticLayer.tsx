// The static layer of the time-current plot: grid, axes, equipment, fault marks, device bands,
// legend and caution. Memoised so that pointer moves (read-out, hover) do not redraw it.
import { memo } from "react";
import { bandPath, linePath, regionAbovePath } from "./bandPath.ts";
import { logTicks, tickLabel } from "./logTicks.ts";
import { scenarioDash } from "./plotLayout.ts";
import { TccLegend } from "./TccLegend.tsx";
import type { StaticProps } from "./plotTypes.ts";
import { CAUTION_TEXT } from "../shared/caution.ts";
import { formatCurrent_A, trimNumber } from "../shared/formatQuantity.ts";

/** Everything that does not move with the pointer, memoised so the read-out stays cheap. */
export const TccStaticLayer = memo(function TccStaticLayer(p: StaticProps) {
  const { layout: L, x, y } = p;
  const xt = logTicks(x.domain()[0], x.domain()[1]);
  const yt = logTicks(y.domain()[0], y.domain()[1]);
  const scenarioIds = [...new Set(p.faultMarks.map((m) => m.scenarioId ?? ""))];
  const order = p.bands.map((b, k) => k).sort((a, b) => Number(p.bands[a].deviceId === p.highlightDeviceId) - Number(p.bands[b].deviceId === p.highlightDeviceId));
  const anyHighlight = p.highlightDeviceId !== null && p.bands.some((b) => b.deviceId === p.highlightDeviceId);

  return (
    <g>
      <defs>
        <clipPath id={`${p.uid}-clip`}>
          <rect x={L.left} y={L.top} width={L.right - L.left} height={L.bottom - L.top} />
        </clipPath>
        <pattern id={`${p.uid}-hatch-transformer`} width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="7" className="tcc-hatch-line tcc-hatch-transformer" />
        </pattern>
        <pattern id={`${p.uid}-hatch-cable`} width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(-45)">
          <line x1="0" y1="0" x2="0" y2="7" className="tcc-hatch-line tcc-hatch-cable" />
        </pattern>
      </defs>
      <rect className="tcc-plot-bg" x={L.left} y={L.top} width={L.right - L.left} height={L.bottom - L.top} />
      <g className="tcc-grid">
        {xt.minor.map((v) => (
          <line key={`xm${v}`} className="tcc-grid-minor" x1={x(v)} x2={x(v)} y1={L.top} y2={L.bottom} />
        ))}
        {yt.minor.map((v) => (
          <line key={`ym${v}`} className="tcc-grid-minor" y1={y(v)} y2={y(v)} x1={L.left} x2={L.right} />
        ))}
        {xt.major.map((v) => (
          <line key={`xM${v}`} className="tcc-grid-major" x1={x(v)} x2={x(v)} y1={L.top} y2={L.bottom} />
        ))}
        {yt.major.map((v) => (
          <line key={`yM${v}`} className="tcc-grid-major" y1={y(v)} y2={y(v)} x1={L.left} x2={L.right} />
        ))}
      </g>
      <g className="tcc-axis">
        {xt.major.map((v) => (
          <text key={`xl${v}`} className="tcc-tick-label" x={x(v)} y={L.bottom + 15 * L.s} textAnchor="middle">
            {tickLabel(v)}
          </text>
        ))}
        {yt.major.map((v) => (
          <text key={`yl${v}`} className="tcc-tick-label" x={L.left - 6 * L.s} y={y(v) + 4 * L.s} textAnchor="end">
            {tickLabel(v)}
          </text>
        ))}
        <text className="tcc-axis-title" x={(L.left + L.right) / 2} y={L.axisTitleY} textAnchor="middle">
          Current (A) referred to {trimNumber(p.referenceVoltage_kV, 4)} kV
        </text>
        <text className="tcc-axis-title" transform={`translate(${14 * L.s} ${(L.top + L.bottom) / 2}) rotate(-90)`} textAnchor="middle">
          Time (s)
        </text>
      </g>

      <g clipPath={`url(#${p.uid}-clip)`}>
        {p.equipment.map((e) => {
          const cls = `tcc-equipment tcc-${e.kind}`;
          return (
            <g key={e.id} className={cls}>
              {e.kind !== "motor-start" ? (
                <path className="tcc-damage-region" d={regionAbovePath(e.points, x, y, L.top)} fill={`url(#${p.uid}-hatch-${e.kind === "cable-damage" ? "cable" : "transformer"})`} />
              ) : null}
              <path className="tcc-equipment-line" d={linePath(e.points, x, y)} />
            </g>
          );
        })}
        {p.markers.map((m) => (
          <g key={m.id} className="tcc-marker" transform={`translate(${x(m.current_A)} ${y(m.time_s)}) scale(${L.s})`} style={{ fontSize: "12px" }}>
            <path d="M-5,0L0,-5L5,0L0,5Z" className="tcc-marker-shape" />
            {/* The label goes left of the point near the right edge so it stays on the plot. */}
            <text x={x(m.current_A) > L.right - 130 * L.s ? -8 : 8} y={-6} textAnchor={x(m.current_A) > L.right - 130 * L.s ? "end" : "start"} className="tcc-marker-label">
              {m.name}
            </text>
          </g>
        ))}
        {p.faultMarks.map((m, k) => {
          const xi = x(m.current_A);
          // A label that would overlap its left neighbour's goes on the right of its line.
          const crowded = p.faultMarks.some((o, j) => j < k && Math.abs(x(o.current_A) - xi) < 13 * L.s);
          return (
            <g key={m.id} className="tcc-fault-mark">
              <line x1={xi} x2={xi} y1={L.top} y2={L.bottom} strokeDasharray={scenarioDash(scenarioIds.indexOf(m.scenarioId ?? ""))} className="tcc-fault-line" />
              <text className="tcc-fault-label" transform={`translate(${crowded ? xi + 11 * L.s : xi - 4 * L.s} ${L.top + 6 * L.s}) rotate(-90)`} textAnchor="end">
                {m.label} · {formatCurrent_A(m.current_A)}
              </text>
            </g>
          );
        })}
        {order.map((k) => {
          const b = p.bands[k];
          const color = p.colors.get(b.deviceId) ?? "currentColor";
          const hl = b.deviceId === p.highlightDeviceId;
          const cls = `tcc-device${hl ? " is-highlight" : ""}${anyHighlight && !hl ? " is-dimmed" : ""}${k === p.hoverIndex ? " is-hover" : ""}`;
          return (
            <g key={`${b.deviceId}/${b.functionId}`} className={cls} data-device-id={b.deviceId}>
              <path className="tcc-band" d={bandPath(b.min, b.max, x, y)} style={{ fill: color }} />
              <path className="tcc-nominal" d={linePath(b.nominal, x, y)} style={{ stroke: color }} />
            </g>
          );
        })}
      </g>
      {p.bands.length === 0 ? (
        <text className="tcc-empty" x={(L.left + L.right) / 2} y={(L.top + L.bottom) / 2} textAnchor="middle">
          No protective device on the selected path
        </text>
      ) : null}
      <rect className="tcc-plot-frame" x={L.left} y={L.top} width={L.right - L.left} height={L.bottom - L.top} />
      <TccLegend {...p} />
      <text className="tcc-caution" x={L.left} y={L.cautionY}>
        {CAUTION_TEXT}
      </text>
    </g>
  );
});
