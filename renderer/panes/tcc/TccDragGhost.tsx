// Preview of a dragged curve (on screen only, left out of exports).
import type { TccBand, TccSettingPatch } from "./tccTypes.ts";
import type { PlotLayout } from "./plotLayout.ts";
import { linePath } from "./bandPath.ts";
import { NO_EXPORT_ATTR } from "./svgExport.ts";
import type { Scale } from "./plotTypes.ts";
import { formatCurrent_A, trimNumber } from "../shared/formatQuantity.ts";

/** The dragged curve moved by the pending change: an exact preview for inverse-time curves (see dragSetting.ts). */
export function TccDragGhost(p: { uid: string; band: TccBand; patch: TccSettingPatch; x: Scale; y: Scale; layout: PlotLayout; color: string }) {
  const fi = p.patch.pickup_A !== undefined ? p.patch.pickup_A / p.band.pickup_A : 1;
  const ft = p.patch.multiplier !== undefined && p.band.multiplier ? p.patch.multiplier / p.band.multiplier : 1;
  const moved = p.band.nominal.map(([i, t]) => [i * fi, t * ft] as const);
  const label = p.patch.pickup_A !== undefined ? `${p.band.pickupLabel ?? "pickup"} ${formatCurrent_A(p.patch.pickup_A)}` : `multiplier ${trimNumber(p.patch.multiplier ?? 0, 3)}`;
  return (
    <g {...{ [NO_EXPORT_ATTR]: "true" }} className="tcc-ghost" clipPath={`url(#${p.uid}-clip)`}>
      <path d={linePath(moved, p.x, p.y)} style={{ stroke: p.color }} className="tcc-ghost-line" />
      <text x={p.layout.left + 8 * p.layout.s} y={p.layout.top + 16 * p.layout.s} className="tcc-ghost-label">
        {p.band.deviceName}: {label}
      </text>
    </g>
  );
}
