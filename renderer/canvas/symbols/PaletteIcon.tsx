// Small palette icons reusing the one-line symbols at reduced scale.
import type { ElementKind } from "../../../src/model/schema.ts";
import { ElementSymbol, BRANCH_BOX, SHUNT_BOX } from "./ElementSymbol.tsx";
import { DeviceMarker } from "./DeviceMarker.tsx";
import { newElement } from "../newElement.ts";
import { newProject } from "../../../src/model/projectFile.ts";

const sampleDoc = newProject("palette");
const c = "currentColor";

export function PaletteIcon({ kind }: { kind: ElementKind }) {
  if (kind === "bus") {
    return (
      <svg width="28" height="28" viewBox="0 0 28 28" aria-hidden>
        <rect x="2" y="12" width="24" height="5" fill={c} />
      </svg>
    );
  }
  if (kind === "relay" || kind === "fuse" || kind === "lvbreaker") {
    const device = newElement(kind, sampleDoc, { element: "x", end: "from" });
    if (device.kind !== "relay" && device.kind !== "fuse" && device.kind !== "lvbreaker") return null;
    return (
      <svg width="28" height="28" viewBox="0 0 32 28" aria-hidden className="palette-device" stroke={c}>
        <DeviceMarker device={device} x={2} y={14} strokeX={28} />
        <line x1={28} y1={0} x2={28} y2={28} strokeWidth={1.5} />
      </svg>
    );
  }
  const element = newElement(kind, sampleDoc);
  // a square crop around the symbol's body
  const branch = kind === "transformer" || kind === "line" || kind === "switch";
  const top = branch ? (BRANCH_BOX.h - BRANCH_BOX.w) / 2 : (SHUNT_BOX.h - SHUNT_BOX.w) / 2 + 6;
  return (
    <svg width="28" height="28" viewBox={`0 ${top} ${BRANCH_BOX.w} ${BRANCH_BOX.w}`} aria-hidden>
      <ElementSymbol element={element} colorA={c} colorB={c} />
    </svg>
  );
}
