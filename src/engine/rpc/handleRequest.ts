// The worker's pure request handler: the worker entry (renderer side) calls it with each message and posts
// back what it returns. Supersession: a newer request on the same channel makes an older sweep stop.
import { compileNetwork } from "../network/compileNetwork.ts";
import { solveFault } from "../fault/solveFault.ts";
import { sweepFaults, sweepFaultsAsync } from "../fault/sweepFaults.ts";
import { runLoadFlow } from "../loadflow/runLoadFlow.ts";
import type { EngineEvent, EngineRequest, EngineResponse } from "./protocol.ts";

/**
 * Per-worker state: the latest request id per channel and the cancelled ids. Create one per worker. `yieldNow`
 * gives the worker's event loop a turn during a sweep (e.g. `() => new Promise((r) => setTimeout(r, 0))`), so that a
 * cancel or a superseding request arriving meanwhile stops it; without it a sweep runs to the end once started.
 */
export interface HandlerState {
  latest: Map<string, number>;
  cancelled: Set<number>;
  yieldNow?: () => Promise<void>;
}
export function createHandlerState(yieldNow?: () => Promise<void>): HandlerState {
  return { latest: new Map(), cancelled: new Set(), yieldNow };
}

/** Handles one request. `emit` receives progress events. Never throws: errors come back as ok:false. */
export async function handleRequest(request: EngineRequest, state: HandlerState, emit: (event: EngineEvent) => void = () => {}): Promise<EngineResponse> {
  if (request.kind === "cancel") {
    state.cancelled.add(request.target);
    return { id: request.id, kind: "cancel", ok: true };
  }
  const channel = request.channel ?? request.kind;
  state.latest.set(channel, request.id);
  const stale = () => state.cancelled.has(request.id) || state.latest.get(channel) !== request.id;
  const cancelled = (): EngineResponse => ({ id: request.id, kind: request.kind, ok: false, cancelled: true, errors: [] });
  // Let a queued newer request or a cancel arrive before starting.
  await Promise.resolve();
  if (stale()) return cancelled();
  try {
    if (request.kind === "loadflow") {
      return { id: request.id, kind: "loadflow", ok: true, result: runLoadFlow(request.project, { scenario: request.scenario }) };
    }
    const compiled = compileNetwork(request.project, { scenario: request.scenario, limit: request.limit, method: request.method });
    if (!compiled.ok) return { id: request.id, kind: request.kind, ok: false, cancelled: false, errors: compiled.errors };
    if (request.kind === "fault") {
      return { id: request.id, kind: "fault", ok: true, result: solveFault(compiled.network, request.location, request.faultType, request.options) };
    }
    let stopped = false;
    const sweepOptions = {
      types: request.types,
      buses: request.buses,
      inverterModel: request.inverterModel,
      onProgress: (fraction: number) => {
        emit({ id: request.id, kind: "progress", fraction });
        if (stale()) stopped = true;
        return !stopped;
      },
    };
    const result = state.yieldNow ? await sweepFaultsAsync(compiled.network, sweepOptions, state.yieldNow) : sweepFaults(compiled.network, sweepOptions);
    if (stopped) return cancelled();
    return { id: request.id, kind: "sweep", ok: true, result };
  } catch (err) {
    const text = err instanceof Error ? err.message : String(err);
    return { id: request.id, kind: request.kind, ok: false, cancelled: false, errors: [{ level: "error", code: "internal", text }] };
  } finally {
    state.cancelled.delete(request.id);
  }
}
