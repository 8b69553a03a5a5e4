// Typed client for the fault engine: request ids, progress callbacks, cancellation, and supersession
// (a newer request on the same channel makes the handler drop the older one).
import type { EngineRequest, EngineResponse } from "../../src/engine/index.ts";
import type { WorkerPort } from "./workerProtocol.ts";

type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;
export type EngineCall = DistributiveOmit<Exclude<EngineRequest, { kind: "cancel" }>, "id">;

export interface EngineClient {
  /** Sends a request; resolves with the response (ok:false cancelled:true when superseded or cancelled). */
  call(request: EngineCall, onProgress?: (fraction: number) => void): { id: number; result: Promise<EngineResponse> };
  cancel(id: number): void;
}

interface Pending {
  kind: EngineCall["kind"];
  resolve(r: EngineResponse): void;
  onProgress?: (fraction: number) => void;
}

export function engineClient(port: WorkerPort): EngineClient {
  let seq = 0;
  const pending = new Map<number, Pending>();
  port.listen((reply) => {
    if (reply.service !== "engine") return;
    if ("event" in reply) {
      pending.get(reply.event.id)?.onProgress?.(reply.event.fraction);
      return;
    }
    const p = pending.get(reply.response.id);
    if (!p) return;
    pending.delete(reply.response.id);
    p.resolve(reply.response);
  });
  // a crashed worker must not leave callers waiting forever
  port.onFailure((text) => {
    for (const [id, p] of pending) p.resolve({ id, kind: p.kind, ok: false, cancelled: false, errors: [{ level: "error", code: "worker", text }] });
    pending.clear();
  });
  return {
    call(request, onProgress) {
      const id = ++seq;
      const result = new Promise<EngineResponse>((resolve) => pending.set(id, { kind: request.kind, resolve, onProgress }));
      port.post({ service: "engine", request: { ...request, id } as EngineRequest });
      return { id, result };
    },
    cancel(id) {
      port.post({ service: "engine", request: { kind: "cancel", id: ++seq, target: id } });
    },
  };
}
