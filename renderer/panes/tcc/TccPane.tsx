// The time-current pane: log-log plot of the devices on the selected path as tolerance bands,
// equipment withstand curves, inrush points and fault-current marks; pointer read-out; drag a curve
// to change its pickup (horizontal) or time multiplier (vertical); export to SVG and PNG.
import { memo, useCallback, useEffect, useId, useMemo, useRef, useState, type PointerEvent as ReactPointerEvent, type ReactElement } from "react";
import { scaleLog, type ScaleLogarithmic } from "d3";
import type { TccBand, TccEquipmentCurve, TccExportFile, TccFaultMark, TccMarkerPoint, TccSettingPatch } from "./tccTypes.ts";
import { bandPath, linePath, regionAbovePath, toScreen } from "./bandPath.ts";
import { curveTimeAt } from "./curveTimeAt.ts";
import { logTicks, tickLabel } from "./logTicks.ts";
import { autoCurrentDomain } from "./autoCurrentDomain.ts";
import { hitTest, type HitTarget } from "./hitTest.ts";
import { dragAxis, settingFromDrag, type DragAxis, type DragLimits } from "./dragSetting.ts";
import { deviceColor } from "./deviceColors.ts";
import { plotLayout, scenarioDash, type PlotLayout } from "./plotLayout.ts";
import { exportPlot, NO_EXPORT_ATTR } from "./svgExport.ts";
import { CAUTION_TEXT } from "../shared/caution.ts";
import { formatCurrent_A, formatTime_s, trimNumber } from "../shared/formatQuantity.ts";
import { useElementSize } from "../shared/useElementSize.ts";
import "../panes.css";

export interface TccPaneProps {
  /** Voltage in kV every current on the plot is referred to; shown in the header and on the axis. */
  referenceVoltage_kV: number;
  /** Header title, e.g. the faulted location and the selected path. */
  title?: string;
  /** Device characteristics on the selected path, drawn in this order (later on top). */
  bands: readonly TccBand[];
  /** Equipment withstand curves (transformer and cable damage) and motor starting curves. */
  equipment?: readonly TccEquipmentCurve[];
  /** Single points such as transformer inrush. */
  markers?: readonly TccMarkerPoint[];
  /** Fault currents of the selected case in each scenario (vertical dashed marks). */
  faultMarks?: readonly TccFaultMark[];
  /** Device of the current chain step: drawn on top, thicker; the others are dimmed. */
  highlightDeviceId?: string | null;
  /** Time axis range in s (default 0.01 to 1000). */
  timeDomain_s?: readonly [number, number];
  /** Current axis range in A (default: whole decades around the data). */
  currentDomain_A?: readonly [number, number];
  /** Bounds and rounding of values produced by dragging. */
  dragLimits?: DragLimits;
  /** A drag changes a setting: called on every move with final=false and once more with final=true
   * at the end (also on Escape, with the original values), so the shell can make one undoable edit. */
  onSettingChange?: (deviceId: string, functionId: string, patch: TccSettingPatch, options: { final: boolean }) => void;
  /** A click (no drag) on a curve. */
  onDeviceSelect?: (deviceId: string) => void;
  /** Export: the pane hands over the file; the shell saves it through the host adapter. Without it, no export buttons. */
  onExport?: (file: TccExportFile) => void;
  /** Reported when an export fails (e.g. the browser cannot rasterise the SVG). */
  onExportError?: (message: string) => void;
  /** Base of the suggested export file name (default "time-current"). */
  exportName?: string;
  /** A message about the plot, e.g. a device whose curve cannot be drawn (its id, name and field); shown above the plot. */
  notice?: string | null;
}

type Scale = ScaleLogarithmic<number, number>;

interface DragState {
  pointerId: number;
  /** Settings when the drag began: the shell may re-render with new ones while dragging. */
  pickup_A: number;
  multiplier?: number;
  bandIndex: number;
  x0: number;
  y0: number;
  current0_A: number;
  time0_s: number;
  axis: DragAxis | null;
  patch: TccSettingPatch | null;
  moved: boolean;
}

const DEFAULT_TIME: readonly [number, number] = [0.01, 1000];
// Shared empty lists: a fresh [] per render would defeat the memoised layers.
const NONE_EQUIPMENT: readonly TccEquipmentCurve[] = [];
const NONE_MARKERS: readonly TccMarkerPoint[] = [];
const NONE_MARKS: readonly TccFaultMark[] = [];

export function TccPane(props: TccPaneProps) {
  const { bands, equipment = NONE_EQUIPMENT, markers = NONE_MARKERS, faultMarks = NONE_MARKS, highlightDeviceId = null, onSettingChange, onExport } = props;
  // A stable wrapper so the memoised static layer does not redraw when the shell passes a new arrow function.
  const selectRef = useRef(props.onDeviceSelect);
  selectRef.current = props.onDeviceSelect;
  const selectDevice = useCallback((deviceId: string) => selectRef.current?.(deviceId), []);
  const boxRef = useRef<HTMLDivElement>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const { width, height } = useElementSize(boxRef);
  // Font size of the pane sets the scale of every fixed length (fluid root font size in the studio).
  const fontPx = boxRef.current ? parseFloat(getComputedStyle(boxRef.current).fontSize) || 12 : 12;
  const layout = useMemo(() => plotLayout(Math.max(width, 320), Math.max(height, 150), fontPx / 12), [width, height, fontPx]);
  const [pointer, setPointer] = useState<{ x: number; y: number } | null>(null);
  const [hoverIndex, setHoverIndex] = useState<number | null>(null);
  const [drag, setDrag] = useState<DragState | null>(null);
  const [busy, setBusy] = useState(false);
  // Ids of clip path and hatch patterns, unique per pane instance so two plots on one page never share them.
  const uid = `tcc${useId().replace(/[^A-Za-z0-9]/g, "")}`;

  const currentDomain = useMemo<[number, number]>(
    () => (props.currentDomain_A ? [props.currentDomain_A[0], props.currentDomain_A[1]] : autoCurrentDomain(bands, equipment, faultMarks, markers)),
    [props.currentDomain_A, bands, equipment, faultMarks, markers],
  );
  const timeDomain = props.timeDomain_s ?? DEFAULT_TIME;

  const x = useMemo(() => scaleLog().domain(currentDomain).range([layout.left, layout.right]), [currentDomain, layout]);
  const y = useMemo(() => scaleLog().domain([timeDomain[0], timeDomain[1]]).range([layout.bottom, layout.top]), [timeDomain, layout]);

  const colors = useMemo(() => deviceColorMap(bands), [bands]);
  const targets = useMemo<HitTarget[]>(
    () =>
      bands.map((b, index) => ({
        index,
        nominal: toScreen(b.nominal, x, y),
        band: [...toScreen(b.min, x, y), ...toScreen(b.max, x, y).reverse()],
      })),
    [bands, x, y],
  );

  const localPoint = (e: ReactPointerEvent<SVGSVGElement>) => {
    const r = e.currentTarget.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  };
  const inPlot = (p: { x: number; y: number }) => p.x >= layout.left && p.x <= layout.right && p.y >= layout.top && p.y <= layout.bottom;

  const onPointerDown = (e: ReactPointerEvent<SVGSVGElement>) => {
    if (e.button !== 0) return;
    const p = localPoint(e);
    if (!inPlot(p)) return;
    const index = hitTest(p.x, p.y, targets);
    if (index === null) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    const band = bands[index];
    setDrag({ pointerId: e.pointerId, pickup_A: band.pickup_A, multiplier: band.multiplier, bandIndex: index, x0: p.x, y0: p.y, current0_A: x.invert(p.x), time0_s: y.invert(p.y), axis: null, patch: null, moved: false });
  };

  const onPointerMove = (e: ReactPointerEvent<SVGSVGElement>) => {
    const p = localPoint(e);
    setPointer(inPlot(p) ? p : null);
    if (!drag) {
      setHoverIndex(inPlot(p) ? hitTest(p.x, p.y, targets) : null);
      return;
    }
    if (e.pointerId !== drag.pointerId) return;
    const band = bands[drag.bandIndex];
    if (!band) return;
    const axis = drag.axis ?? dragAxis(p.x - drag.x0, p.y - drag.y0, band.draggable ?? {});
    if (!axis) {
      if (Math.hypot(p.x - drag.x0, p.y - drag.y0) >= 4) setDrag({ ...drag, moved: true });
      return;
    }
    const patch = settingFromDrag(axis, drag, x.invert(clampPx(p.x, layout.left, layout.right)), y.invert(clampPx(p.y, layout.top, layout.bottom)), props.dragLimits);
    const changed = !drag.patch || drag.patch.pickup_A !== patch.pickup_A || drag.patch.multiplier !== patch.multiplier;
    setDrag({ ...drag, axis, patch, moved: true });
    if (changed) onSettingChange?.(band.deviceId, band.functionId, patch, { final: false });
  };

  const endDrag = (e: ReactPointerEvent<SVGSVGElement>) => {
    if (!drag || e.pointerId !== drag.pointerId) return;
    const band = bands[drag.bandIndex];
    if (band && drag.patch) onSettingChange?.(band.deviceId, band.functionId, drag.patch, { final: true });
    else if (band && !drag.moved) selectDevice(band.deviceId);
    setDrag(null);
  };

  const cancelDrag = useCallback(() => {
    if (!drag) return;
    const band = bands[drag.bandIndex];
    if (band && drag.patch) {
      const original: TccSettingPatch = drag.axis === "pickup" ? { pickup_A: drag.pickup_A } : { multiplier: drag.multiplier };
      onSettingChange?.(band.deviceId, band.functionId, original, { final: true });
    }
    setDrag(null);
  }, [drag, bands, onSettingChange]);

  // Escape abandons a drag wherever the keyboard focus is.
  useEffect(() => {
    if (!drag) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") cancelDrag();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [drag, cancelDrag]);

  const startExport = async (kind: "svg" | "png") => {
    if (!svgRef.current || !onExport || busy) return;
    setBusy(true);
    try {
      const title = [`Time-current, currents at ${trimNumber(props.referenceVoltage_kV, 4)} kV`, props.title].filter(Boolean).join(" · ");
      onExport(await exportPlot(svgRef.current, kind, props.exportName ?? "time-current", title));
    } catch (err) {
      props.onExportError?.(err instanceof Error ? err.message : String(err));
    } finally {
      setBusy(false);
    }
  };

  const activeIndex = drag?.bandIndex ?? hoverIndex;
  const activeBand = activeIndex !== null ? bands[activeIndex] : undefined;
  const cursor = drag?.axis === "pickup" ? "ew-resize" : drag?.axis === "multiplier" ? "ns-resize" : activeBand && activeBand.draggable && (activeBand.draggable.pickup || activeBand.draggable.multiplier) ? "move" : "crosshair";

  return (
    <section className="ap-pane tcc-pane" aria-label="Time-current plot">
      <header className="ap-header">
        <h2 className="ap-title">Time-current</h2>
        {props.title ? <span className="ap-subtitle">{props.title}</span> : null}
        <span className="ap-chip" title="All currents on the plot are referred to this voltage">
          currents at {trimNumber(props.referenceVoltage_kV, 4)} kV
        </span>
        <span className="ap-spacer" />
        {onExport ? (
          <>
            <button type="button" className="ap-button" disabled={busy} onClick={() => void startExport("svg")}>
              Export SVG
            </button>
            <button type="button" className="ap-button" disabled={busy} onClick={() => void startExport("png")}>
              Export PNG
            </button>
          </>
        ) : null}
      </header>
      {props.notice ? (
        <div className="ap-notice" role="status">
          {props.notice}
        </div>
      ) : null}
      <div className="tcc-plot-box" ref={boxRef}>
        {width > 0 && height > 0 ? (
          <svg
            ref={svgRef}
            className="tcc-svg"
            width={layout.width}
            height={layout.height}
            style={{ cursor }}
            role="img"
            aria-label={`Time-current plot, currents at ${props.referenceVoltage_kV} kV`}
            onPointerDown={onPointerDown}
            onPointerMove={onPointerMove}
            onPointerUp={endDrag}
            onPointerCancel={endDrag}
            onPointerLeave={() => {
              if (!drag) {
                setPointer(null);
                setHoverIndex(null);
              }
            }}
          >
            <PlotStatic
              layout={layout}
              x={x}
              y={y}
              bands={bands}
              equipment={equipment}
              markers={markers}
              faultMarks={faultMarks}
              colors={colors}
              highlightDeviceId={highlightDeviceId}
              referenceVoltage_kV={props.referenceVoltage_kV}
              uid={uid}
              onLegendSelect={selectDevice}
              hoverIndex={activeIndex}
            />
            {drag && drag.patch && bands[drag.bandIndex] ? (
              <DragGhost uid={uid} band={bands[drag.bandIndex]} patch={drag.patch} x={x} y={y} layout={layout} color={colors.get(bands[drag.bandIndex].deviceId) ?? "currentColor"} />
            ) : null}
            {pointer ? <PointerReadout pointer={pointer} x={x} y={y} layout={layout} bands={bands} colors={colors} /> : null}
          </svg>
        ) : null}
      </div>
    </section>
  );
}

function clampPx(v: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, v));
}

/** One colour per device (a relay's several functions share it), in order of first appearance. */
function deviceColorMap(bands: readonly TccBand[]): Map<string, string> {
  const m = new Map<string, string>();
  for (const b of bands) if (!m.has(b.deviceId)) m.set(b.deviceId, deviceColor(m.size));
  return m;
}

interface StaticProps {
  layout: PlotLayout;
  x: Scale;
  y: Scale;
  bands: readonly TccBand[];
  equipment: readonly TccEquipmentCurve[];
  markers: readonly TccMarkerPoint[];
  faultMarks: readonly TccFaultMark[];
  colors: Map<string, string>;
  highlightDeviceId: string | null;
  referenceVoltage_kV: number;
  /** Prefix of the SVG ids (clip path, hatch patterns). */
  uid: string;
  /** A device's legend entry was clicked. */
  onLegendSelect: (deviceId: string) => void;
  /** Band under the pointer or being dragged (drawn a little stronger). */
  hoverIndex: number | null;
}

/** Everything that does not move with the pointer, memoised so the read-out stays cheap. */
const PlotStatic = memo(function PlotStatic(p: StaticProps) {
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
      <Legend {...p} />
      <text className="tcc-caution" x={L.left} y={L.cautionY}>
        {CAUTION_TEXT}
      </text>
    </g>
  );
});

function Legend(p: StaticProps) {
  const L = p.layout;
  const rows: { key: string; swatch: ReactElement; title: string; detail: string; setting?: string; highlight: boolean; deviceId?: string }[] = [];
  for (const b of p.bands) {
    const color = p.colors.get(b.deviceId) ?? "currentColor";
    const setting = [`pickup ${formatCurrent_A(b.pickup_A)}`, b.multiplier !== undefined ? `multiplier ${trimNumber(b.multiplier, 3)}` : ""].filter(Boolean).join(" · ");
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

function ellipsis(s: string, n: number): string {
  return s.length <= n ? s : `${s.slice(0, Math.max(1, n - 1))}…`;
}

/** The dragged curve moved by the pending change: an exact preview for inverse-time curves (see dragSetting.ts). */
function DragGhost(p: { uid: string; band: TccBand; patch: TccSettingPatch; x: Scale; y: Scale; layout: PlotLayout; color: string }) {
  const fi = p.patch.pickup_A !== undefined ? p.patch.pickup_A / p.band.pickup_A : 1;
  const ft = p.patch.multiplier !== undefined && p.band.multiplier ? p.patch.multiplier / p.band.multiplier : 1;
  const moved = p.band.nominal.map(([i, t]) => [i * fi, t * ft] as const);
  const label = p.patch.pickup_A !== undefined ? `pickup ${formatCurrent_A(p.patch.pickup_A)}` : `multiplier ${trimNumber(p.patch.multiplier ?? 0, 3)}`;
  return (
    <g {...{ [NO_EXPORT_ATTR]: "true" }} className="tcc-ghost" clipPath={`url(#${p.uid}-clip)`}>
      <path d={linePath(moved, p.x, p.y)} style={{ stroke: p.color }} className="tcc-ghost-line" />
      <text x={p.layout.left + 8 * p.layout.s} y={p.layout.top + 16 * p.layout.s} className="tcc-ghost-label">
        {p.band.deviceName}: {label}
      </text>
    </g>
  );
}

/** Cross-hair and the read-out box: pointer current and time, and each curve's time at that current. */
function PointerReadout(p: { pointer: { x: number; y: number }; x: Scale; y: Scale; layout: PlotLayout; bands: readonly TccBand[]; colors: Map<string, string> }) {
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
