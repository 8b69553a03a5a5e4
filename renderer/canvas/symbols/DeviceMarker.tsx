// A protective device drawn where it sits: beside the connecting stroke at a branch end or at a
// shunt element's terminal. Relay: square with its IEEE C37.2 number, tied to the stroke by a CT
// mark; fuse: IEC fuse rectangle; LV breaker: breaker contact with a small trip-unit box.
import type { ProtectiveDevice } from "../../../src/model/schema.ts";

export const MARKER_W = 20;

interface Props {
  device: ProtectiveDevice;
  /** Left edge of this marker in the node's SVG coordinates. */
  x: number;
  /** Vertical centre. */
  y: number;
  /** x of the connecting stroke the device sits on. */
  strokeX: number;
}

function relayNumber(device: Extract<ProtectiveDevice, { kind: "relay" }>): string {
  const first = device.functions.find((f) => f.enabled) ?? device.functions[0];
  return first ? first.ansi : "51";
}

export function DeviceMarker({ device, x, y, strokeX }: Props) {
  const tie = <line x1={x + MARKER_W} y1={y} x2={strokeX} y2={y} strokeDasharray="2 2" strokeWidth={1} />;
  switch (device.kind) {
    case "relay": {
      const label = relayNumber(device);
      return (
        <g>
          {tie}
          <circle cx={strokeX} cy={y} r={4} fill="none" strokeWidth={1.2} />
          <rect x={x} y={y - 9} width={MARKER_W} height={18} rx={2} className="marker-body" />
          <text x={x + MARKER_W / 2} y={y + 3.5} textAnchor="middle" fontSize={label.length > 2 ? 7.5 : 9} className="marker-text">
            {label}
          </text>
        </g>
      );
    }
    case "fuse":
      return (
        <g>
          {tie}
          <rect x={x + 5} y={y - 10} width={10} height={20} className="marker-body" />
          <line x1={x + 10} y1={y - 10} x2={x + 10} y2={y + 10} strokeWidth={1.2} />
        </g>
      );
    case "lvbreaker":
      return (
        <g>
          {tie}
          <rect x={x} y={y - 9} width={MARKER_W} height={18} rx={2} className="marker-body" />
          <line x1={x + 6} y1={y + 6} x2={x + 14} y2={y - 5} strokeWidth={1.4} />
          <line x1={x + 11} y1={y - 8} x2={x + 17} y2={y - 2} strokeWidth={1.1} />
          <line x1={x + 17} y1={y - 8} x2={x + 11} y2={y - 2} strokeWidth={1.1} />
          <rect x={x + 2} y={y + 3} width={5} height={4} strokeWidth={0.9} className="marker-trip" />
        </g>
      );
  }
}
