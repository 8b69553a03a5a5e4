// Pointer cross-hair and read-out of the time-current plot (on screen only, left out of exports).
import type { TccBand } from "./tccTypes.ts";
import type { PlotLayout } from "./plotLayout.ts";
import { curveTimeAt } from "./curveTimeAt.ts";
import { NO_EXPORT_ATTR } from "./svgExport.ts";
import { ellipsis, type Scale } from "./plotTypes.ts";
import { formatCurrent_A, formatTime_s } from "../shared/formatQuantity.ts";

/** Cross-hair and the read-out box: pointer current and time, and each curve's time at that current. */
export function TccReadout(p: { pointer: { x: number; y: number }; x: Scale; y: Scale; layout: PlotLayout; bands: readonly TccBand[]; colors: Map<string, string> }) {
  const { pointer, layout: L } = p;
  const i_A = p.x.invert(pointer.x);
  const t_s = p.y.invert(pointer.y);
  const lines = p.bands.map((b) => ({ key: `${b.deviceId}/${b.functionId}`, name: b.deviceName, color: p.colors.get(b.deviceId) ?? "currentColor", t: curveTimeAt(b.nominal, i_A), below: b.nominal.length > 0 && i_A < b.nominal[0][0] }));
  // The box is drawn in 12 px units (boxW x boxH) and scaled by L.s.
  const boxW = 200;
  const boxH = 34 + lines.length * 14;
  const gap = 14 * L.s;
  const bx = pointer.x + gap + boxW * L.s > L.right ? pointer.x - gap - boxW * L.s : pointer.x + gap;
  const by = Math.min(Math.max(pointer.y + gap, L.top), L.bottom - boxH * L.s);
  return (
    <g {...{ [NO_EXPORT_ATTR]: "true" }} className="tcc-readout" pointerEvents="none">
      <line className="tcc-crosshair" x1={pointer.x} x2={pointer.x} y1={L.top} y2={L.bottom} />
      <line className="tcc-crosshair" y1={pointer.y} y2={pointer.y} x1={L.left} x2={L.right} />
      <g transform={`translate(${bx} ${by}) scale(${L.s})`} style={{ fontSize: "12px" }}>
        <rect className="tcc-readout-box" width={boxW} height={boxH} rx={4} />
        <text className="tcc-readout-head" x={8} y={15}>
          {formatCurrent_A(i_A)} · {formatTime_s(t_s)}
        </text>
        <text className="tcc-readout-sub" x={8} y={28}>
          curve times at this current
        </text>
        {lines.map((l, k) => (
          <g key={l.key} transform={`translate(8 ${42 + k * 14})`}>
            <rect width={8} height={8} y={-7} style={{ fill: l.color }} />
            <text x={14} className="tcc-readout-line">
              {ellipsis(l.name, 20)}
            </text>
            <text x={boxW - 16} className="tcc-readout-line" textAnchor="end">
              {l.t !== null ? formatTime_s(l.t) : l.below ? "no trip" : "—"}
            </text>
          </g>
        ))}
      </g>
    </g>
  );
}
