// Words for the screen: a human label for each document field (its unit is shown beside it) and a
// display label for each enumerated value, so no internal name ("iec-standard-inverse", "tr_s",
// "pv") reaches the user. Paths are written without list indices: "functions.curve".
import type { ElementKind } from "./schema.ts";

/** Labels by `kind.path`, then by `path` alone. Only where the schema's description does not read well. */
const FIELD_LABELS: Record<string, string> = {
  "grid.rx": "R/X of the grid",
  "grid.z0z1": "Z0/Z1 of the grid (0: no zero-sequence path)",
  "grid.r0x0": "R0/X0 of the grid",
  "transformer.z0z1": "Z0/Z1 of the windings",
  "transformer.tap_pct": "Off-load tap position",
  "earthing.kind": "Neutral earthing",
  "earthing.z_ohm": "Earthing impedance",
  "line.parallel": "Parallel runs",
  "line.ampacity_A": "Ampacity IZ of one run",
  "generator.cosPhi": "Rated power factor cos φ",
  "generator.rx": "R/X of the subtransient impedance",
  "generator.unit.pG_pct": "Voltage regulation range pG",
  "inverter.iMax_pu": "Fault current limit",
  "inverter.control": "Control",
  "inverter.kFactor": "Reactive current gain k (voltage support)",
  "inverter.negSeq": "Negative-sequence current",
  "inverter.negSeq.mode": "Negative-sequence injection",
  "inverter.negSeq.k2": "Negative-sequence gain k2",
  "inverter.zForming_pu": "Source impedance (grid-forming)",
  "inverter.activePower_pu": "Active output before the fault",
  "motor.eta": "Efficiency η",
  "motor.cosPhi": "Power factor cos φ",
  "motor.rx": "R/X of the locked rotor",
  "motor.polePairs": "Pole pairs",
  "switch.device": "Type",
  "switch.closed": "Closed as drawn",
  "relay.breakerTime_s": "Breaker opening time",
  "relay.functions.id": "Function id",
  "relay.functions.ansi": "Function (IEEE C37.2)",
  "relay.functions.quantity": "Measures",
  "relay.functions.tMin_s": "Minimum operating time",
  "relay.functions.tMax_s": "Maximum operating time",
  "relay.functions.rca_deg": "Characteristic angle",
  "relay.functions.restraint.vFull_pu": "No restraint above",
  "relay.functions.restraint.kMin": "Pickup factor at zero voltage",
  "tolerance.pickup_pct": "Pickup tolerance ±",
  "tolerance.time_pct": "Time tolerance ±",
  "tolerance.time_min_s": "Least time tolerance",
  "fuse.rating_A": "Rated current In",
  "fuse.curve.family": "Family",
  "lvbreaker.longTime.ir_x": "Long-time pickup Ir / In",
  "lvbreaker.longTime.tr_s": "Long-time delay tr",
  "lvbreaker.longTime.ref_x": "tr applies at (multiple of Ir)",
  "lvbreaker.shortTime.isd_x": "Short-time pickup Isd / Ir",
  "lvbreaker.shortTime.tsd_s": "Short-time delay tsd",
  "lvbreaker.shortTime.i2t": "I²t ramp below 10 Ir",
  "lvbreaker.instantaneous.ii_x": "Instantaneous pickup Ii / In",
  "lvbreaker.groundFault.ig_A": "Ground-fault pickup Ig",
  "lvbreaker.groundFault.tg_s": "Ground-fault delay tg",
  "lvbreaker.groundFault.i2t": "I²t ramp",
  "lvbreaker.clearing_s": "Opening and arcing time",
  "bus.zone": "Protection zone",
  "bus.clearingLimit_s": "Clearing time limit",
};

/** Groups whose fields are labelled alike wherever they sit (earthingHv, earthingLv, earthing; tolerance). */
const SHARED_GROUPS: Record<string, string> = { earthingHv: "earthing", earthingLv: "earthing", earthing: "earthing", tolerance: "tolerance" };

/** The label for a field at `path` (e.g. ["functions", 0, "curve"]) of an element of `kind`, if one is set. */
export function fieldLabel(kind: ElementKind | undefined, path: readonly (string | number)[]): string | undefined {
  const keys = path.filter((p): p is string => typeof p === "string");
  const full = keys.join(".");
  if (kind && FIELD_LABELS[`${kind}.${full}`]) return FIELD_LABELS[`${kind}.${full}`];
  if (keys.length >= 2) {
    const group = SHARED_GROUPS[keys[keys.length - 2]];
    if (group && FIELD_LABELS[`${group}.${keys[keys.length - 1]}`]) return FIELD_LABELS[`${group}.${keys[keys.length - 1]}`];
  }
  return FIELD_LABELS[full];
}

/** Display words of enumerated values, by field key. */
const OPTION_LABELS: Record<string, Record<string, string>> = {
  curve: {
    "iec-standard-inverse": "IEC standard inverse",
    "iec-very-inverse": "IEC very inverse",
    "iec-extremely-inverse": "IEC extremely inverse",
    "iec-long-time-inverse": "IEC long-time inverse",
    "ieee-moderately-inverse": "IEEE moderately inverse",
    "ieee-very-inverse": "IEEE very inverse",
    "ieee-extremely-inverse": "IEEE extremely inverse",
    "definite-time": "Definite time",
    parametric: "Family curve",
    points: "Points (melting and clearing)",
  },
  source: { pv: "PV", battery: "Battery", other: "Other" },
  control: { "grid-following": "Grid-following", "grid-forming": "Grid-forming" },
  construction: { cable: "Cable", overhead: "Overhead line" },
  kind: { solid: "Solidly earthed", resistance: "Through a resistor", reactance: "Through a reactor", isolated: "Isolated (unearthed)", parametric: "Family curve", points: "Points (melting and clearing)" },
  device: { breaker: "Circuit breaker", switch: "Load switch", disconnector: "Disconnector" },
  quantity: { phase: "Phase currents", residual: "Residual current 3I0", negative: "Negative-sequence current I2" },
  direction: { "non-directional": "Non-directional", forward: "Forward (into the element)", reverse: "Reverse" },
  reset: { instantaneous: "Instantaneous", ieee: "IEEE timed reset" },
  family: { "general-purpose": "General purpose", fast: "Fast", "time-delay": "Time-delay" },
  mode: { none: "None", "k-factor": "Proportional to the voltage unbalance (k2)" },
  ansi: {
    "50": "50 instantaneous overcurrent",
    "51": "51 time overcurrent",
    "50N": "50N instantaneous earth fault",
    "51N": "51N time earth fault",
    "51Q": "51Q negative-sequence time overcurrent",
    "46": "46 current unbalance",
    "67": "67 directional overcurrent",
    "67N": "67N directional earth fault",
    "51V": "51V voltage-restrained overcurrent",
  },
  ctSecondary_A: { "1": "1 A", "5": "5 A" },
  material: { Cu: "Copper", Al: "Aluminium" },
  end: { from: "from end", to: "to end", terminal: "terminal" },
};

/** The words for value `value` of the field `key`; the value itself when it has none (vector groups, PVC). */
export function optionLabel(key: string, value: string | number): string {
  return OPTION_LABELS[key]?.[String(value)] ?? String(value);
}
