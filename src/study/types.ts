// Public result types of the protection study: plain data (no classes, no Maps) so that results
// cross the worker boundary unchanged and the UI, the report and the CLI read the same shapes.
// Currents are primary amperes (RMS, initial symmetrical), times are seconds.
import { CAUTION_TEXT } from "../model/caution.ts";

/** IEC 60909 fault types: three-phase, line-to-line, line-to-earth, line-to-line-to-earth. */
export type FaultType = "3ph" | "LL" | "LG" | "LLG";
export const FAULT_TYPES: readonly FaultType[] = ["3ph", "LL", "LG", "LLG"];

/** Which IEC 60909 calculation: maximum (cmax, all contributors) or minimum (cmin). */
export type FaultLimit = "max" | "min";

/** Where a fault is applied: at a bus, or at a point along a line or cable (percent of its length from its fromBus). */
export type FaultLocation =
  | { kind: "bus"; bus: string }
  | { kind: "line"; line: string; pct: number };

/** One fault case: a location, a fault type, a limit, in one scenario. */
export interface FaultCase {
  /** Stable id, e.g. `grid-all|bus:LV-A|LL|min`. */
  id: string;
  scenario: string;
  location: FaultLocation;
  faultType: FaultType;
  limit: FaultLimit;
  /** Human label, e.g. `LL fault on bus LV-A (islanded: genset, battery and PV, min)`. */
  label: string;
}

/** Direction of the current a device sees, relative to the element it looks into. */
export type CurrentDirection = "forward" | "reverse" | "none";

/** Role of a device in a fault case. */
export type DeviceRole = "primary" | "backup" | "sympathetic" | "none";

/** What one protective device sees and does in one fault case. */
export interface DeviceResponse {
  device: string;
  deviceName: string;
  deviceKind: "relay" | "fuse" | "lvbreaker";
  /** Largest phase current, primary A. */
  iPhase_A: number;
  /** Residual current 3I0, primary A. */
  iResidual_A: number;
  /** Negative-sequence current I2, primary A. */
  iNegative_A: number;
  /** forward: current flows from the bus into the element the device looks into; reverse: out of it. */
  direction: CurrentDirection;
  /** True when at least one enabled element (function, band) is above pickup and allowed by its direction. */
  pickedUp: boolean;
  /** Id of the function or element that operates first (relay function id, "long-time", "melt", ...). */
  operatingElement: string | null;
  /** Nominal operating time (relay/trip-unit time or fuse melting time); null when it does not operate. */
  tOperate_s: number | null;
  /** Total clearing time: operating time plus breaker time (relays), arcing (LV breakers) or the fuse's clearing curve. */
  tClear_s: number | null;
  /** Tolerance band of the clearing time: fast edge and slow edge. */
  tClearMin_s: number | null;
  tClearMax_s: number | null;
  role: DeviceRole;
  /** Source paths (source element ids) on which this device sits between source and fault. */
  onPathsOf: string[];
}

/** One device in a primary/backup chain along one source path. */
export interface ChainLink {
  device: string;
  deviceName: string;
  /** 0 = the expected device, 1 = one of its backups (they act in parallel when its breaker sticks). */
  depth: number;
  role: "primary" | "backup";
  current_A: number;
  /** Clearing time, null when the device does not operate. */
  tClear_s: number | null;
  /** For a backup: its fast-edge clearing time minus the primary's slow-edge clearing time (first state); null for the primary or when either does not operate. */
  marginToNext_s: number | null;
}

/** The chain of devices met walking from the fault outward to one source. */
export interface SourcePathChain {
  source: string;
  sourceName: string;
  sourceKind: "grid" | "generator" | "inverter";
  /** Elements (branches, switches) from the fault to the source, nearest first. */
  elements: string[];
  links: ChainLink[];
}

/** Every source path into one fault, with its chain: what the UI highlights and steps through. */
export interface FaultChains {
  caseId: string;
  paths: SourcePathChain[];
  /** The smallest set of devices whose operation isolates the fault (one per source path, nearest first). */
  idealIsolation: string[];
}

export { VERDICT_KINDS, type VerdictKind } from "./verdictKinds.ts";
import type { VerdictKind } from "./verdictKinds.ts";
export type VerdictStatus = "pass" | "warn" | "fail";

/** One verdict with its numbers and a one-line explanation. */
export interface Verdict {
  /** Stable id: kind, device(s) and case. */
  id: string;
  kind: VerdictKind;
  status: VerdictStatus;
  scenario: string;
  /** Fault case the verdict refers to (null for verdicts against load current). */
  caseId: string | null;
  device: string;
  /** The other device of a pair (selectivity: the backup) or the infeed source (blinding). */
  other: string | null;
  /** The figures behind the verdict, named with units, e.g. `{ margin_s: 0.12, cti_s: 0.3 }`. */
  numbers: Record<string, number>;
  /** One line, e.g. `R-T1-HV 51 backup to CB-F3: margin 0.12 s < CTI 0.30 s at LL fault on bus LV-A (islanded, min)`. */
  explanation: string;
}

/** One step of the simulated operation: a device trips (fuse: melts), its breaker opens (fuse: clears), or fails to (stuck). */
export interface OperationStep {
  device: string;
  t_s: number;
  action: "trip" | "open" | "melt" | "clear" | "stuck";
  /** The element the device looks into, opened at the device's end (open, clear, stuck). */
  element: string | null;
}

/** What happens when one expected device's breaker fails to open: the zone grown past it. */
export interface FailureOutcome {
  /** The expected device whose breaker is assumed stuck (every device at that element end fails with it). */
  device: string;
  /** Devices expected to isolate the fault instead (beyond the expected isolation). */
  backups: string[];
  operations: OperationStep[];
  isolated_s: number | null;
  loadLost_kW: number;
}

/**
 * The case as the protection should and does clear it: the faulted zone, the expected isolation (the smallest set
 * of zone-boundary devices that disconnects it from every energising source) and the simulated operation.
 */
export interface CaseOperation {
  /** Buses of the faulted zone, grown past devices that cannot see the fault by design. */
  zoneBuses: string[];
  /** Devices of the expected isolation, in network order. */
  ideal: string[];
  /** Per expected device: its backups (the zone grown past its stuck breaker). */
  backups: { device: string; backups: string[] }[];
  /** Boundary devices that restrain by direction (correctly); the zone grew past them to remote devices. */
  restrained: string[];
  /** Energising sources no device of the project can separate from the fault. */
  outOfReach: string[];
  /** Grid-following converters feeding the fault: they cease to energise on their own protection. */
  selfCeasing: string[];
  /** What the protection did, in time order. */
  operations: OperationStep[];
  /** When the fault was isolated from every energising source a device can reach; null when not within the horizon. */
  isolated_s: number | null;
  /** Devices that tripped without being in the expected isolation. */
  unwanted: string[];
  loadLost_kW: number;
  idealLoadLost_kW: number;
  /** Elements that carried the fault, with the fraction of their withstand used (1 = reached), largest first. */
  withstand: { element: string; used: number; peak_A: number }[];
  /** One outcome per expected device with its breaker stuck. */
  failures: FailureOutcome[];
}

/** Per-case result: responses of every device, the expected and simulated operation, and the verdicts raised in it. */
export interface CaseResult {
  faultCase: FaultCase;
  /** Current at the fault point, A (largest phase current into the fault). */
  iFault_A: number;
  /** Every device that carries current in this case or takes part in its isolation (others see nothing). */
  responses: DeviceResponse[];
  /** The expected isolation as chains for stepping through: one per expected device, its backups after it. */
  chains: FaultChains;
  operation: CaseOperation;
  /** True when the engine could not solve the case (its reason is in the study's warnings); no current is given. */
  unsolved?: boolean;
  verdictIds: string[];
}

export type TimelineAction = "trip" | "open" | "melt" | "clear";

/** One event of the sequential clearing simulation. */
export interface TimelineEvent {
  t_s: number;
  device: string;
  deviceName: string;
  action: TimelineAction;
  /** Element disconnected by this event (the one the device looks into), when it opens. */
  element: string | null;
  /** Device currents (primary A) in the network state just before this event. */
  currents: { device: string; i_A: number }[];
}

/** Result of the sequential clearing simulation of one fault case. */
export interface ClearingTimeline {
  caseId: string;
  events: TimelineEvent[];
  /** True when every source path into the fault that a device of the project can open was opened within the horizon. */
  isolated: boolean;
  /** Time at which the last source path opened, null when not isolated. */
  clearedAt_s: number | null;
  horizon_s: number;
  /** Buses without any source after the final state (faulted bus included). */
  deenergisedBuses: string[];
  loadLost_kW: number;
  /** The same quantities for the ideal isolation (the smallest set of devices that isolates the fault). */
  ideal: { devices: string[]; deenergisedBuses: string[]; loadLost_kW: number };
  /** One line saying what happened, e.g. `nothing operates within 10 s`. */
  summary: string;
}

/** One cell of the study matrix: one fault location/type/limit (row) in one scenario (column). */
export interface MatrixCell {
  row: string;
  scenario: string;
  caseId: string;
  worst: VerdictStatus | null;
  counts: Record<VerdictStatus, number>;
  verdictIds: string[];
}

export interface MatrixRow {
  /** `bus:LV-A|LL|min` (the case id without its scenario). */
  id: string;
  label: string;
}

export interface StudyMatrix {
  scenarios: { id: string; name: string }[];
  rows: MatrixRow[];
  cells: MatrixCell[];
  totals: Record<VerdictKind, Record<VerdictStatus, number>>;
}

/** Options of a study run. Every field is optional; absent ones cover everything. */
export interface StudyOptions {
  scenarios?: string[];
  buses?: string[];
  faultTypes?: FaultType[];
  limits?: FaultLimit[];
  /** Include points along lines (default true). */
  linePoints?: boolean;
  /** Keep the clearing timeline (steps with currents) of these case ids too (the cases that matter are always kept). */
  timelineCases?: string[];
  /** Only these fault locations (keys.locationKey), e.g. one case's. */
  locationKeys?: string[];
  /** False: the result keeps no cases or verdicts (they went to StudyHooks.onScenario). Default true. */
  keepResults?: boolean;
}

/** The whole study. */
export interface StudyResult {
  project: string;
  cases: CaseResult[];
  verdicts: Verdict[];
  matrix: StudyMatrix;
  timelines: ClearingTimeline[];
  /** Problems that kept part of the study from running (element id/name and reason). */
  warnings: string[];
  caution: string;
}

export const STUDY_CAUTION = CAUTION_TEXT;

// ---------- worker requests (src/study/rpc/handleStudyRequest.ts) ----------

/** A request to the study worker. The project is the document object (already validated) or its file text. */
export type StudyRequest =
  | { kind: "full"; requestId: string; project: unknown; options?: StudyOptions }
  | { kind: "case"; requestId: string; project: unknown; caseId: string; timeline?: boolean };

export interface StudyProgress {
  requestId: string;
  done: number;
  total: number;
  phase: "cases" | "verdicts" | "timelines";
}

export type StudyResponse =
  | { kind: "full"; requestId: string; ok: true; result: StudyResult }
  | { kind: "case"; requestId: string; ok: true; result: CaseResult; verdicts: Verdict[]; timeline: ClearingTimeline | null }
  | { kind: "cancelled"; requestId: string; ok: false }
  | { kind: "error"; requestId: string; ok: false; message: string };

/** An operation record with nothing expected and nothing done (a case the study did not reach). */
export function emptyCaseOperation(): CaseOperation {
  return { zoneBuses: [], ideal: [], backups: [], restrained: [], outOfReach: [], selfCeasing: [], operations: [], isolated_s: null, unwanted: [], loadLost_kW: 0, idealLoadLost_kW: 0, withstand: [], failures: [] };
}
