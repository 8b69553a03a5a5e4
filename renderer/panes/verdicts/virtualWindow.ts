// Which lines of a fixed-height list to render for a scroll position (list virtualisation).

export interface VirtualWindow {
  /** First and one-past-last line index to render. */
  start: number;
  end: number;
  /** Blank space above and below the rendered lines, px. */
  padTop_px: number;
  padBottom_px: number;
}

export function virtualWindow(scrollTop_px: number, viewport_px: number, rowHeight_px: number, count: number, overscan = 8): VirtualWindow {
  if (count <= 0 || rowHeight_px <= 0) return { start: 0, end: 0, padTop_px: 0, padBottom_px: 0 };
  const first = Math.floor(Math.max(0, scrollTop_px) / rowHeight_px);
  const visible = Math.ceil(Math.max(0, viewport_px) / rowHeight_px) + 1;
  const start = Math.max(0, Math.min(count - 1, first) - overscan);
  const end = Math.min(count, first + visible + overscan);
  return { start, end, padTop_px: start * rowHeight_px, padBottom_px: (count - end) * rowHeight_px };
}
