// Checks on a project file's text and parsed JSON that come before the schema: how deep the values nest
// (the recursive steps after this one would overflow the stack on a hostile file) and where a reader
// replaced bytes that were not UTF-8.

/** A project nests a handful of levels (project, elements, record, curve, point); unknown fields may add some. */
export const MAX_NESTING = 64;

/** The top-level field under which `value` nests deeper than `limit`, and how deep; null when it does not. Iterative. */
export function tooDeep(value: unknown, limit = MAX_NESTING): { field: string; depth: number } | null {
  const stack: { v: unknown; depth: number; field: string }[] = [{ v: value, depth: 0, field: "" }];
  let worst: { field: string; depth: number } | null = null;
  while (stack.length > 0) {
    const { v, depth, field } = stack.pop()!;
    if (typeof v !== "object" || v === null) continue;
    const d = depth + 1;
    if (d > limit && (!worst || d > worst.depth)) worst = { field, depth: d };
    for (const [key, child] of Object.entries(v)) stack.push({ v: child, depth: d, field: depth === 0 ? key : field });
  }
  return worst;
}

/** 1-based numbers of the lines holding U+FFFD, the mark a UTF-8 reader leaves in place of invalid bytes. */
export function replacementCharLines(text: string): number[] {
  const lines: number[] = [];
  let line = 1;
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k);
    if (c === 0x0a) line++;
    else if (c === 0xfffd && lines[lines.length - 1] !== line) lines.push(line);
  }
  return lines;
}
