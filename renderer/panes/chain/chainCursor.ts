// Keyboard stepping through the primary/backup chains of one fault: Up/Down along a source path
// (primary -> backups), Left/Right between source paths, Home/End to the ends of a path.

/** Position in the chains: source path index and step (link) index within it. */
export interface ChainCursor {
  path: number;
  step: number;
}

/** Just the shape the cursor needs: the number of steps of each path. */
export type ChainShape = readonly { readonly links: readonly unknown[] }[];

export type ChainKey = "ArrowUp" | "ArrowDown" | "ArrowLeft" | "ArrowRight" | "Home" | "End";

export function isChainKey(key: string): key is ChainKey {
  return key === "ArrowUp" || key === "ArrowDown" || key === "ArrowLeft" || key === "ArrowRight" || key === "Home" || key === "End";
}

/** The cursor after `key`; null when there is no step at all. Moving between paths keeps the depth
 * where the other path is deep enough, else goes to its last step; empty paths are skipped. */
export function moveChainCursor(paths: ChainShape, cursor: ChainCursor | null, key: ChainKey): ChainCursor | null {
  const start = clampCursor(paths, cursor);
  if (!start) return null;
  const len = paths[start.path].links.length;
  switch (key) {
    case "ArrowUp":
      return { path: start.path, step: Math.max(0, start.step - 1) };
    case "ArrowDown":
      return { path: start.path, step: Math.min(len - 1, start.step + 1) };
    case "Home":
      return { path: start.path, step: 0 };
    case "End":
      return { path: start.path, step: len - 1 };
    case "ArrowLeft":
    case "ArrowRight": {
      const dir = key === "ArrowRight" ? 1 : -1;
      for (let p = start.path + dir; p >= 0 && p < paths.length; p += dir) {
        const n = paths[p].links.length;
        if (n > 0) return { path: p, step: Math.min(start.step, n - 1) };
      }
      return start;
    }
  }
}

/** A valid cursor near `cursor` (first step of the first non-empty path when null or out of range). */
export function clampCursor(paths: ChainShape, cursor: ChainCursor | null): ChainCursor | null {
  if (cursor && cursor.path >= 0 && cursor.path < paths.length) {
    const n = paths[cursor.path].links.length;
    if (n > 0) return { path: cursor.path, step: Math.max(0, Math.min(n - 1, cursor.step)) };
  }
  const first = paths.findIndex((p) => p.links.length > 0);
  return first < 0 ? null : { path: first, step: 0 };
}

/** Where `deviceId` sits: the current path is preferred (a backup can be common to several paths),
 * then the shallowest occurrence; null when the device is on no path. */
export function cursorForDevice(
  paths: readonly { readonly links: readonly { readonly device: string }[] }[],
  deviceId: string,
  preferPath = -1,
): ChainCursor | null {
  if (preferPath >= 0 && preferPath < paths.length) {
    const s = paths[preferPath].links.findIndex((l) => l.device === deviceId);
    if (s >= 0) return { path: preferPath, step: s };
  }
  let best: ChainCursor | null = null;
  for (let pi = 0; pi < paths.length; pi++) {
    const s = paths[pi].links.findIndex((l) => l.device === deviceId);
    if (s >= 0 && (best === null || s < best.step)) best = { path: pi, step: s };
  }
  return best;
}
