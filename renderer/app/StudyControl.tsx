// Runs the full study (every fault case in every operating mode) with progress and a Cancel button.
import { useStudyStore } from "../fault/studyStore.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { runFullStudy, cancelFullStudy } from "../fault/studyCommands.ts";

const PHASE_WORDS = { cases: "fault cases", verdicts: "verdicts", timelines: "clearing timelines" } as const;

export function StudyControl() {
  const running = useStudyStore((s) => s.running);
  const full = useStudyStore((s) => s.full);
  const fullRevision = useStudyStore((s) => s.fullRevision);
  const revision = useDocumentStore((s) => s.revision);
  if (running) {
    const p = running.progress;
    const fraction = p && p.total > 0 ? p.done / p.total : 0;
    return (
      <div className="tool-group study-running" data-testid="study-progress">
        <progress max={1} value={fraction} aria-label="Study progress" />
        <span className="study-text">{p ? `${p.done}/${p.total} ${PHASE_WORDS[p.phase]}` : "starting…"}</span>
        <button className="tool-button" onClick={cancelFullStudy} data-testid="study-cancel">
          Cancel
        </button>
      </div>
    );
  }
  const stale = full !== null && fullRevision !== revision;
  return (
    <div className="tool-group">
      <button className="tool-button accent" onClick={() => void runFullStudy()} data-testid="study-run" title="Every fault case in every operating mode">
        Run study
      </button>
      {stale && <span className="study-text stale" title="The project changed since the last study">out of date</span>}
    </div>
  );
}
