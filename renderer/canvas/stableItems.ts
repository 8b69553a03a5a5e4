// Keeps the previous node or edge object when nothing it carries has changed, so React's memo
// skips it: an edit of one element then re-renders that element, not the whole diagram.
interface Item {
  id: string;
  position?: { x: number; y: number };
  data?: Record<string, unknown>;
  [key: string]: unknown;
}

/** Equal by identity, or arrays and plain objects equal member by member (two levels deep). */
function sameValue(a: unknown, b: unknown, depth = 2): boolean {
  if (a === b) return true;
  if (depth === 0 || typeof a !== "object" || typeof b !== "object" || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => sameValue(x, b[i], depth - 1));
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  if (ka.length !== kb.length) return false;
  return kb.every((k) => sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], depth - 1));
}

function sameItem(a: Item, b: Item): boolean {
  for (const key of Object.keys(b)) {
    if (key === "data" || key === "position") continue;
    if (!sameValue(a[key], b[key])) return false;
  }
  if (a.position?.x !== b.position?.x || a.position?.y !== b.position?.y) return false;
  const da = a.data ?? {};
  const db = b.data ?? {};
  const keys = Object.keys(db);
  if (keys.length !== Object.keys(da).length) return false;
  return keys.every((k) => sameValue(da[k], db[k]));
}

export function stableItems<T extends Item>(previous: readonly T[], next: T[]): T[] {
  if (previous.length === 0) return next;
  const before = new Map(previous.map((n) => [n.id, n]));
  return next.map((n) => {
    const old = before.get(n.id);
    return old && sameItem(old, n) ? old : n;
  });
}
