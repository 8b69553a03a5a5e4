// Whether an element's terminal (handle a or b) is tied to no bus: such a terminal is drawn
// prominently so the user sees where to connect.
import type { Element } from "../../../src/model/schema.ts";
import { terminalFields } from "../toFlow.ts";

export function isOpen(element: Element, handle: "a" | "b"): boolean {
  const field = terminalFields(element)[handle];
  return field !== undefined && !(element as Record<string, unknown>)[field];
}
