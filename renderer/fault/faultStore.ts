// The latest fault calculation shown on the one-line, with its timing. Session state.
import { create } from "zustand";
import type { FaultOverlay } from "./overlayTypes.ts";
import type { FaultResult } from "../../src/engine/index.ts";

export interface FaultState {
  overlay: FaultOverlay | null;
  /** The engine's full result for the fault view table. */
  result: FaultResult | null;
  status: "idle" | "running" | "done" | "error";
  error: string | null;
  /** Edit-to-overlay times of recent recalculations, ms (performance marks). */
  timings_ms: number[];
  set(partial: Partial<Omit<FaultState, "set">>): void;
}

export const useFaultStore = create<FaultState>()((set) => ({
  overlay: null,
  result: null,
  status: "idle",
  error: null,
  timings_ms: [],
  set: (partial) => set(partial),
}));
