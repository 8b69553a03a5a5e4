// The time-current pane: log-log plot of the devices on the selected path as tolerance bands,
// equipment withstand curves, inrush points and fault-current marks; pointer read-out; drag a curve
// to change its pickup (horizontal) or time multiplier (vertical); export to SVG and PNG.
import { useCallback, useEffect, useId, useMemo, useRef, useState, type KeyboardEvent as ReactKeyboardEvent, type PointerEvent as ReactPointerEvent } from "react";
import { scaleLog } from "d3";
import type { TccBand, TccEquipmentCurve, TccExportFile, TccFaultMark, TccMarkerPoint, TccSettingPatch } from "./tccTypes.ts";
import { toScreen } from "./bandPath.ts";
import { autoCurrentDomain } from "./autoCurrentDomain.ts";
import { hitTest, type HitTarget } from "./hitTest.ts";
import { dragAxis, settingFromDrag, type DragAxis, type DragLimits } from "./dragSetting.ts";
import { isNudgeKey, nudgeSetting } from "./nudgeSetting.ts";
import { deviceColor } from "./deviceColors.ts";
import { plotLayout } from "./plotLayout.ts";
import { exportPlot } from "./svgExport.ts";
import { TccStaticLayer } from "./TccStaticLayer.tsx";
import { TccDragGhost } from "./TccDragGhost.tsx";
import { TccReadout } from "./TccReadout.tsx";
import { trimNumber } from "../shared/formatQuantity.ts";
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

  // Escape abandons a drag wherever the keyboard focus is; caught in the capture phase so the
  // studio's own Escape (clear the fault, the selection) does not fire as well.
  useEffect(() => {
    if (!drag) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Escape") return;
      e.preventDefault();
      e.stopPropagation();
      cancelDrag();
    };
    window.addEventListener("keydown", onKey, true);
    return () => window.removeEventListener("keydown", onKey, true);
  }, [drag, cancelDrag]);

  // With the plot focused, arrow keys change the highlighted (else hovered) curve's setting: one edit per press.
  const onKeyDown = (e: ReactKeyboardEvent<SVGSVGElement>) => {
    if (!isNudgeKey(e.key) || drag || !onSettingChange) return;
    const band = bands.find((b) => b.deviceId === highlightDeviceId && b.draggable) ?? (hoverIndex !== null ? bands[hoverIndex] : undefined);
    if (!band) return;
    const patch = nudgeSetting(band, e.key, e.shiftKey, props.dragLimits);
    if (!patch) return;
    e.preventDefault();
    onSettingChange(band.deviceId, band.functionId, patch, { final: true });
  };

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
            tabIndex={0}
            aria-label={`Time-current plot, currents at ${props.referenceVoltage_kV} kV. Arrow keys change the highlighted curve: left and right its pickup, up and down its multiplier; Shift for larger steps.`}
            onKeyDown={onKeyDown}
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
            <TccStaticLayer
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
              <TccDragGhost uid={uid} band={bands[drag.bandIndex]} patch={drag.patch} x={x} y={y} layout={layout} color={colors.get(bands[drag.bandIndex].deviceId) ?? "currentColor"} />
            ) : null}
            {pointer ? <TccReadout pointer={pointer} x={x} y={y} layout={layout} bands={bands} colors={colors} /> : null}
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
