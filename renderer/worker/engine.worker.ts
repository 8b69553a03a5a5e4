// The worker entry: imports only the core's pure request handlers and relays messages.
// Study requests yield between batches of cases so a cancel message can arrive and be honoured.
/// <reference lib="webworker" />
import { createHandlerState, handleRequest, transferables } from "../../src/engine/index.ts";
import { handleStudyRequest } from "../../src/study/rpc/handleStudyRequest.ts";
import type { WorkerCall, WorkerReply } from "./workerProtocol.ts";

const scope = self as unknown as DedicatedWorkerGlobalScope;
const engineState = createHandlerState();
const studySignals = new Map<string, { aborted: boolean }>();
const reply = (r: WorkerReply, transfer: Transferable[] = []) => scope.postMessage(r, transfer);
const yieldNow = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

scope.onmessage = async (e: MessageEvent<WorkerCall>) => {
  const call = e.data;
  if (call.service === "engine") {
    const response = await handleRequest(call.request, engineState, (event) => reply({ service: "engine", event }));
    reply({ service: "engine", response }, transferables(response));
  } else if (call.service === "study") {
    const signal = { aborted: false };
    studySignals.set(call.request.requestId, signal);
    const response = await handleStudyRequest(call.request, {
      signal,
      yieldNow,
      onProgress: (progress) => reply({ service: "study", progress }),
    });
    studySignals.delete(call.request.requestId);
    reply({ service: "study", response });
  } else if (call.service === "study-cancel") {
    const signal = studySignals.get(call.requestId);
    if (signal) signal.aborted = true;
  }
};
