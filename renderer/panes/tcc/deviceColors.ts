// The pane's own series palette: eight hues spaced for both themes, in a fixed order so a device keeps
// its colour while the selected path changes as long as its position does.
const SERIES = ["#2a7fa8", "#d0632a", "#5a9a3c", "#9a4fb5", "#c79a16", "#c23b5d", "#3f8f86", "#6b6fd1"] as const;

/** Colour of the n-th device on the plot (cycles after eight). */
export function deviceColor(index: number): string {
  return SERIES[((index % SERIES.length) + SERIES.length) % SERIES.length];
}
