// Per-model caches: the fill-reducing ordering (shared by all sequences) and factorised sequence systems.
import type { Ordering } from "../sparse/minimumDegree.ts";
import type { SequenceSystem } from "./sequenceSystem.ts";
import type { ComplexVec } from "../fault/solveLinearFault.ts";
import type { LdltFactor } from "../sparse/ldlt.ts";
import type { InverseSubset } from "../sparse/takahashi.ts";

export interface EngineCache {
  ordering: Ordering | null;
  systems: Map<string, SequenceSystem>;
  /** Columns of Z' at the inverter nodes per variant (see fault/compactFault.ts). */
  unitColumns: Map<string, ComplexVec[][]>;
  /** Sparse inverse subsets per factor (Takahashi, see sparse/takahashi.ts), for the sweeps. */
  inverses: WeakMap<LdltFactor, InverseSubset>;
  /** The branches and shunts at each node, which the sweep's peak factor reads; built once per network. */
  atNode: { branches: number[]; shunts: number[] }[] | null;
}

export function createEngineCache(): EngineCache {
  return { ordering: null, systems: new Map(), unitColumns: new Map(), inverses: new WeakMap(), atNode: null };
}
