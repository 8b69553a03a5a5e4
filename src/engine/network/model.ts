// Internal model of one compiled scenario: nodes and per-sequence element stamps in per unit on
// project.meta.baseMVA with each node's base voltage = its bus un_kV. Not part of the public API.

import type { EngineCache } from "./engineCache.ts";

/** Per-sequence values are indexed 0 zero, 1 positive, 2 negative. */
export type Seq = 0 | 1 | 2;

export interface Cx {
  re: number;
  im: number;
}

/** A branch between two nodes: ideal transformer t:1 on the from side, then the series admittance. */
export interface BranchStamp {
  element: string;
  label: string;
  /** A switch is a branch only when a protective device sits at it (a closed breaker of tiny reactance). */
  kind: "transformer" | "line" | "switch";
  from: number;
  to: number;
  fromBus: string;
  toBus: string;
  /** Off-nominal ratio (real), from side. */
  t: number;
  /** Positive-sequence phase shift of the to side relative to the from side, degrees. */
  shift_deg: number;
  /** Series admittance per sequence (null: no path in that sequence). */
  y: [Cx | null, Cx | null, Cx | null];
  /** Zero-sequence shunts at the ends (transformer windings with an earthed star opposite a delta). */
  y0From: Cx | null;
  y0To: Cx | null;
  /** Series impedance (positive sequence) for the peak-factor branch logic and line splitting. */
  z1: Cx;
  /** Line data kept for splitting at a fault point. */
  line?: { z: [Cx, Cx, Cx] };
  rated_A?: number;
  /** Ends reported in results (both when absent); the halves of a line split at a fault point report one each. */
  reportEnds?: ("from" | "to")[];
  /** Ends opened by protective devices (see openEnds.ts): no series path; not a connection for islands. */
  open?: ("from" | "to")[];
}

/** A shunt element with a voltage source behind an impedance (grid, generator, motor, grid-forming inverter). */
export interface ShuntStamp {
  element: string;
  label: string;
  kind: "grid" | "generator" | "motor" | "inverter";
  node: number;
  bus: string;
  y: [Cx | null, Cx | null, Cx | null];
  /** Generators and motors: rated current in pu of the node base (for mu), else 0. */
  ir_pu: number;
  /** Impedance in pu of node base used for the breaking-current voltage drop (generators, motors). */
  z1: Cx;
  /** True when this shunt exists only in the refined inverter model (grid-forming unit). */
  refinedOnly: boolean;
  /** Motors with known pole pairs: rated active power per pair of poles in MW (for the breaking-current factor q). */
  m_MW?: number;
  /** Terminal opened by a protective device (see openEnds.ts): no admittance, not a source; its current is zero. */
  open?: true;
}

/** A converter-interfaced unit. */
export interface InverterUnit {
  element: string;
  label: string;
  node: number;
  bus: string;
  control: "grid-following" | "grid-forming";
  /** Rated current in pu of the node base current. */
  ir_pu: number;
  iMax_pu: number;
  kFactor: number;
  negSeq: "none" | "k-factor";
  k2: number;
  /** Grid-forming impedance in pu of node base. */
  zForming: Cx;
  activePower_pu: number;
  /** Node base voltage over unit rated voltage (converts node pu to unit pu). */
  vScale: number;
}

export interface ModelNode {
  buses: string[];
  un_kV: number;
  shift_deg: number;
  island: number;
}

export interface Model {
  nodes: ModelNode[];
  branches: BranchStamp[];
  shunts: ShuntStamp[];
  inverters: InverterUnit[];
  /** Bus id -> node. */
  busNode: Map<string, number>;
  baseMVA: number;
  /** Protective device locations in service (deduplicated), in project order. */
  devices: { element: string; end: "from" | "to" | "terminal" }[];
  /** Islands (positive-sequence connectivity): has any source? */
  islandLive: boolean[];
  /**
   * Power station units (IEC 60909-0:2016, 6.7): this model carries each unit corrected as a whole (K_S or K_SO),
   * right for faults outside the unit. A fault at a unit's LV node (between generator and unit transformer) is
   * solved on the model kept here under that node, where the unit's generator and transformer carry the in-unit
   * factors instead. Same nodes, islands and devices; only the two stamps differ.
   */
  inUnit?: Map<number, { model: Model; cache: EngineCache }>;
}
