// Autosave for crash recovery: a second after the last edit of an unsaved document, its text goes
// to the host's recovery store (where the host has none, the user is told once). Returns the unsubscribe function.
import { serializeProject } from "../../src/model/projectFile.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import type { HostApi } from "../../src/model/hostContract.ts";

export function startAutosave(host: HostApi, delay_ms = 1000): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  void host.autosaveAvailable?.().then((on) => {
    if (!on) useSessionStore.getState().notify("info", "Autosave is off: this browser gives the studio no storage (IndexedDB), so unsaved work is not kept for recovery after a crash. Save with Ctrl+S.");
  });
  const tell = () => {
    const dirty = useDocumentStore.getState().revision !== useSessionStore.getState().savedRevision;
    host.setDocumentState({ name: useSessionStore.getState().file?.name ?? useDocumentStore.getState().doc.meta.name, dirty });
    return dirty;
  };
  const unsubDoc = useDocumentStore.subscribe((s, prev) => {
    if (s.revision === prev.revision) return;
    if (!tell()) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      if (!tell()) return;
      host.writeAutosave(serializeProject(useDocumentStore.getState().doc)).catch(() => {
        useSessionStore.getState().notify("error", "Autosave failed; save your work with Ctrl+S.");
      });
    }, delay_ms);
  });
  const unsubSession = useSessionStore.subscribe((s, prev) => {
    if (s.savedRevision !== prev.savedRevision || s.file !== prev.file) tell();
  });
  return () => {
    if (timer) clearTimeout(timer);
    unsubDoc();
    unsubSession();
  };
}
