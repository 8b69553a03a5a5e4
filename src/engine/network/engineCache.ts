// Per-model caches: the fill-reducing ordering (shared by all sequences) and factorised sequence systems.
import type { Ordering } from "../sparse/minimumDegree.ts";
import type { SequenceSystem } from "./sequenceSystem.ts";

export interface EngineCache {
  ordering: Ordering | null;
  systems: Map<string, SequenceSystem>;
}

export function createEngineCache(): EngineCache {
  return { ordering: null, systems: new Map() };
}
