// Fault current through an element: an arrow along the stroke pointing the way the current flows
// (towards terminal a or b), with its value.
import type { BranchFlow } from "../../fault/overlayTypes.ts";
import { fmt } from "./formatting.ts";

interface Props {
  flow: BranchFlow;
  x: number;
  y: number;
  id: string;
  /** Terminal a is on the left instead of on top. */
  across?: boolean;
  /** Terminal a is at the bottom (a shunt above its bus). */
  aBelow?: boolean;
  /** Value written to the left of the arrow (keeps clear of the caption on the right). */
  textLeft?: boolean;
}

export function FlowArrow({ flow, x, y, id, across = false, aBelow = false, textLeft = false }: Props) {
  const toA = flow.towards === "a";
  let d: string;
  if (across) {
    d = toA ? `M ${x + 8} ${y} L ${x - 8} ${y} M ${x - 3} ${y - 4} L ${x - 8} ${y} L ${x - 3} ${y + 4}` : `M ${x - 8} ${y} L ${x + 8} ${y} M ${x + 3} ${y - 4} L ${x + 8} ${y} L ${x + 3} ${y + 4}`;
  } else {
    const up = toA !== aBelow;
    d = up ? `M ${x} ${y + 8} L ${x} ${y - 8} M ${x - 4} ${y - 3} L ${x} ${y - 8} L ${x + 4} ${y - 3}` : `M ${x} ${y - 8} L ${x} ${y + 8} M ${x - 4} ${y + 3} L ${x} ${y + 8} L ${x + 4} ${y + 3}`;
  }
  const text = flow.i_A >= 1000 ? `${fmt(flow.i_A / 1000)} kA` : `${fmt(flow.i_A)} A`;
  return (
    <g className="flow-arrow">
      <path d={d} fill="none" />
      <text x={across ? x - 14 : textLeft ? x - 6 : x + 6} y={across ? y - 7 : y + 4} textAnchor={textLeft ? "end" : undefined} data-testid={`flow-${id}`}>
        {text}
      </text>
    </g>
  );
}
