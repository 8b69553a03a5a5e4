// Messages between a SweepPool and its worker threads.
import type { CompileOptions, SweepArrays, SweepOptions, SweepPartOutcome } from "../../engine/index.ts";
import type { Project } from "../../model/schema.ts";

/** Load (or replace) a network under a key: the worker compiles it once and keeps it for later sweeps. */
export interface LoadCall {
  kind: "load";
  key: string;
  project: Project;
  compile: CompileOptions;
}

/** Take part in a sweep: claim work from the shared counters and write into the shared arrays. */
export interface ShareCall {
  kind: "share";
  id: number;
  key: string;
  options: Omit<SweepOptions, "onProgress">;
  arrays: SweepArrays;
  /** Shared work counters (see sweepParts.ts). */
  counters: Int32Array;
  /** Start with the faults rather than the block solves. */
  faultsFirst: boolean;
}

export type PoolCall = LoadCall | ShareCall;

export type PoolReply = { kind: "done"; id: number; outcome: SweepPartOutcome } | { kind: "failed"; id: number; message: string };
