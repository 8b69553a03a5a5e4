// Fault cases and their locations by name, with the id where it helps: "Line-line fault on
// Main switchboard section A (LV-A), minimum". The study's labels use ids; the studio shows names.
import type { Project } from "../../src/model/schema.ts";
import type { MatrixRow } from "../../src/study/types.ts";
import { parseLocationKey } from "../../src/study/keys.ts";

const FAULT_WORDS: Record<string, string> = { "3ph": "Three-phase", LL: "Line-line", LG: "Line-earth", LLG: "Line-line-earth" };
const LIMIT_WORDS: Record<string, string> = { max: "maximum", min: "minimum" };

/** "Main switchboard section A (LV-A)", or the id alone when the element has no name. */
export function nameWithId(doc: Project, id: string): string {
  const e = doc.elements.find((x) => x.id === id);
  return e?.name ? `${e.name} (${id})` : id;
}

function parts(row: MatrixRow): { location: string; faultType: string; limit: string } | null {
  const p = row.id.split("|");
  if (p.length < 3) return null;
  return { location: p.slice(0, p.length - 2).join("|"), faultType: p[p.length - 2], limit: p[p.length - 1] };
}

/** A matrix row's label by names; the study's own label when its id is not a case row. */
export function rowLabelByName(doc: Project, row: MatrixRow): string {
  const p = parts(row);
  const loc = p && parseLocationKey(p.location);
  if (!p || !loc) return row.label;
  const where = loc.kind === "bus" ? nameWithId(doc, loc.bus) : `${nameWithId(doc, loc.line)} at ${loc.pct} %`;
  return `${FAULT_WORDS[p.faultType] ?? p.faultType} fault on ${where}, ${LIMIT_WORDS[p.limit] ?? p.limit}`;
}

/** Rows grouped by the faulted bus, or by the line for every point along it, named. */
export function rowGroupByName(doc: Project, row: MatrixRow): { key: string; label: string } {
  const p = parts(row);
  const loc = p && parseLocationKey(p.location);
  if (!loc) return { key: row.id, label: row.label };
  if (loc.kind === "bus") return { key: `bus:${loc.bus}`, label: nameWithId(doc, loc.bus) };
  return { key: `line:${loc.line}`, label: `${nameWithId(doc, loc.line)}, along the line` };
}

/** A row under its group's header: the place is in the header, so the fault and the limit (and the
 * point along a line) are enough: "Line-line, minimum", "at 50 %: Three-phase, maximum". */
export function rowCaption(row: MatrixRow): string {
  const p = parts(row);
  const loc = p && parseLocationKey(p.location);
  if (!p || !loc) return row.label;
  const what = `${FAULT_WORDS[p.faultType] ?? p.faultType}, ${LIMIT_WORDS[p.limit] ?? p.limit}`;
  return loc.kind === "line" ? `at ${loc.pct} %: ${what}` : what;
}
