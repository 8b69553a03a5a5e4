// Geometry of the time-current plot inside its SVG: plot rectangle, legend column, caution footer.
// Every length scales with `s`, the pane's font size over 12 px, so the plot grows with the studio's
// fluid root font size (1366x768 up to 4K) instead of shrinking into the corner.

export interface PlotLayout {
  width: number;
  height: number;
  /** Scale of fixed lengths (offsets, legend rows, read-out box): font size / 12 px. */
  s: number;
  /** Plot area in SVG pixels. */
  left: number;
  top: number;
  right: number;
  bottom: number;
  /** Legend column x and width (to the right of the plot). */
  legendX: number;
  legendWidth: number;
  /** Baselines of the x-axis title and of the caution footer. */
  axisTitleY: number;
  cautionY: number;
}

/** Layout for an SVG of `width` x `height` CSS pixels; small sizes shrink the legend before the plot. */
export function plotLayout(width: number, height: number, s = 1): PlotLayout {
  const legendWidth = Math.round(Math.max(140 * s, Math.min(250 * s, width * 0.26)));
  const left = Math.round(54 * s);
  const top = Math.round(14 * s);
  const cautionY = height - Math.round(6 * s);
  const axisTitleY = height - Math.round(24 * s);
  const bottom = Math.max(top + 40, height - Math.round(58 * s));
  const right = Math.max(left + 80, width - legendWidth - Math.round(14 * s));
  return { width, height, s, left, top, right, bottom, legendX: right + Math.round(14 * s), legendWidth, axisTitleY, cautionY };
}

/** Dash pattern of the fault marks of the n-th scenario. */
export function scenarioDash(index: number): string {
  const dashes = ["6 4", "2 3", "9 3 2 3", "12 4"];
  return dashes[((index % dashes.length) + dashes.length) % dashes.length];
}
