// What a deletion takes with it and what it leaves behind: devices looking into a removed element go
// too; an element tied to a removed bus stays, with that terminal not connected. Pure, for the notice.
import { isProtectiveDevice, type Element, type Project } from "../../src/model/schema.ts";

const TERMINAL_WORDS: Record<string, string> = {
  bus: "its bus",
  fromBus: "its from bus",
  toBus: "its to bus",
  hvBus: "its HV bus",
  lvBus: "its LV bus",
  busA: "its bus A",
  busB: "its bus B",
};

export interface RemovalSummary {
  /** The elements asked for, by name. */
  removed: string[];
  /** Protective devices that go with them. */
  devicesToo: string[];
  /** Elements that stay with a terminal now not connected, e.g. "Cable C1 (its to bus)". */
  leftUnconnected: string[];
}

function nameOf(e: Element): string {
  return e.name ? `${e.name} (${e.id})` : e.id;
}

export function removalSummary(doc: Project, ids: readonly string[]): RemovalSummary {
  const asked = new Set(ids);
  const gone = new Set(ids);
  for (const e of doc.elements) if (isProtectiveDevice(e) && gone.has(e.at.element)) gone.add(e.id);
  const removed: string[] = [];
  const devicesToo: string[] = [];
  const leftUnconnected: string[] = [];
  for (const e of doc.elements) {
    if (asked.has(e.id)) removed.push(nameOf(e));
    else if (gone.has(e.id)) devicesToo.push(nameOf(e));
    else {
      const rec = e as Record<string, unknown>;
      const cut = Object.keys(TERMINAL_WORDS).filter((f) => typeof rec[f] === "string" && gone.has(rec[f] as string));
      if (cut.length > 0) leftUnconnected.push(`${nameOf(e)}: ${cut.map((f) => TERMINAL_WORDS[f]).join(" and ")}`);
    }
  }
  return { removed, devicesToo, leftUnconnected };
}

/** The notice's sentence and detail lines. */
export function removalNotice(s: RemovalSummary): { text: string; details: string[] } {
  const what = s.removed.length === 1 ? s.removed[0] : `${s.removed.length} elements`;
  const details: string[] = [];
  if (s.devicesToo.length > 0) details.push(`Also deleted (protection on it): ${s.devicesToo.join(", ")}`);
  for (const line of s.leftUnconnected) details.push(`Now not connected: ${line}`);
  const tail = s.leftUnconnected.length > 0 ? ` ${s.leftUnconnected.length} element${s.leftUnconnected.length === 1 ? " is" : "s are"} left with a terminal not connected.` : "";
  return { text: `Deleted ${what}.${tail} Undo (Ctrl+Z) brings it all back in one step.`, details };
}
