// IEC 60617-style symbols of our own drawing, one SVG per element kind. Every symbol is drawn in
// the node's own box with the connecting stroke on the vertical centre line, so ties meet it cleanly.
import type { ReactElement } from "react";
import type { Element } from "../../../src/model/schema.ts";

export const BRANCH_BOX = { w: 64, h: 110 } as const;
export const SHUNT_BOX = { w: 64, h: 84 } as const;

interface Props {
  element: Element;
  /** Shunt elements: terminal at the bottom (the element sits above its bus). */
  down?: boolean;
  /** Stroke colours of terminal a (top) and b (bottom). */
  colorA: string;
  colorB: string;
}

const cx = 32;

function Transformer({ colorA, colorB }: { colorA: string; colorB: string }) {
  const h = BRANCH_BOX.h;
  return (
    <g fill="none" strokeWidth={2}>
      <line x1={cx} y1={0} x2={cx} y2={h / 2 - 22} stroke={colorA} />
      <circle cx={cx} cy={h / 2 - 8} r={14} stroke={colorA} />
      <circle cx={cx} cy={h / 2 + 8} r={14} stroke={colorB} />
      <line x1={cx} y1={h / 2 + 22} x2={cx} y2={h} stroke={colorB} />
    </g>
  );
}

function LineSymbol({ element, colorA }: { element: Extract<Element, { kind: "line" }>; colorA: string }) {
  const h = BRANCH_BOX.h;
  const overhead = element.construction === "overhead";
  return (
    <g fill="none" stroke={colorA} strokeWidth={2}>
      <line x1={cx} y1={0} x2={cx} y2={h} strokeDasharray={overhead ? "8 4" : undefined} />
      {/* a cable gets the IEC mark of a sheathed conductor: a small ring around the stroke */}
      {!overhead && <ellipse cx={cx} cy={h / 2} rx={7} ry={3.5} strokeWidth={1.5} />}
    </g>
  );
}

function SwitchSymbol({ element, colorA, colorB }: { element: Extract<Element, { kind: "switch" }>; colorA: string; colorB: string }) {
  const h = BRANCH_BOX.h;
  const top = h / 2 - 16;
  const bottom = h / 2 + 16;
  // blade pivots at the bottom contact; closed: it reaches the fixed contact; open: it leans away
  const bladeEnd = element.closed ? { x: cx + 3, y: top + 2 } : { x: cx + 16, y: top + 6 };
  return (
    <g fill="none" strokeWidth={2}>
      <line x1={cx} y1={0} x2={cx} y2={top} stroke={colorA} />
      <line x1={cx} y1={bottom} x2={cx} y2={h} stroke={colorB} />
      <line x1={cx} y1={bottom} x2={bladeEnd.x} y2={bladeEnd.y} stroke={colorB} />
      {element.device === "breaker" && (
        <g stroke={colorA} strokeWidth={1.6}>
          <line x1={cx - 4} y1={top - 4} x2={cx + 4} y2={top + 4} />
          <line x1={cx + 4} y1={top - 4} x2={cx - 4} y2={top + 4} />
        </g>
      )}
      {element.device === "disconnector" && <line x1={cx - 5} y1={top} x2={cx + 5} y2={top} stroke={colorA} />}
    </g>
  );
}

// Shunt symbols are drawn with the terminal on top; `down` mirrors the strokes so the terminal is
// at the bottom (element above its bus), keeping letters upright.
function GridSymbol({ color, down }: { color: string; down: boolean }) {
  const h = SHUNT_BOX.h;
  const boxY = down ? 8 : h - 38;
  return (
    <g fill="none" stroke={color} strokeWidth={2}>
      <defs>
        <pattern id="islet-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="6" stroke="currentColor" strokeWidth="1.4" />
        </pattern>
      </defs>
      <rect x={cx - 20} y={boxY} width={40} height={30} fill="url(#islet-hatch)" style={{ color }} />
      {down ? <line x1={cx} y1={boxY + 30} x2={cx} y2={h} /> : <line x1={cx} y1={0} x2={cx} y2={boxY} />}
    </g>
  );
}

function RotatingMachine({ color, letter, sine, down }: { color: string; letter: string; sine: boolean; down: boolean }) {
  const h = SHUNT_BOX.h;
  const cy = down ? 30 : h - 34;
  return (
    <g fill="none" stroke={color} strokeWidth={2}>
      {down ? <line x1={cx} y1={cy + 18} x2={cx} y2={h} /> : <line x1={cx} y1={0} x2={cx} y2={cy - 18} />}
      <circle cx={cx} cy={cy} r={18} />
      <text x={cx} y={sine ? cy + 1 : cy + 6} textAnchor="middle" fontSize={16} fontWeight={600} fill={color} stroke="none">
        {letter}
      </text>
      {sine && <path d={`M ${cx - 8} ${cy + 9} q 4 -6 8 0 t 8 0`} strokeWidth={1.5} />}
    </g>
  );
}

function InverterSymbol({ color, down }: { color: string; down: boolean }) {
  const h = SHUNT_BOX.h;
  const s = 36;
  const top = down ? 10 : 22;
  const x0 = cx - s / 2;
  return (
    <g fill="none" stroke={color} strokeWidth={2}>
      {down ? <line x1={cx} y1={top + s} x2={cx} y2={h} /> : <line x1={cx} y1={0} x2={cx} y2={top} />}
      <rect x={x0} y={top} width={s} height={s} />
      <line x1={x0} y1={top + s} x2={x0 + s} y2={top} strokeWidth={1.4} />
      <g strokeWidth={1.5}>
        <line x1={x0 + 5} y1={top + 8} x2={x0 + 15} y2={top + 8} />
        <line x1={x0 + 5} y1={top + 12} x2={x0 + 15} y2={top + 12} />
        <path d={`M ${x0 + 20} ${top + 27} q 3 -5 6 0 t 6 0`} />
      </g>
    </g>
  );
}

function LoadSymbol({ color, down }: { color: string; down: boolean }) {
  const h = SHUNT_BOX.h;
  // the arrow points away from the bus
  return down ? (
    <g fill={color} stroke={color} strokeWidth={2}>
      <line x1={cx} y1={h} x2={cx} y2={h - 44} />
      <path d={`M ${cx - 10} ${h - 40} L ${cx + 10} ${h - 40} L ${cx} ${h - 60} Z`} strokeWidth={1} />
    </g>
  ) : (
    <g fill={color} stroke={color} strokeWidth={2}>
      <line x1={cx} y1={0} x2={cx} y2={44} />
      <path d={`M ${cx - 10} 40 L ${cx + 10} 40 L ${cx} 60 Z`} strokeWidth={1} />
    </g>
  );
}

export function ElementSymbol({ element, colorA, colorB, down = false }: Props): ReactElement | null {
  switch (element.kind) {
    case "transformer":
      return <Transformer colorA={colorA} colorB={colorB} />;
    case "line":
      return <LineSymbol element={element} colorA={colorA} />;
    case "switch":
      return <SwitchSymbol element={element} colorA={colorA} colorB={colorB} />;
    case "grid":
      return <GridSymbol color={colorA} down={down} />;
    case "generator":
      return <RotatingMachine color={colorA} letter="G" sine down={down} />;
    case "motor":
      return <RotatingMachine color={colorA} letter="M" sine={false} down={down} />;
    case "inverter":
      return <InverterSymbol color={colorA} down={down} />;
    case "load":
      return <LoadSymbol color={colorA} down={down} />;
    default:
      return null;
  }
}
