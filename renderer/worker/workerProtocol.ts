// Envelope of the messages between the studio and its worker: each service (the fault engine,
// later the study) keeps its own typed request/response protocol inside.
import type { EngineEvent, EngineRequest, EngineResponse } from "../../src/engine/index.ts";

export type WorkerCall = { service: "engine"; request: EngineRequest };
export type WorkerReply = { service: "engine"; response: EngineResponse } | { service: "engine"; event: EngineEvent };
