// Typed client for the protection study: string request ids, progress, cancellation, and
// supersession per channel (a newer "case" request cancels the older one still running).
import type { StudyProgress, StudyRequest, StudyResponse } from "../../src/study/types.ts";
import type { WorkerPort } from "./workerProtocol.ts";

type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;
export type StudyCall = DistributiveOmit<StudyRequest, "requestId">;

export interface StudyClient {
  call(request: StudyCall, onProgress?: (p: StudyProgress) => void): { requestId: string; result: Promise<StudyResponse> };
  cancel(requestId: string): void;
}

interface Pending {
  channel: string;
  resolve(r: StudyResponse): void;
  onProgress?: (p: StudyProgress) => void;
}

export function studyClient(port: WorkerPort): StudyClient {
  let seq = 0;
  const pending = new Map<string, Pending>();
  port.listen((reply) => {
    if (reply.service !== "study") return;
    if ("progress" in reply) {
      pending.get(reply.progress.requestId)?.onProgress?.(reply.progress);
      return;
    }
    const p = pending.get(reply.response.requestId);
    if (!p) return;
    pending.delete(reply.response.requestId);
    p.resolve(reply.response);
  });
  port.onFailure((message) => {
    for (const [requestId, p] of pending) p.resolve({ kind: "error", requestId, ok: false, message });
    pending.clear();
  });
  // A cancelled request answers "cancelled" at once: the user asked to stop, so a result the worker was about to
  // send (a small study can finish before the cancel reaches it) is dropped, and the worker is told to stop.
  const cancel = (requestId: string) => {
    const p = pending.get(requestId);
    if (!p) return;
    pending.delete(requestId);
    port.post({ service: "study-cancel", requestId });
    p.resolve({ kind: "cancelled", requestId, ok: false });
  };
  return {
    call(request, onProgress) {
      const requestId = `s${++seq}`;
      const channel = request.kind;
      for (const [id, p] of pending) if (p.channel === channel) cancel(id);
      const result = new Promise<StudyResponse>((resolve) => pending.set(requestId, { channel, resolve, onProgress }));
      port.post({ service: "study", request: { ...request, requestId } as StudyRequest });
      return { requestId, result };
    },
    cancel,
  };
}
