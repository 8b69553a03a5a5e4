// Typed client for the engine: request ids, progress callbacks, cancellation, and supersession
// (a newer request on the same channel makes the handler drop the older one). Runs the requests in
// a Web Worker, or on the main thread with the very same handler when workers are unavailable
// (tests, ?worker=0).
import { createHandlerState, handleRequest } from "../../src/engine/index.ts";
import type { EngineRequest, EngineResponse } from "../../src/engine/index.ts";
import type { WorkerCall, WorkerReply } from "./workerProtocol.ts";

type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;
export type EngineCall = DistributiveOmit<Exclude<EngineRequest, { kind: "cancel" }>, "id">;

export interface EngineClient {
  readonly mode: "worker" | "main-thread";
  /** Sends a request; resolves with the response (ok:false cancelled:true when superseded or cancelled). */
  call(request: EngineCall, onProgress?: (fraction: number) => void): { id: number; result: Promise<EngineResponse> };
  cancel(id: number): void;
  dispose(): void;
}

interface Pending {
  resolve(r: EngineResponse): void;
  onProgress?: (fraction: number) => void;
}

export function mainThreadEngineClient(): EngineClient {
  const state = createHandlerState();
  let seq = 0;
  return {
    mode: "main-thread",
    call(request, onProgress) {
      const id = ++seq;
      const full = { ...request, id } as EngineRequest;
      return { id, result: handleRequest(full, state, (e) => onProgress?.(e.fraction)) };
    },
    cancel(id) {
      void handleRequest({ kind: "cancel", id: ++seq, target: id }, state);
    },
    dispose() {},
  };
}

export function workerEngineClient(worker: Worker): EngineClient {
  let seq = 0;
  const pending = new Map<number, Pending>();
  worker.onmessage = (e: MessageEvent<WorkerReply>) => {
    const reply = e.data;
    if ("event" in reply) {
      pending.get(reply.event.id)?.onProgress?.(reply.event.fraction);
      return;
    }
    const p = pending.get(reply.response.id);
    if (!p) return;
    pending.delete(reply.response.id);
    p.resolve(reply.response);
  };
  worker.onerror = (e) => {
    // a crashed worker must not leave callers waiting forever
    for (const [id, p] of pending) p.resolve({ id, kind: "fault", ok: false, cancelled: false, errors: [{ level: "error", code: "worker", text: `The calculation worker failed: ${e.message}` }] });
    pending.clear();
  };
  const post = (call: WorkerCall) => worker.postMessage(call);
  return {
    mode: "worker",
    call(request, onProgress) {
      const id = ++seq;
      const result = new Promise<EngineResponse>((resolve) => pending.set(id, { resolve, onProgress }));
      post({ service: "engine", request: { ...request, id } as EngineRequest });
      return { id, result };
    },
    cancel(id) {
      post({ service: "engine", request: { kind: "cancel", id: ++seq, target: id } });
    },
    dispose() {
      worker.terminate();
      for (const [id, p] of pending) p.resolve({ id, kind: "fault", ok: false, cancelled: true, errors: [] });
      pending.clear();
    },
  };
}

/** A worker client when the browser allows it, else the main-thread fallback. */
export function createEngineClient(preferWorker: boolean): EngineClient {
  if (preferWorker && typeof Worker !== "undefined") {
    try {
      return workerEngineClient(new Worker(new URL("./engine.worker.ts", import.meta.url), { type: "module", name: "islet-engine" }));
    } catch {
      // fall through to the main thread
    }
  }
  return mainThreadEngineClient();
}
