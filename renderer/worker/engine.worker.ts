// The worker entry: imports only the core's pure request handlers and relays messages.
/// <reference lib="webworker" />
import { createHandlerState, handleRequest, transferables } from "../../src/engine/index.ts";
import type { WorkerCall, WorkerReply } from "./workerProtocol.ts";

const scope = self as unknown as DedicatedWorkerGlobalScope;
const engineState = createHandlerState();

scope.onmessage = async (e: MessageEvent<WorkerCall>) => {
  const call = e.data;
  if (call.service === "engine") {
    const response = await handleRequest(call.request, engineState, (event) => scope.postMessage({ service: "engine", event } satisfies WorkerReply));
    scope.postMessage({ service: "engine", response } satisfies WorkerReply, transferables(response));
  }
};
