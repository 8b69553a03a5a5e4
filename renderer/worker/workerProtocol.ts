// Envelope of the messages between the studio and its worker: each service (the fault engine and
// the protection study) keeps its own typed request/response protocol inside.
import type { EngineEvent, EngineRequest, EngineResponse } from "../../src/engine/index.ts";
import type { StudyProgress, StudyRequest, StudyResponse } from "../../src/study/types.ts";

export type WorkerCall =
  | { service: "engine"; request: EngineRequest }
  | { service: "study"; request: StudyRequest }
  | { service: "study-cancel"; requestId: string };

export type WorkerReply =
  | { service: "engine"; response: EngineResponse }
  | { service: "engine"; event: EngineEvent }
  | { service: "study"; response: StudyResponse }
  | { service: "study"; progress: StudyProgress };

/** A message channel to the worker (or to an in-page stand-in). */
export interface WorkerPort {
  post(call: WorkerCall, transfer?: Transferable[]): void;
  listen(handler: (reply: WorkerReply) => void): void;
  onFailure(handler: (message: string) => void): void;
  terminate(): void;
}
