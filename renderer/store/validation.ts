// The model's validation messages for the current document, computed once per document version
// however many panes ask for them.
import { validateProject } from "../../src/model/validate.ts";
import type { Message } from "../../src/model/messages.ts";
import type { Project } from "../../src/model/schema.ts";
import { useDocumentStore } from "./documentStore.ts";

const cache = new WeakMap<Project, Message[]>();

export function validationOf(doc: Project): Message[] {
  let messages = cache.get(doc);
  if (!messages) {
    messages = validateProject(doc);
    cache.set(doc, messages);
  }
  return messages;
}

export function useValidation(): Message[] {
  return validationOf(useDocumentStore((s) => s.doc));
}
