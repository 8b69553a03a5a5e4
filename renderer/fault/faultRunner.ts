// Keeps the fault overlay current: whenever the document, the fault target, type, limit or the
// operating mode changes, asks the engine again (superseding the previous request), then the study
// for the same case (device roles, times and chains). The time from the edit to the painted overlay
// is measured with performance marks.
import { caseId } from "../../src/study/faultCases.ts";
import type { FaultLocation } from "../../src/study/types.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore, type SessionState } from "../store/sessionStore.ts";
import { useFaultStore } from "./faultStore.ts";
import { useStudyStore } from "./studyStore.ts";
import { toOverlay } from "./toOverlay.ts";
import type { EngineClient } from "../worker/engineClient.ts";
import type { StudyClient } from "../worker/studyClient.ts";

const MAX_TIMINGS = 50;
const CASE_DELAY_MS = 120;

function keyOf(s: SessionState): string {
  return JSON.stringify([s.faultTarget, s.faultType, s.faultLimit, s.activeScenarioId]);
}

export function startFaultRunner(engine: EngineClient, study: StudyClient): () => void {
  let markSeq = 0;
  const run = async () => {
    const session = useSessionStore.getState();
    const target = session.faultTarget;
    const fault = useFaultStore.getState();
    // every call supersedes the answers still on their way, clearing the fault included
    const seq = ++markSeq;
    if (!target) {
      if (fault.overlay || fault.status !== "idle") fault.set({ overlay: null, result: null, status: "idle", error: null });
      useStudyStore.getState().set({ caseResult: null, caseVerdicts: [], caseError: null });
      return;
    }
    const mark = `islet-edit-${seq}`;
    performance.mark(mark);
    const { doc } = useDocumentStore.getState();
    const scenario = doc.scenarios.find((s) => s.id === session.activeScenarioId) ?? doc.scenarios[0];
    fault.set({ status: "running" });
    const location: FaultLocation = target.kind === "bus" ? { kind: "bus", bus: target.bus } : { kind: "line", line: target.line, pct: target.pct };
    const { result } = engine.call({ kind: "fault", channel: "overlay", project: doc, scenario: scenario?.id, limit: session.faultLimit, location, faultType: session.faultType });
    const response = await result;
    performance.mark(`${mark}-answered`);
    if (seq !== markSeq) return; // superseded
    if (!response.ok) {
      if (response.cancelled) return;
      useFaultStore.getState().set({ status: "error", error: response.errors.map((e) => e.text).join(" "), overlay: null, result: null });
      useStudyStore.getState().set({ caseResult: null, caseVerdicts: [] });
      return;
    }
    if (response.kind !== "fault") return;
    const previous = useStudyStore.getState().caseResult;
    const sameCase = previous?.faultCase.id === (scenario ? caseId(scenario.id, location, session.faultType, session.faultLimit) : "");
    useFaultStore.getState().set({ overlay: toOverlay(doc, response.result, sameCase ? previous : null), status: "done", error: null, result: response.result });
    // measured after the next paint, i.e. when the user can see it
    requestAnimationFrame(() =>
      setTimeout(() => {
        const m = performance.measure(`islet-overlay-${seq}`, mark);
        performance.measure(`islet-answer-${seq}`, mark, `${mark}-answered`);
        const timings = [...useFaultStore.getState().timings_ms, m.duration].slice(-MAX_TIMINGS);
        useFaultStore.getState().set({ timings_ms: timings });
        performance.clearMarks(mark);
        performance.clearMarks(`${mark}-answered`);
      }, 0),
    );
    if (!scenario) return;
    // the study's view of the same case: roles and clearing times of every device; asked a moment
    // later so that a quick run of edits does not keep the second core busy with stale cases
    await new Promise((resolve) => setTimeout(resolve, CASE_DELAY_MS));
    if (seq !== markSeq) return;
    const id = caseId(scenario.id, location, session.faultType, session.faultLimit);
    const studied = await study.call({ kind: "case", project: doc, caseId: id }).result;
    if (seq !== markSeq) return;
    if (studied.kind === "case") {
      useStudyStore.getState().set({ caseResult: studied.result, caseVerdicts: studied.verdicts, caseError: null });
      useFaultStore.getState().set({ overlay: toOverlay(doc, response.result, studied.result) });
    } else if (studied.kind === "error") {
      useStudyStore.getState().set({ caseResult: null, caseVerdicts: [], caseError: studied.message });
    }
  };
  const unsubDoc = useDocumentStore.subscribe((s, prev) => {
    if (s.doc !== prev.doc) void run();
  });
  const unsubSession = useSessionStore.subscribe((s, prev) => {
    if (keyOf(s) !== keyOf(prev)) void run();
  });
  return () => {
    unsubDoc();
    unsubSession();
  };
}
