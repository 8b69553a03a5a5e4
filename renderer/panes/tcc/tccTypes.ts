// The data the time-current pane draws. Currents are amperes referred to the pane's reference
// voltage (the shell, or the adapter in ./fromProtection.ts, does the referral); times in seconds.

/** One point of a curve: [current_A, time_s]. */
export type CurvePoint = readonly [current_A: number, time_s: number];

/** A protective device's characteristic (one function, or one composite curve of a device)
 * drawn as a tolerance band: the area between `min` and `max`, and the `nominal` line. */
export interface TccBand {
  /** Element id of the relay, fuse or LV breaker. */
  deviceId: string;
  /** Function id within a relay (e.g. its 51 element); for fuses and breakers any stable id. */
  functionId: string;
  /** Device name for the legend and read-out. */
  deviceName: string;
  /** Short function label: "51 IEC standard inverse", "fuse general-purpose", "LV trip unit". */
  functionLabel: string;
  /** Pickup in the device's own primary amperes (what onSettingChange edits). */
  pickup_A: number;
  /** What the legend calls pickup_A: "pickup" (default), "rating" for a fuse, "Ir" for an LV trip unit. */
  pickupLabel?: string;
  /** Time multiplier (IEC TMS, IEEE TD) when the curve has one. */
  multiplier?: number;
  /** Nominal characteristic, increasing current. */
  nominal: readonly CurvePoint[];
  /** Fastest edge of the tolerance band (lower-left). */
  min: readonly CurvePoint[];
  /** Slowest edge of the tolerance band (upper-right); for fuses the total-clearing curve. */
  max: readonly CurvePoint[];
  /** Which settings a drag may change; a missing flag means "not draggable that way". */
  draggable?: { pickup?: boolean; multiplier?: boolean };
}

/** Equipment withstand: transformer through-fault (IEEE C57.109), cable I^2 t = k^2 S^2, or a motor starting curve. */
export interface TccEquipmentCurve {
  id: string;
  name: string;
  kind: "transformer-damage" | "cable-damage" | "motor-start";
  points: readonly CurvePoint[];
  /** Second legend line (default: what the kind means, e.g. "through-fault withstand"). */
  detail?: string;
}

/** A single point such as a transformer's magnetising inrush (about 12x rated for 0.1 s). */
export interface TccMarkerPoint {
  id: string;
  name: string;
  kind: "inrush" | "other";
  current_A: number;
  time_s: number;
}

/** A fault current drawn as a labelled vertical dashed line. */
export interface TccFaultMark {
  id: string;
  /** Label, e.g. "3ph max, grid-tied". */
  label: string;
  current_A: number;
  /** Scenario the current belongs to; marks of one scenario share a dash style. */
  scenarioId?: string;
}

/** Settings change requested by a drag. Exactly one of the two fields is set. */
export interface TccSettingPatch {
  pickup_A?: number;
  multiplier?: number;
}

/** A file the pane hands to the shell to save through the host adapter. */
export interface TccExportFile {
  suggestedName: string;
  mime: "image/svg+xml" | "image/png";
  data: string | Uint8Array;
}
