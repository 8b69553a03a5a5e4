// Geometry of the time-current plot inside its SVG: plot rectangle, legend column, caution footer.

export interface PlotLayout {
  width: number;
  height: number;
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
export function plotLayout(width: number, height: number): PlotLayout {
  const legendWidth = Math.round(Math.max(140, Math.min(240, width * 0.26)));
  const left = 56;
  const top = 14;
  const cautionY = height - 6;
  const axisTitleY = height - 24;
  const bottom = Math.max(top + 40, height - 56);
  const right = Math.max(left + 80, width - legendWidth - 14);
  return { width, height, left, top, right, bottom, legendX: right + 14, legendWidth, axisTitleY, cautionY };
}

/** Dash pattern of the fault marks of the n-th scenario. */
export function scenarioDash(index: number): string {
  const dashes = ["6 4", "2 3", "9 3 2 3", "12 4"];
  return dashes[((index % dashes.length) + dashes.length) % dashes.length];
}
