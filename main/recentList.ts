// The recent-files list: most recent first, no duplicates, at most RECENT_MAX entries,
// files that no longer exist dropped. Pure functions; fileStore.ts persists the list.
export const RECENT_MAX = 10;

/** Paths compare case-insensitively where the file system usually does (Windows, macOS). */
export function samePath(a: string, b: string, caseInsensitive: boolean): boolean {
  return caseInsensitive ? a.toLowerCase() === b.toLowerCase() : a === b;
}

export function addRecent(list: readonly string[], path: string, caseInsensitive = false, max = RECENT_MAX): string[] {
  return [path, ...list.filter((p) => !samePath(p, path, caseInsensitive))].slice(0, max);
}

export function dropMissing(list: readonly string[], exists: (path: string) => boolean): string[] {
  return list.filter((p) => exists(p));
}

/** Reads recent.json; a damaged or foreign file gives an empty list rather than an error. */
export function parseRecent(text: string, caseInsensitive = false): string[] {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return [];
  }
  const files = typeof data === "object" && data !== null ? (data as { files?: unknown }).files : undefined;
  if (!Array.isArray(files)) return [];
  let list: string[] = [];
  for (const f of files.slice().reverse()) {
    if (typeof f === "string" && f.length > 0) list = addRecent(list, f, caseInsensitive);
  }
  return list;
}

export function serializeRecent(list: readonly string[]): string {
  return JSON.stringify({ version: 1, files: list }, null, 2) + "\n";
}
