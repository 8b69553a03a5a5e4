// Types shared by the protective-device models. Currents are primary amperes at the device,
// times are seconds, voltages are per unit. Plain data only, so results cross the worker boundary.
import type { Fuse, LvBreaker, ProtectiveDevice, Relay } from "../model/schema.ts";

export type { Fuse, LvBreaker, ProtectiveDevice, Relay };

/** A complex number as plain data. */
export interface Phasor {
  re: number;
  im: number;
}

/**
 * Complex sequence quantities seen by a device. Currents in primary amperes, positive when flowing
 * from the bus into the element the device looks into (so a fault inside that element is "forward").
 * Voltages in per unit at the device's bus.
 */
export interface SequenceQuantities {
  i0_A: Phasor;
  i1_A: Phasor;
  i2_A: Phasor;
  v0_pu: Phasor;
  v1_pu: Phasor;
  v2_pu: Phasor;
}

/** What a device measures during one fault state. */
export interface Measurement {
  /** Phase current magnitudes |Ia|, |Ib|, |Ic| in primary amperes. */
  phase_A: readonly [number, number, number];
  /** Residual current magnitude |3 I0| in primary amperes. */
  residual_A: number;
  /** Negative-sequence current magnitude |I2| in primary amperes. */
  negative_A: number;
  /** Complex sequence quantities; needed by directional (67/67N) and voltage-restrained (51V) functions. */
  sequence?: SequenceQuantities;
}

/**
 * Which edge of a device's tolerance band to use.
 * nominal: the set curve. min: fastest operation (pickup and time at their lower tolerance; fuse melting curve).
 * max: slowest operation (pickup and time at their upper tolerance; fuse total-clearing curve).
 */
export type Band = "nominal" | "min" | "max";

export interface OperatingOptions {
  band?: Band;
  /** Treat directional functions as non-directional (for plotting a curve). Default false. */
  ignoreDirection?: boolean;
}

/** The answer to "when does this device operate for this measurement". */
export interface OperatingResult {
  /** True when at least one enabled function/region picks up. */
  picked: boolean;
  /** Relay or trip-unit time (fuse: melting time) in s; Infinity when nothing operates. */
  trip_s: number;
  /** Total clearing time in s: trip + breaker/mechanism time (fuse: total clearing time); Infinity when nothing operates. */
  clearing_s: number;
  /** The function or region that operates first: a relay function id, an LV region ("long-time", "short-time",
   * "instantaneous", "ground-fault") or a fuse element ("fuse"). */
  functionId?: string;
  /** One line a person can read: why it operates, or why not. */
  reason: string;
}

/** LV trip-unit regions. */
export type LvRegion = "long-time" | "short-time" | "instantaneous" | "ground-fault";

/** Which measured quantity a time-current curve is drawn against. */
export type CurveQuantity = "phase" | "ground" | "negative";

/** A polyline on the time-current plane: [current in A (at the reference voltage), time in s]. */
export type CurvePoint = readonly [number, number];
export type Polyline = CurvePoint[];

/** A device curve with its tolerance band. */
export interface CurveBand {
  nominal: Polyline;
  min: Polyline;
  max: Polyline;
}

export interface SampleOptions {
  quantity?: CurveQuantity;
  /** Nominal voltage at the device in kV. */
  device_kV?: number;
  /** Plot reference voltage in kV; currents are multiplied by device_kV / reference_kV. */
  reference_kV?: number;
  /** Current range of the plot, device-side amperes. Defaults: 0.5 x lowest pickup to 100 x it. */
  iMin_A?: number;
  iMax_A?: number;
  /** Time range of the plot, s. Defaults 0.01 to 1000 s. */
  tMin_s?: number;
  tMax_s?: number;
  /** Points per decade of current. Default 60. */
  pointsPerDecade?: number;
  /** Add breaker/mechanism time to relay and trip-unit curves. Default false. */
  includeClearing?: boolean;
  /** 51V: restraint voltage assumed for the plot, pu. Default 1 (no restraint). */
  restraint_pu?: number;
  /** Draw only these functions/regions (relay function ids, LV region ids), e.g. the one being dragged. */
  elementIds?: readonly string[];
}

/** Disk-travel state of a device during a fault whose current changes in steps. */
export interface TravelState {
  /** Fraction of the way to operation, 0..1, per function/region id. */
  travel: Readonly<Record<string, number>>;
  /** Fault time accumulated so far in s. */
  elapsed_s: number;
  /** Set once a function reaches 1: which one and at what elapsed time. */
  operated?: { functionId: string; at_s: number };
}

export type Severity = "error" | "warning";

/** A settings problem, naming the element and the field. */
export interface Message {
  severity: Severity;
  elementId: string;
  elementName: string;
  /** Dotted path of the offending field, e.g. "functions[0].pickup_A" or "longTime.tr_s". */
  field: string;
  /** The whole sentence, e.g. `Relay R1 "Dock feeder": functions[0].pickup_A must be > 0 (got -3)`. */
  text: string;
}
