// A model message as the studio shows it: the field's on-screen label first, its key (the name in the
// project file) after it: 'Cable C1 "Dock feeder": Route length (length_km) must be > 0 (got -3)'.
import type { Message } from "../../src/model/messages.ts";
import type { Project } from "../../src/model/schema.ts";
import { labelAtPath } from "./fieldModel.ts";

export function messageText(m: Message, doc: Project): string {
  if (!m.field || !m.elementId) return m.text;
  const element = doc.elements.find((e) => e.id === m.elementId);
  if (!element) return m.text;
  const label = labelAtPath(element.kind, m.field);
  if (!label) return m.text;
  const at = m.text.indexOf(`: ${m.field} `);
  if (at < 0) return m.text;
  return `${m.text.slice(0, at)}: ${label} (${m.field}) ${m.text.slice(at + m.field.length + 3)}`;
}
