// Per-model caches: the fill-reducing ordering (shared by all sequences) and factorised sequence systems.
import type { Ordering } from "../sparse/minimumDegree.ts";
import type { SequenceSystem } from "./sequenceSystem.ts";
import type { ComplexVec } from "../fault/solveLinearFault.ts";

export interface EngineCache {
  ordering: Ordering | null;
  systems: Map<string, SequenceSystem>;
  /** Columns of Z' at the inverter nodes per variant (see fault/compactFault.ts). */
  unitColumns: Map<string, ComplexVec[][]>;
}

export function createEngineCache(): EngineCache {
  return { ordering: null, systems: new Map(), unitColumns: new Map() };
}
