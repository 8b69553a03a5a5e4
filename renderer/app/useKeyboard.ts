// Studio keys: Delete, Ctrl+Z / Ctrl+Y (and Ctrl+Shift+Z), Ctrl+C / Ctrl+V, Ctrl+S, F (fault at
// the selected bus), Esc (clear the fault, then the selection). Ignored while typing in a field.
import { useEffect } from "react";
import { undo, redo } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { copySelection, deleteSelection, paste } from "../canvas/editCommands.ts";
import { saveDocument } from "../files/fileCommands.ts";
import { faultAtSelection } from "./faultCommands.ts";
import { commitPendingEdits } from "./pendingEdits.ts";

function typing(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.tagName === "INPUT" || el.tagName === "TEXTAREA" || el.tagName === "SELECT" || el.isContentEditable;
}

export function useKeyboard(): void {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented) return;
      const mod = e.ctrlKey || e.metaKey;
      const key = e.key.toLowerCase();
      if (mod && key === "s") {
        e.preventDefault();
        commitPendingEdits();
        void saveDocument(e.shiftKey);
        return;
      }
      if (typing(e.target)) return;
      if (mod && key === "z" && !e.shiftKey) {
        e.preventDefault();
        undo();
      } else if (mod && (key === "y" || (key === "z" && e.shiftKey))) {
        e.preventDefault();
        redo();
      } else if (mod && key === "c") {
        copySelection();
      } else if (mod && key === "v") {
        e.preventDefault();
        paste();
      } else if (!mod && (e.key === "Delete" || e.key === "Backspace")) {
        e.preventDefault();
        deleteSelection();
      } else if (!mod && key === "f" && !e.altKey) {
        e.preventDefault();
        faultAtSelection();
      } else if (e.key === "Escape") {
        const s = useSessionStore.getState();
        if (s.faultTarget) s.set({ faultTarget: null });
        else s.set({ selection: [] });
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, []);
}
