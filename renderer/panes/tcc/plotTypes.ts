// Types shared by the layers of the time-current plot.
import type { ScaleLogarithmic } from "d3";
import type { TccBand, TccEquipmentCurve, TccFaultMark, TccMarkerPoint } from "./tccTypes.ts";
import type { PlotLayout } from "./plotLayout.ts";

export type Scale = ScaleLogarithmic<number, number>;

/** Props of the static layer (everything that does not follow the pointer) and of its legend. */
export interface StaticProps {
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

/** Cut `s` to `n` characters with an ellipsis. */
export function ellipsis(s: string, n: number): string {
  return s.length <= n ? s : `${s.slice(0, Math.max(1, n - 1))}…`;
}
