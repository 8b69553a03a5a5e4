// The channel to the calculation worker, or an in-page stand-in running the very same pure
// handlers on the main thread (tests, ?worker=0, browsers without module workers).
import { createHandlerState, handleRequest } from "../../src/engine/index.ts";
import { handleStudyRequest } from "../../src/study/rpc/handleStudyRequest.ts";
import type { WorkerCall, WorkerPort, WorkerReply } from "./workerProtocol.ts";

export function workerPort(worker: Worker): WorkerPort {
  const listeners: ((r: WorkerReply) => void)[] = [];
  const failures: ((m: string) => void)[] = [];
  worker.onmessage = (e: MessageEvent<WorkerReply>) => listeners.forEach((l) => l(e.data));
  worker.onerror = (e) => failures.forEach((f) => f(`The calculation worker failed: ${e.message}`));
  return {
    post: (call, transfer = []) => worker.postMessage(call, transfer),
    listen: (h) => listeners.push(h),
    onFailure: (h) => failures.push(h),
    terminate: () => worker.terminate(),
  };
}

export function mainThreadPort(): WorkerPort {
  const listeners: ((r: WorkerReply) => void)[] = [];
  const engineState = createHandlerState();
  const signals = new Map<string, { aborted: boolean }>();
  const send = (r: WorkerReply) => listeners.forEach((l) => l(r));
  const yieldNow = () => new Promise<void>((resolve) => setTimeout(resolve, 0));
  const run = async (call: WorkerCall) => {
    await Promise.resolve(); // answer asynchronously, as a worker would
    if (call.service === "engine") {
      send({ service: "engine", response: await handleRequest(call.request, engineState, (event) => send({ service: "engine", event })) });
    } else if (call.service === "study") {
      const signal = { aborted: false };
      signals.set(call.request.requestId, signal);
      const response = await handleStudyRequest(call.request, { signal, yieldNow, onProgress: (progress) => send({ service: "study", progress }) });
      signals.delete(call.request.requestId);
      send({ service: "study", response });
    } else {
      const signal = signals.get(call.requestId);
      if (signal) signal.aborted = true;
    }
  };
  return {
    post: (call) => void run(call),
    listen: (h) => listeners.push(h),
    onFailure: () => {},
    terminate: () => {},
  };
}

export function createStudioPort(preferWorker: boolean, name = "islet-calc"): { port: WorkerPort; mode: "worker" | "main-thread" } {
  if (preferWorker && typeof Worker !== "undefined") {
    try {
      const worker = new Worker(new URL("./engine.worker.ts", import.meta.url), { type: "module", name });
      return { port: workerPort(worker), mode: "worker" };
    } catch {
      // fall back to the main thread
    }
  }
  return { port: mainThreadPort(), mode: "main-thread" };
}
