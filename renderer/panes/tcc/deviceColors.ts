// The pane's own series palette: eight hues in a fixed order, defined in panes.css as
// --p-series-0..7 for the light and the dark theme, so a device keeps its colour while the
// selected path changes as long as its position does.
const SERIES_COUNT = 8;

/** CSS colour of the n-th device on the plot (cycles after eight). */
export function deviceColor(index: number): string {
  const k = ((index % SERIES_COUNT) + SERIES_COUNT) % SERIES_COUNT;
  return `var(--p-series-${k})`;
}
