// Typed messages between the UI and the engine worker. Every request carries an id; a newer request of the same
// `channel` supersedes an older one (the handler stops it at its next progress point and answers "cancelled").
import type { Project } from "../../model/schema.ts";
import type { FaultLocation, FaultOptions, FaultResult, FaultType, Limit, LoadFlowResult, SweepResult, EngineMessage, Method, InverterModel } from "../types.ts";

interface RequestBase {
  id: number;
  /** Requests on the same channel supersede each other (e.g. "fault-pane"). Default: the request kind. */
  channel?: string;
}

export type EngineRequest =
  | (RequestBase & {
      kind: "fault";
      project: Project;
      scenario?: string;
      limit: Limit;
      method?: Method;
      location: FaultLocation;
      faultType: FaultType;
      options?: FaultOptions;
    })
  | (RequestBase & {
      kind: "sweep";
      project: Project;
      scenario?: string;
      limit: Limit;
      method?: Method;
      types?: FaultType[];
      buses?: string[];
      inverterModel?: InverterModel;
    })
  | (RequestBase & { kind: "loadflow"; project: Project; scenario?: string })
  | (RequestBase & { kind: "cancel"; target: number });

export type EngineResponse =
  | { id: number; kind: "fault"; ok: true; result: FaultResult }
  | { id: number; kind: "sweep"; ok: true; result: SweepResult }
  | { id: number; kind: "loadflow"; ok: true; result: LoadFlowResult }
  | { id: number; kind: "cancel"; ok: true }
  | { id: number; kind: EngineRequest["kind"]; ok: false; cancelled: boolean; errors: EngineMessage[] };

/** Progress of a long request (sweeps). */
export type EngineEvent = { id: number; kind: "progress"; fraction: number };

/** Typed arrays inside a sweep result, to pass as the transfer list of postMessage. */
export function transferables(response: EngineResponse): ArrayBuffer[] {
  if (response.ok && response.kind === "sweep") {
    const r = response.result;
    const d = r.deviceData;
    const arrays = [r.ikss_kA, r.maxPhase_kA, r.ip_kA, r.xr, d.base_A, d.transfer, d.transferBusRow, d.transferSlot, d.faultSeq_pu, d.injMap, d.inj_pu, d.shift_deg, d.busShift_deg];
    for (const o of d.overrides) arrays.push(o.seq_A);
    if (d.negative) arrays.push(d.negative.w, d.negative.alpha);
    const seen = new Set<ArrayBuffer>();
    for (const a of arrays as ArrayBufferView[]) if (a.buffer instanceof ArrayBuffer) seen.add(a.buffer);
    return [...seen];
  }
  return [];
}
