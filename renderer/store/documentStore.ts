// The project document and its one write path. Undo/redo (zundo) tracks the document only;
// selection, zoom and open panes live in sessionStore and are never saved or undone.
import { create } from "zustand";
import { temporal } from "zundo";
import type { Project } from "../../src/model/schema.ts";
import type { DocChange } from "./changes.ts";
import { applyChanges } from "./applyChanges.ts";
import { newProject } from "../../src/model/projectFile.ts";
import { useSessionStore } from "./sessionStore.ts";

/** Notices about the document that was open (its study's error) go when another is opened. */
const DOCUMENT_TOPICS = ["study", "document"];

export interface ApplyOptions {
  /** false for edits that must not become an undo step (loading a file, replaying a drag frame). */
  undoable: boolean;
}

export interface DocumentState {
  doc: Project;
  /** Bumped on every change; the autosave and the fault overlay key on it. */
  revision: number;
  applyChanges(changes: readonly DocChange[], options: ApplyOptions): void;
}

export const useDocumentStore = create<DocumentState>()(
  temporal(
    (set, get) => ({
      doc: newProject("Untitled project"),
      revision: 0,
      applyChanges(changes, options) {
        const next = applyChanges(get().doc, changes);
        const t = useDocumentStore.temporal.getState();
        if (!options.undoable) t.pause();
        set({ doc: next, revision: get().revision + 1 });
        if (!options.undoable) t.resume();
        if (changes.some((c) => c.type === "replaceDocument")) for (const topic of DOCUMENT_TOPICS) useSessionStore.getState().dismissTopic(topic);
      },
    }),
    {
      limit: 200,
      partialize: (s) => ({ doc: s.doc }),
      equality: (a, b) => a.doc === b.doc,
    },
  ),
);

/** Undo/redo bump the revision too, so listeners recompute. */
export function undo(): void {
  useDocumentStore.temporal.getState().undo();
  useDocumentStore.setState((s) => ({ revision: s.revision + 1 }));
}
export function redo(): void {
  useDocumentStore.temporal.getState().redo();
  useDocumentStore.setState((s) => ({ revision: s.revision + 1 }));
}
/** A freshly opened document has no history. */
export function clearHistory(): void {
  useDocumentStore.temporal.getState().clear();
}
