// Keeps the fault overlay current: whenever the document, the fault target, type, limit or the
// operating mode changes, asks the engine again (superseding the previous request) and measures the
// time from the edit to the painted overlay with performance marks.
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore, type SessionState } from "../store/sessionStore.ts";
import { useFaultStore } from "./faultStore.ts";
import { toOverlay } from "./toOverlay.ts";
import type { EngineClient } from "../worker/engineClient.ts";

const MAX_TIMINGS = 50;

function keyOf(s: SessionState): string {
  return JSON.stringify([s.faultTarget, s.faultType, s.faultLimit, s.activeScenarioId]);
}

export function startFaultRunner(client: EngineClient): () => void {
  let markSeq = 0;
  const run = async () => {
    const session = useSessionStore.getState();
    const target = session.faultTarget;
    const fault = useFaultStore.getState();
    if (!target) {
      if (fault.overlay || fault.status !== "idle") fault.set({ overlay: null, caseResult: null, status: "idle", error: null });
      return;
    }
    const mark = `islet-edit-${++markSeq}`;
    performance.mark(mark);
    const { doc } = useDocumentStore.getState();
    fault.set({ status: "running" });
    const location = target.kind === "bus" ? { kind: "bus" as const, bus: target.bus } : { kind: "line" as const, line: target.line, pct: target.pct };
    const { result } = client.call({
      kind: "fault",
      channel: "overlay",
      project: doc,
      scenario: session.activeScenarioId ?? undefined,
      limit: session.faultLimit,
      location,
      faultType: session.faultType,
    });
    const response = await result;
    if (!response.ok) {
      if (response.cancelled) return;
      useFaultStore.getState().set({ status: "error", error: response.errors.map((e) => e.text).join(" "), overlay: null, caseResult: null });
      return;
    }
    if (response.kind !== "fault") return;
    if (useDocumentStore.getState().doc !== doc) return; // a newer edit is on its way
    const overlay = toOverlay(doc, response.result, null);
    useFaultStore.getState().set({ overlay, status: "done", error: null, result: response.result });
    // measured after the next paint, i.e. when the user can see it
    requestAnimationFrame(() =>
      setTimeout(() => {
        const m = performance.measure(`islet-overlay-${markSeq}`, mark);
        const timings = [...useFaultStore.getState().timings_ms, m.duration].slice(-MAX_TIMINGS);
        useFaultStore.getState().set({ timings_ms: timings });
        performance.clearMarks(mark);
      }, 0),
    );
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
