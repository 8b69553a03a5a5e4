// The status area: the caution, the document state, validation counts and the last fault timing.
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { useFaultStore } from "../fault/faultStore.ts";
import { CAUTION_TEXT } from "./caution.ts";
import { useValidation } from "../store/validation.ts";

export function StatusBar() {
  const doc = useDocumentStore((s) => s.doc);
  const revision = useDocumentStore((s) => s.revision);
  const savedRevision = useSessionStore((s) => s.savedRevision);
  const file = useSessionStore((s) => s.file);
  const timings = useFaultStore((s) => s.timings_ms);
  const diagnostics = useSessionStore((s) => s.diagnostics);
  const messages = useValidation();
  const errors = messages.filter((m) => m.severity === "error").length;
  const warnings = messages.filter((m) => m.severity === "warning").length;
  const dirty = revision !== savedRevision;
  const last = timings.at(-1);
  return (
    <footer className="status-bar" role="status">
      <span className="status-caution" data-testid="caution">
        {CAUTION_TEXT}
      </span>
      <span className="status-cell" data-testid="doc-state">
        {file?.name ?? doc.meta.name}
        {dirty && <span className="dirty-mark" title="Unsaved changes" data-testid="dirty-mark"> ● unsaved</span>}
      </span>
      <span className={`status-cell${errors ? " has-errors" : ""}`} data-testid="validation-count">
        {errors} errors · {warnings} warnings
      </span>
      {diagnostics && last !== undefined && (
        <span className="status-cell" data-testid="overlay-time" title="Time from the last edit to the updated fault overlay">
          overlay {last.toFixed(1)} ms
        </span>
      )}
    </footer>
  );
}
