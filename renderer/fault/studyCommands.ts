// Run the full study with progress (cancellable), and pick a case from its matrix.
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { useStudyStore } from "./studyStore.ts";
import type { StudyClient } from "../worker/studyClient.ts";
import type { Project } from "../../src/model/schema.ts";
import type { ClearingTimeline, StudyResult } from "../../src/study/types.ts";
import { failureTimelineCases } from "../../src/report/failureTimelineCases.ts";
import { commitPendingEdits } from "../app/pendingEdits.ts";
import { validationOf } from "../store/validation.ts";
import { messageText } from "../inspector/messageText.ts";

let client: StudyClient | null = null;

export function setStudyClient(c: StudyClient): void {
  client = c;
}

export async function runFullStudy(): Promise<void> {
  if (!client) return;
  commitPendingEdits();
  const { doc, revision } = useDocumentStore.getState();
  const store = useStudyStore.getState();
  if (store.running) return;
  // the study needs a valid project: say which element and field stop it, in the studio's words
  const errors = validationOf(doc).filter((m) => m.severity === "error");
  if (errors.length > 0) {
    useSessionStore.getState().notify("error", `The study cannot run: the project has ${errors.length} error${errors.length === 1 ? "" : "s"}. Select the element to fix it in Properties.`, errors.map((m) => messageText(m, doc)), { topic: "study" });
    return;
  }
  const { requestId, result } = client.call({ kind: "full", project: doc }, (progress) => useStudyStore.getState().set({ running: { requestId, progress } }));
  store.set({ running: { requestId, progress: null } });
  const response = await result;
  useStudyStore.getState().set({ running: null });
  const session = useSessionStore.getState();
  if (response.kind === "full") {
    useStudyStore.getState().set({ full: response.result, fullRevision: revision });
    const fails = response.result.verdicts.filter((v) => v.status === "fail").length;
    const w = response.result.warnings;
    const notes = w.length <= 3 ? w : [...w.slice(0, 2), `${w.length - 2} more notes: see the verdicts`];
    session.notify("info", `Study finished: ${response.result.cases.length} fault cases, ${response.result.verdicts.length} verdicts (${fails} fail).`, notes, { topic: "study" });
    session.set({ pane: "verdicts" });
  } else if (response.kind === "cancelled") {
    session.notify("info", "Study cancelled.", undefined, { topic: "study" });
  } else if (response.kind === "error") {
    session.notify("error", `The study could not run: ${response.message}`, undefined, { topic: "study" });
  }
}

/**
 * Clearing timelines of the worst failed bus faults the full study did not simulate, one case request each in the
 * study worker: the report shows them as the CLI's does. A case that fails to run is left out.
 */
export async function failureTimelines(project: Project, study: StudyResult): Promise<ClearingTimeline[]> {
  if (!client) return [];
  const out: ClearingTimeline[] = [];
  for (const req of failureTimelineCases(study)) {
    const response = await client.call({ kind: "case", project, caseId: req.caseId, timeline: true }).result;
    if (response.kind === "case" && response.timeline) out.push(response.timeline);
  }
  return out;
}

export function cancelFullStudy(): void {
  const running = useStudyStore.getState().running;
  if (running && client) client.cancel(running.requestId);
}

/** A matrix cell was chosen: show that case's fault on the one-line. The selection (the device being
 * tuned in the time-current pane) is kept. */
export function selectCase(caseId: string, scenarioId: string): void {
  const full = useStudyStore.getState().full;
  const c = full?.cases.find((x) => x.faultCase.id === caseId)?.faultCase;
  if (!c) return;
  const loc = c.location;
  useSessionStore.getState().set({
    activeScenarioId: scenarioId,
    faultType: c.faultType,
    faultLimit: c.limit,
    faultTarget: loc.kind === "bus" ? { kind: "bus", bus: loc.bus } : { kind: "line", line: loc.line, pct: loc.pct },
  });
}
