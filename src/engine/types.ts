// Public types of the fault engine: plain data (no classes, no Maps) so that results cross the
// worker boundary unchanged. Sequence triples are ordered [zero, positive, negative]; phase triples [a, b, c].
// Sign convention everywhere: a current is positive when it flows FROM the bus INTO the element at that end
// (branch end or shunt terminal). Angles are in degrees, referred to the positive-sequence prefault voltage of
// phase a at the faulted bus's side of the network, with vector-group phase shifts applied across transformers.
import { CAUTION_TEXT } from "../model/caution.ts";

export type FaultType = "3ph" | "LL" | "LG" | "LLG";
export const FAULT_TYPES: readonly FaultType[] = ["3ph", "LL", "LG", "LLG"];

/** IEC 60909 maximum or minimum calculation. */
export type Limit = "max" | "min";
export type Method = "iec60909" | "classic";
export type InverterModel = "iec" | "refined";

export interface Complex {
  re: number;
  im: number;
}
export interface Phasor {
  mag: number;
  ang_deg: number;
}
/** [zero, positive, negative] */
export type SeqTriple<T> = [T, T, T];
/** [a, b, c] */
export type PhaseTriple<T> = [T, T, T];

/** Where the fault is: a bus, or a point along a line at pct percent of its length from its fromBus. */
export type FaultLocation = { kind: "bus"; bus: string } | { kind: "line"; line: string; pct: number };

export interface EngineMessage {
  level: "info" | "warning" | "error";
  /** Stable machine code, e.g. "dead-island", "inverter-not-converged", "low-fault-current", "xr-range". */
  code: string;
  /** Human text naming elements by id and name. */
  text: string;
  element?: string;
}

/** Settings the result was computed with (recorded on every result). */
export interface ResolvedOptions {
  method: Method;
  limit: Limit;
  inverterModel: InverterModel;
  /** Classic method prefault voltage (pu); 1 for the IEC method (c is separate). */
  prefault_pu: number;
  lvTolerance_pct: 6 | 10;
  breakingTime_s: number;
  thermalTime_s: number;
  conductorEndTemp_C: number;
  faultR_ohm: number;
  faultX_ohm: number;
  baseMVA: number;
  frequency_Hz: 50 | 60;
}

export interface CompileOptions {
  /** Scenario id; default: the project's first scenario, or all elements as drawn when there is none. */
  scenario?: string;
  limit: Limit;
  /** Override study.method. */
  method?: Method;
  /**
   * Element ends opened by protective devices (a device's `at`): the current at each is interrupted, the rest of the
   * network stays (see src/engine/network/openEnds.ts). A switch opened at either end is open.
   */
  openEnds?: { element: string; end: "from" | "to" | "terminal" }[];
}

/** One electrical node after switches merged buses (union-find). Opaque handle plus what callers need. */
export interface NetworkNode {
  index: number;
  /** Bus ids merged into this node; the first is its representative. */
  buses: string[];
  un_kV: number;
  /** Phase shift of this node relative to its island's reference, positive sequence, degrees. */
  shift_deg: number;
  /** Connected island index (positive-sequence topology with all in-service branches). */
  island: number;
}

/** Result of compiling a project scenario into sequence networks. Plain data plus typed arrays; treat as opaque. */
export interface CompiledNetwork {
  readonly scenario: string;
  readonly options: ResolvedOptions;
  readonly nodes: NetworkNode[];
  /** Bus id -> node index. */
  readonly busNode: Record<string, number>;
  readonly messages: EngineMessage[];
  /** Internal model (element stamps, factor caches). */
  readonly internal: unknown;
}

export type CompileResult = { ok: true; network: CompiledNetwork } | { ok: false; errors: EngineMessage[] };

export interface FaultOptions {
  faultR_ohm?: number;
  faultX_ohm?: number;
  /** Override study.inverterModel for which model gives the detailed currents. */
  inverterModel?: InverterModel;
  /**
   * Which branch ends and bus voltages the result lists: "all" (default) every one; "devices" only the branch ends
   * where a protective device sits, and the voltages of their buses and of the faulted bus. Shunts are always all.
   * Values are the same either way; "devices" skips building the rest (much faster on large networks).
   */
  detail?: "all" | "devices";
}

/** Current at one branch end or shunt terminal, primary amperes at that end's voltage. */
export interface EndCurrent {
  element: string;
  end: "from" | "to" | "terminal";
  /** Bus at this end. */
  bus: string;
  seq_A: SeqTriple<Phasor>;
  phase_A: PhaseTriple<Phasor>;
}

/** Voltages at a bus during the fault (line-to-earth phase voltages). */
export interface BusVoltage {
  bus: string;
  un_kV: number;
  phase_kV: PhaseTriple<Phasor>;
  phase_pu: PhaseTriple<Phasor>;
  seq_pu: SeqTriple<Phasor>;
  /** False when the bus has no source in this scenario (all values zero). */
  energized: boolean;
}

export interface InverterUnitResult {
  element: string;
  control: "grid-following" | "grid-forming";
  /** Positive and negative-sequence injected current, pu of the unit's rated current (magnitudes). */
  i1_pu: number;
  i2_pu: number;
  /** Terminal positive-sequence voltage, pu. */
  v1_pu: number;
  /** True when the unit sits at its current limit iMax_pu. */
  limited: boolean;
}

export interface InverterOutcome {
  model: InverterModel;
  ikss_kA: number;
  /** Refined model only: fixed-point iteration report. */
  iterations?: number;
  residual_pu?: number;
  converged?: boolean;
  units: InverterUnitResult[];
}

export type PeakMethod = "radial-branch-sum" | "meshed-method-b" | "none";

export interface FaultResult {
  location: FaultLocation;
  faultType: FaultType;
  options: ResolvedOptions;
  /** Nominal voltage at the fault and the voltage factor used (prefault_pu for the classic method). */
  un_kV: number;
  c: number;
  /**
   * Initial symmetrical short-circuit current I"k in kA, the magnitude relevant for the type:
   * 3ph symmetrical, LL line current, LG earth current 3I0, LLG earth current 3I0.
   */
  ikss_kA: number;
  /** Current flowing from the network into the fault, per phase (kA) and per sequence (kA). */
  faultPhase_kA: PhaseTriple<Phasor>;
  faultSeq_kA: SeqTriple<Phasor>;
  /** 3 I0 into earth, kA. */
  earth_kA: number;
  /** Largest faulted-phase current, kA (for LLG the line currents; equal to ikss_kA for 3ph and LL). */
  maxPhase_kA: number;
  /**
   * Peak current ip, kA: sqrt(2) (I"k + (kappa - 1) I"k,S). kappa (radial branch sum or method B) belongs to the
   * voltage sources' share I"k,S; full-size converters add theirs with kappa = 1 (IEC 60909-0:2016, 8.1).
   */
  ip_kA: number;
  /** I"k,S, kA: the same fault driven by the voltage sources alone (converters' injections removed). */
  ikssSources_kA: number;
  kappa: number;
  peakMethod: PeakMethod;
  /** Symmetrical breaking current and the near-to-generator factor used (1 when far from generators). */
  ib_kA: number;
  mu: number;
  /** Thermal equivalent current for thermalTime_s. */
  ith_kA: number;
  m: number;
  n: number;
  /** Positive-sequence Thevenin impedance at the fault, ohm, and its X/R. */
  zk_ohm: Complex;
  xr: number;
  /** IEC 60909 converter superposition and Islet's refined inverter model; present when inverters feed. */
  inverter: { iec: InverterOutcome; refined: InverterOutcome; used: InverterModel } | null;
  branchEnds: EndCurrent[];
  shunts: EndCurrent[];
  buses: BusVoltage[];
  messages: EngineMessage[];
}

/** Compact all-bus fault sweep. Index helpers: busIndex b (0..B-1), type t (0..T-1), device d (0..D-1). */
export interface SweepResult {
  scenario: string;
  options: ResolvedOptions;
  busIds: string[];
  types: FaultType[];
  /** I"k kA per [b * T + t] (same meaning as FaultResult.ikss_kA). */
  ikss_kA: Float64Array;
  /** Largest faulted-phase current kA per [b * T + t]. */
  maxPhase_kA: Float64Array;
  /** Peak current kA (as FaultResult.ip_kA) and X/R per bus (3ph basis): ip_kA[b], xr[b]. */
  ip_kA: Float64Array;
  xr: Float64Array;
  /** Device locations kept (protective devices' `at`). */
  devices: { element: string; end: "from" | "to" | "terminal"; bus: string }[];
  /**
   * Sequence currents at every device location for every fault, in a compact linear form (memory D*B*6 rather than
   * D*B*T*6): read them with `sweepDeviceCurrents(sweep, d, b, t)`, which returns primary amperes with the
   * EndCurrent sign convention. Layout documented in src/engine/fault/sweepFaults.ts.
   */
  deviceData: SweepDeviceData;
  messages: EngineMessage[];
}

/** Device locations per block of SweepDeviceData.transfer. */
export const TRANSFER_BLOCK = 8;

/** Internal layout of the sweep's device currents; plain typed arrays so it can be transferred. */
export interface SweepDeviceData {
  /** Primary-ampere base of each device location (node base current at its end). */
  base_A: Float64Array;
  /**
   * X_s = Z_s C_s, the sequence networks' response to each device location's current combination: the device
   * current (pu) per pu fault current of sequence s drawn at bus b is -X_s[row(b), slot(d)]. Stored in blocks of
   * TRANSFER_BLOCK (8) devices: value (row, slot) of sequence s, real (im = 0) or imaginary part (im = 1), at
   * ((blk * 3 + s) * 2 + im) * transferRows * 8 + row * 8 + slot % 8 with blk = floor(slot / 8).
   */
  transfer: Float64Array;
  /** Rows of each part of transfer (every node of the network, or just the swept buses). */
  transferRows: number;
  /** Row of each swept bus in transfer; -1 when the bus is out of service. */
  transferBusRow: Int32Array;
  /** Slot of each device location in transfer; -1 when it has no current (element out of service). */
  transferSlot: Int32Array;
  /**
   * When the negative-sequence network differs from the positive one in the diagonal at a few nodes only, transfer
   * holds no negative sequence: X2[row, slot] = X1[row, slot] - sum_h w[row, h] alpha[slot, h] (complex; w per
   * [(row * rank + h) * 2 + re/im], alpha per [(slot * rank + h) * 2 + re/im]). Null: transfer holds it.
   */
  negative: { rank: number; w: Float64Array; alpha: Float64Array } | null;
  /** Fault sequence currents drawn into the fault, pu, per [(b * T + t) * 6 + 2 * s + re/im]. */
  faultSeq_pu: Float64Array;
  /** Source-injection part (inverters): J = number of inverters; map per [(d * J + j) * 6 + 2 * s + re/im]. */
  injMap: Float64Array;
  /** Inverter injections pu per [((b * T + t) * J + j) * 6 + 2 * s + re/im]. */
  inj_pu: Float64Array;
  nInj: number;
  /** Phase shift of each device end's node, degrees (positive sequence). */
  shift_deg: Float64Array;
  /** Phase shift of each faulted bus's node, degrees; angles are referred to the faulted bus. */
  busShift_deg: Float64Array;
  /** Faults solved one by one (buses in islands without a voltage source): per entry the D * 6 block in A, already shifted. */
  overrides: { b: number; t: number; seq_A: Float64Array }[];
}

/** One device location's currents for one fault of a sweep. */
export interface SweepDeviceCurrents {
  seq_A: SeqTriple<Complex>;
  phase_A: PhaseTriple<Phasor>;
}

export interface SweepOptions {
  types?: FaultType[];
  /** Bus ids to fault; default every energized bus. */
  buses?: string[];
  /** Device locations to keep; default every relay/fuse/lvbreaker `at` in service. */
  devices?: { element: string; end: "from" | "to" | "terminal" }[];
  /** Override study.inverterModel for this sweep ("iec" needs no iteration and is much faster). */
  inverterModel?: InverterModel;
  /** Progress callback (fraction 0..1); return false to cancel. */
  onProgress?: (fraction: number) => boolean | void;
}

export interface LoadFlowBusResult {
  bus: string;
  v_pu: number;
  ang_deg: number;
  v_kV: number;
}
export interface LoadFlowEnd {
  bus: string;
  i_A: number;
  p_MW: number;
  q_Mvar: number;
}
export interface LoadFlowBranchResult {
  element: string;
  from: LoadFlowEnd;
  to: LoadFlowEnd;
  loading_pct: number;
}
export interface LoadFlowShuntResult {
  element: string;
  bus: string;
  /** From bus into the element (a generator delivering power has negative p_MW). */
  i_A: number;
  p_MW: number;
  q_Mvar: number;
}
export interface LoadFlowResult {
  scenario: string;
  converged: boolean;
  iterations: number;
  mismatch_pu: number;
  slack: string | null;
  buses: LoadFlowBusResult[];
  branches: LoadFlowBranchResult[];
  shunts: LoadFlowShuntResult[];
  messages: EngineMessage[];
}

/** Load current at every device-relevant location: branch ends and shunt terminals. */
export interface LocationCurrent {
  element: string;
  end: "from" | "to" | "terminal";
  bus: string;
  i_A: number;
}

export const CAUTION = CAUTION_TEXT;
