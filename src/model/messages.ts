// The one shape every check in Islet reports in: validation, the loader, the study.
// A message always names what it is about, so the user can find and fix it.

export type Severity = "error" | "warning" | "info";

export interface Message {
  severity: Severity;
  /** The element (or scenario) the message is about, when there is one. */
  elementId?: string;
  /** The field within it, as a dotted path (e.g. "longTime.ir_x", "functions.0.pickup_A"). */
  field?: string;
  /** Complete, human-readable text naming the element (id and name) and the field. */
  text: string;
}

/** Short builders keep the call sites readable. */
export function errorMessage(text: string, elementId?: string, field?: string): Message {
  return withOptional({ severity: "error", text }, elementId, field);
}
export function warningMessage(text: string, elementId?: string, field?: string): Message {
  return withOptional({ severity: "warning", text }, elementId, field);
}
export function infoMessage(text: string, elementId?: string, field?: string): Message {
  return withOptional({ severity: "info", text }, elementId, field);
}

function withOptional(m: Message, elementId?: string, field?: string): Message {
  if (elementId !== undefined) m.elementId = elementId;
  if (field !== undefined) m.field = field;
  return m;
}

export function hasErrors(messages: readonly Message[]): boolean {
  return messages.some((m) => m.severity === "error");
}
