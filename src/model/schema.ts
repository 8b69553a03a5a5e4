// The project document: typed records with stable ids, described once as zod schemas.
// The schemas are the single source of truth: TypeScript types are inferred from them,
// the loader validates with them and tests/tools/gen-schema.mjs turns them into JSON Schema.
// Objects are "loose": a field this version does not know is kept, not dropped.
import { z } from "zod";

export const FORMAT_TAG = "islet-project";
export const FORMAT_VERSION = 1;

const id = z.string().min(1).describe("Stable element id, unique within the project");
const name = z.string().describe("Human name shown on the one-line and in reports");
// Physical ranges: wide enough for any real site, narrow enough that the engine's arithmetic stays finite
// (an S"k of 1e308 MVA or a uk of 1e-300 % would overflow it). A value outside is refused by element and field.
const positive = (d: string, max = 1e6) => z.number().positive().max(max).describe(d);
const nonNegative = (d: string, max = 1e6) => z.number().nonnegative().max(max).describe(d);
/** From `min` to `max` (inclusive). A positive `min` first asks for > 0, so a zero or negative value reads "must be > 0". */
const within = (min: number, max: number, d: string) => (min > 0 ? z.number().positive({ abort: true }) : z.number()).min(min).max(max).describe(d);
/** Limits shared by several kinds. */
const KV_MAX = 1200; // above the highest AC system voltage in service (1150 kV)
const MVA_RATING = [1e-4, 1e4] as const; // 100 VA to 10 GVA
const PU_REACTANCE = [1e-3, 100] as const;
const TIME_MAX_S = 3600;
/** Intermediate fault points per line and scenarios per project (each multiplies a study's size). */
export const MAX_LINE_POINTS = 19;
export const MAX_SCENARIOS = 256;
const CURRENT_MAX_A = 1e7;

// ---------- shared parts ----------

export const earthingSchema = z.looseObject({
  kind: z.enum(["solid", "resistance", "reactance", "isolated"]),
  z_ohm: nonNegative("Earthing impedance in ohm (resistance or reactance kinds)", 1e5).optional(),
});
export type Earthing = z.infer<typeof earthingSchema>;

/** Where a protective device sits: at one end of a branch, or at the terminals of a shunt element
 * (grid feeder, generator, inverter, motor, load). It looks into that element. */
export const deviceLocationSchema = z.looseObject({
  element: id.describe("Branch or shunt element the device looks into"),
  end: z.enum(["from", "to", "terminal"]).describe("Branch end (from/to) or 'terminal' for a shunt element"),
});
export type DeviceLocation = z.infer<typeof deviceLocationSchema>;

export const toleranceSchema = z.looseObject({
  pickup_pct: nonNegative("Pickup tolerance, +/- percent", 100).default(5),
  time_pct: nonNegative("Operating-time tolerance, +/- percent", 100).default(5),
  time_min_s: nonNegative("Absolute time tolerance floor in seconds", 10).default(0.02),
});
export type Tolerance = z.infer<typeof toleranceSchema>;

// ---------- network elements ----------

export const busSchema = z.looseObject({
  kind: z.literal("bus"),
  id,
  name: name.optional(),
  un_kV: within(1e-3, KV_MAX, "Nominal line-to-line voltage in kV"),
  zone: z.string().optional().describe("Protection zone label"),
  clearingLimit_s: positive("Maximum primary clearing time for faults at this bus (speed check)", TIME_MAX_S).optional(),
});

export const gridSchema = z.looseObject({
  kind: z.literal("grid"),
  id,
  name: name.optional(),
  bus: id,
  // 1 kVA up: the strongest transmission nodes are near 100 GVA; up to 1e12 MVA stands in for an infinite bus
  skMax_MVA: within(1e-3, 1e12, "Maximum initial symmetrical short-circuit power S\"k max in MVA"),
  skMin_MVA: within(1e-3, 1e12, "Minimum initial symmetrical short-circuit power S\"k min in MVA"),
  rx: nonNegative("R/X of the network feeder impedance", 100).default(0.1),
  z0z1: nonNegative("Ratio |Z0|/|Z1| of the feeder (0 = no zero-sequence path)", 100).default(1),
  r0x0: nonNegative("R0/X0 of the feeder zero-sequence impedance", 100).default(0.1),
});

export const vectorGroups = ["Dyn11", "Dyn1", "Dyn5", "YNd11", "YNd1", "YNyn0", "Yyn0", "Yy0", "Yd11", "Yd1", "Dd0", "Dy11", "YNy0", "Yyn6"] as const;
export const vectorGroupSchema = z.enum(vectorGroups);
export type VectorGroup = z.infer<typeof vectorGroupSchema>;

export const transformerSchema = z.looseObject({
  kind: z.literal("transformer"),
  id,
  name: name.optional(),
  hvBus: id,
  lvBus: id,
  sr_MVA: within(...MVA_RATING, "Rated apparent power in MVA"),
  urHv_kV: within(1e-3, KV_MAX, "Rated voltage of the HV winding in kV"),
  urLv_kV: within(1e-3, KV_MAX, "Rated voltage of the LV winding in kV"),
  uk_pct: within(0.1, 100, "Short-circuit voltage in percent"),
  ur_pct: nonNegative("Resistive part of the short-circuit voltage in percent", 100).default(1),
  vectorGroup: vectorGroupSchema.default("Dyn11"),
  earthingHv: earthingSchema.default({ kind: "isolated" }),
  earthingLv: earthingSchema.default({ kind: "solid" }),
  tap_pct: z.number().min(-30).max(30).default(0).describe("Off-load tap position in percent on the HV side"),
  z0z1: within(1e-3, 100, "Zero-sequence to positive-sequence impedance ratio of the windings").default(1),
});

export const lineSchema = z.looseObject({
  kind: z.literal("line"),
  id,
  name: name.optional(),
  construction: z.enum(["cable", "overhead"]).default("cable"),
  fromBus: id,
  toBus: id,
  length_km: within(1e-6, 1e4, "Route length in km"),
  r1_ohmPerKm: nonNegative("Positive-sequence resistance at 20 C in ohm/km", 1e3),
  x1_ohmPerKm: nonNegative("Positive-sequence reactance in ohm/km", 1e3),
  r0_ohmPerKm: nonNegative("Zero-sequence resistance at 20 C in ohm/km", 1e3),
  x0_ohmPerKm: nonNegative("Zero-sequence reactance in ohm/km", 1e3),
  parallel: z.number().int().min(1).max(100).default(1).describe("Number of identical parallel runs"),
  material: z.enum(["Cu", "Al"]).default("Cu"),
  insulation: z.enum(["PVC", "XLPE", "EPR"]).default("XLPE"),
  csa_mm2: positive("Conductor cross-section in mm2", 1e4),
  ampacity_A: positive("Continuous current rating of one run in A", 1e5),
});

/** A generator that feeds the network through its own step-up transformer: IEC 60909-0:2016, 6.7 corrects the two
 * as one power station unit (K_S with an on-load tap changer, else K_SO) instead of KG and KT apart. */
export const powerStationUnitSchema = z
  .looseObject({
    transformer: id.describe("Unit transformer: id of the step-up transformer whose LV bus is the generator's bus"),
    onLoadTap: z.boolean().default(true).describe("On-load tap changer on the unit transformer: K_S if set, else K_SO"),
    pG_pct: nonNegative("Generator voltage regulation range p_G in percent, used without on-load tap changer (K_SO)", 50).default(0),
  })
  .describe("Power station unit: generator and unit transformer corrected as one (IEC 60909-0:2016, 6.7)");
export type PowerStationUnit = z.infer<typeof powerStationUnitSchema>;

export const generatorSchema = z.looseObject({
  kind: z.literal("generator"),
  id,
  name: name.optional(),
  bus: id,
  sr_MVA: within(...MVA_RATING, "Rated apparent power in MVA"),
  ur_kV: within(1e-3, KV_MAX, "Rated voltage in kV"),
  cosPhi: z.number().gt(0).max(1).default(0.8),
  xdss_pu: within(...PU_REACTANCE, "Subtransient reactance x\"d in pu of rating"),
  xds_pu: within(...PU_REACTANCE, "Transient reactance x'd in pu").default(0.3),
  xd_pu: within(...PU_REACTANCE, "Synchronous reactance xd in pu").default(2),
  x2_pu: within(...PU_REACTANCE, "Negative-sequence reactance in pu"),
  x0_pu: within(...PU_REACTANCE, "Zero-sequence reactance in pu"),
  rx: nonNegative("R/X of the subtransient impedance (IEC 60909-0: 0.15 LV, 0.07 or 0.05 HV)", 100).default(0.15),
  earthing: earthingSchema.default({ kind: "isolated" }),
  unit: powerStationUnitSchema.optional(),
});

export const inverterSchema = z.looseObject({
  kind: z.literal("inverter"),
  id,
  name: name.optional(),
  bus: id,
  source: z.enum(["pv", "battery", "other"]).default("pv"),
  sr_MVA: within(...MVA_RATING, "Rated apparent power in MVA"),
  ur_kV: within(1e-3, KV_MAX, "Rated AC voltage in kV"),
  iMax_pu: positive("Fault current limit in pu of rated current (typically 1.1-1.5)", 100).default(1.2),
  control: z.enum(["grid-following", "grid-forming"]).default("grid-following"),
  kFactor: nonNegative("Reactive current gain: extra reactive current per unit of voltage dip", 100).default(2),
  negSeq: z
    .looseObject({ mode: z.enum(["none", "k-factor"]), k2: nonNegative("Negative-sequence gain", 100).default(2) })
    .default({ mode: "none", k2: 2 }),
  zForming_pu: within(...PU_REACTANCE, "Grid-forming: magnitude of the voltage-source impedance in pu of rating").default(0.15),
  activePower_pu: z.number().min(-1).max(1).default(0.8).describe("Pre-fault active output in pu of rating (load flow)"),
});

export const motorSchema = z.looseObject({
  kind: z.literal("motor"),
  id,
  name: name.optional(),
  bus: id,
  pr_kW: within(1e-3, 1e7, "Rated mechanical power in kW"),
  ur_kV: within(1e-3, KV_MAX, "Rated voltage in kV"),
  eta: z.number().gt(0).max(1).default(0.94),
  cosPhi: z.number().gt(0).max(1).default(0.86),
  ilrIr: within(0.1, 100, "Locked-rotor current in multiples of rated current").default(6),
  rx: nonNegative("R/X of the locked-rotor impedance (IEC 60909-0: 0.42 for LV motor groups)", 100).default(0.42),
  start_s: positive("Starting time in seconds (for the starting curve)", TIME_MAX_S).default(5),
  polePairs: z.number().int().min(1).max(100).optional().describe("Pairs of poles p, for the breaking-current factor q (IEC 60909-0); q = 1 when absent"),
});

export const loadSchema = z.looseObject({
  kind: z.literal("load"),
  id,
  name: name.optional(),
  bus: id,
  p_kW: within(-1e7, 1e7, "Active power in kW"),
  q_kvar: within(-1e7, 1e7, "Reactive power in kvar"),
});

export const switchSchema = z.looseObject({
  kind: z.literal("switch"),
  id,
  name: name.optional(),
  device: z.enum(["breaker", "switch", "disconnector"]).default("breaker"),
  busA: id,
  busB: id,
  closed: z.boolean().default(true),
  tOpen_s: nonNegative("Opening time in seconds", TIME_MAX_S).default(0.05),
});

// ---------- protective devices ----------

export const curveNames = [
  "iec-standard-inverse",
  "iec-very-inverse",
  "iec-extremely-inverse",
  "iec-long-time-inverse",
  "ieee-moderately-inverse",
  "ieee-very-inverse",
  "ieee-extremely-inverse",
  "definite-time",
] as const;
export const curveNameSchema = z.enum(curveNames);
export type CurveName = z.infer<typeof curveNameSchema>;

export const relayFunctionSchema = z.looseObject({
  id,
  ansi: z.enum(["51", "50", "51N", "50N", "51Q", "46", "67", "67N", "51V"]).describe("IEEE C37.2 device number"),
  enabled: z.boolean().default(true),
  quantity: z.enum(["phase", "residual", "negative"]).describe("phase: max phase current; residual: 3I0; negative: I2"),
  curve: curveNameSchema.default("definite-time"),
  pickup_A: within(1e-3, CURRENT_MAX_A, "Pickup in primary amperes"),
  multiplier: within(1e-3, 100, "Time multiplier (IEC TMS) or time dial (IEEE TD)").default(0.1),
  delay_s: nonNegative("Definite-time delay in seconds (definite-time curve or 50 element)", TIME_MAX_S).default(0),
  tMin_s: nonNegative("Minimum response time in seconds", TIME_MAX_S).default(0),
  tMax_s: positive("Maximum response time in seconds", TIME_MAX_S).optional(),
  reset: z.enum(["instantaneous", "ieee"]).default("instantaneous"),
  direction: z.enum(["non-directional", "forward", "reverse"]).default("non-directional"),
  rca_deg: z.number().min(-180).max(180).default(45).describe("Relay characteristic angle: current leads polarising voltage by this much"),
  restraint: z
    .looseObject({ vFull_pu: positive("Voltage above which no restraint applies", 2).default(0.9), kMin: positive("Pickup multiplier at zero voltage", 1).default(0.25) })
    .optional()
    .describe("51V voltage restraint"),
});
export type RelayFunction = z.infer<typeof relayFunctionSchema>;

export const relaySchema = z.looseObject({
  kind: z.literal("relay"),
  id,
  name: name.optional(),
  at: deviceLocationSchema,
  ctPrimary_A: within(1e-3, 1e5, "CT primary rating in A"),
  ctSecondary_A: z.union([z.literal(1), z.literal(5)]).default(1),
  breakerTime_s: nonNegative("Breaker interrupting time added to the relay time", 10).default(0.06),
  breaking_kA: positive("Rated short-circuit breaking current of the breaker the relay trips, kA (duty check; optional)", 1000).optional(),
  making_kA: positive("Rated short-circuit making current (peak) of the breaker the relay trips, kA (duty check; optional)", 3000).optional(),
  functions: z.array(relayFunctionSchema).max(64),
  tolerance: toleranceSchema.default({ pickup_pct: 5, time_pct: 5, time_min_s: 0.02 }),
});

const curvePoint = z.tuple([within(1e-3, CURRENT_MAX_A, "Current in A"), within(1e-6, 1e5, "Time in s")]);
export const fuseCurveSchema = z.discriminatedUnion("kind", [
  z.looseObject({ kind: z.literal("parametric"), family: z.enum(["general-purpose", "fast", "time-delay"]) }),
  z.looseObject({
    kind: z.literal("points"),
    melt: z.array(curvePoint).min(2).max(1000).describe("Minimum melting curve, [A, s] pairs"),
    clear: z.array(curvePoint).min(2).max(1000).describe("Total clearing curve, [A, s] pairs"),
  }),
]);
export type FuseCurve = z.infer<typeof fuseCurveSchema>;

export const fuseSchema = z.looseObject({
  kind: z.literal("fuse"),
  id,
  name: name.optional(),
  at: deviceLocationSchema,
  rating_A: within(1e-3, 1e5, "Fuse rated current in A"),
  breaking_kA: positive("Rated breaking capacity, prospective symmetrical kA (duty check; optional)", 1000).optional(),
  curve: fuseCurveSchema.default({ kind: "parametric", family: "general-purpose" }),
});

export const lvBreakerSchema = z.looseObject({
  kind: z.literal("lvbreaker"),
  id,
  name: name.optional(),
  at: deviceLocationSchema,
  in_A: within(1e-3, 1e5, "Rated current In of the breaker (sensor rating) in A"),
  breaking_kA: positive("Rated short-circuit breaking capacity, kA (duty check; optional)", 1000).optional(),
  making_kA: positive("Rated short-circuit making capacity (peak), kA (duty check; optional)", 3000).optional(),
  longTime: z.looseObject({
    ir_x: z.number().min(0.4).max(1).describe("Long-time pickup Ir as a multiple of In"),
    tr_s: positive("Long-time band: trip time at the reference multiple of Ir", TIME_MAX_S),
    ref_x: within(1, 100, "Reference multiple of Ir for tr_s").default(6),
  }),
  shortTime: z
    .looseObject({
      isd_x: within(1e-3, 1e3, "Short-time pickup Isd as a multiple of Ir"),
      tsd_s: nonNegative("Short-time delay in seconds", TIME_MAX_S),
      i2t: z.boolean().default(false).describe("I^2 t ramp below 10 x Ir"),
    })
    .optional(),
  instantaneous: z.looseObject({ ii_x: within(1e-3, 1e3, "Instantaneous pickup Ii as a multiple of In") }).optional(),
  groundFault: z
    .looseObject({ ig_A: within(1e-3, CURRENT_MAX_A, "Ground-fault pickup in A"), tg_s: nonNegative("Ground-fault delay in s", TIME_MAX_S), i2t: z.boolean().default(false) })
    .optional(),
  clearing_s: nonNegative("Mechanism opening and arcing time added to the trip-unit time", 10).default(0.03),
  tolerance: toleranceSchema.default({ pickup_pct: 10, time_pct: 15, time_min_s: 0.01 }),
});

export const elementSchema = z.discriminatedUnion("kind", [
  busSchema,
  gridSchema,
  transformerSchema,
  lineSchema,
  generatorSchema,
  inverterSchema,
  motorSchema,
  loadSchema,
  switchSchema,
  relaySchema,
  fuseSchema,
  lvBreakerSchema,
]);

export type Bus = z.infer<typeof busSchema>;
export type Grid = z.infer<typeof gridSchema>;
export type Transformer = z.infer<typeof transformerSchema>;
export type Line = z.infer<typeof lineSchema>;
export type Generator = z.infer<typeof generatorSchema>;
export type Inverter = z.infer<typeof inverterSchema>;
export type Motor = z.infer<typeof motorSchema>;
export type Load = z.infer<typeof loadSchema>;
export type Switch = z.infer<typeof switchSchema>;
export type Relay = z.infer<typeof relaySchema>;
export type Fuse = z.infer<typeof fuseSchema>;
export type LvBreaker = z.infer<typeof lvBreakerSchema>;
export type Element = z.infer<typeof elementSchema>;
export type ElementKind = Element["kind"];
export type ProtectiveDevice = Relay | Fuse | LvBreaker;
export type Branch = Transformer | Line;
export type Source = Grid | Generator | Inverter;

// ---------- scenarios, study settings, layout ----------

export const scenarioSchema = z.looseObject({
  id,
  name,
  description: z.string().optional(),
  outOfService: z.array(id).default([]).describe("Element ids switched out in this scenario"),
  switchStates: z.record(z.string(), z.boolean()).default({}).describe("Switch id -> closed, overriding the switch's own state"),
  limits: z.array(z.enum(["max", "min"])).min(1).default(["max", "min"]).describe("Which IEC 60909 calculations to run"),
});
export type Scenario = z.infer<typeof scenarioSchema>;

export const studySettingsSchema = z.looseObject({
  method: z.enum(["iec60909", "classic"]).default("iec60909").describe("IEC 60909-0:2016 or the classic prefault-voltage method"),
  prefault_pu: within(0.5, 1.5, "Classic method: prefault voltage in pu").default(1),
  lvTolerance_pct: z.union([z.literal(6), z.literal(10)]).default(10).describe("LV system voltage tolerance, selects cmax 1.05 or 1.10"),
  inverterModel: z.enum(["iec", "refined"]).default("refined").describe("Inverter infeed used by the protection checks"),
  breakingTime_s: positive("Minimum time delay tmin for the breaking current Ib", 10).default(0.1),
  thermalTime_s: positive("Fault duration Tk for the thermal equivalent current Ith", TIME_MAX_S).default(1),
  conductorEndTemp_C: positive("End-of-fault conductor temperature for minimum currents", 1000).default(160),
  faultR_ohm: nonNegative("Fault resistance in ohm", 1e5).default(0),
  faultX_ohm: nonNegative("Fault reactance in ohm", 1e5).default(0),
});
export type StudySettings = z.infer<typeof studySettingsSchema>;

export const criteriaSchema = z.looseObject({
  cti_s: positive("Coordination time interval between primary and backup", 10).default(0.3),
  ctiDirectActing_s: nonNegative(
    "Interval between two direct-acting LV devices (LV trip units, fuses): their bands already hold operating and clearing time, so a clear space (0 s) suffices",
    10,
  ).default(0),
  primaryMargin: positive("Minimum end-of-zone fault current over pickup, primary zone", 100).default(1.5),
  backupMargin: positive("Minimum end-of-zone fault current over pickup, backup zone", 100).default(1.2),
  loadMargin: positive("Minimum pickup over maximum load current", 100).default(1.25),
  clearingLimit_s: positive("Maximum isolation time for faults in zones whose buses set none (speed check; optional, no limit when absent)", TIME_MAX_S).optional(),
  horizon_s: positive("Clearing timeline horizon in seconds", TIME_MAX_S).default(10),
  // every line gets each point as a fault location of its own: 19 is one every 5 % of the length
  linePoints_pct: z.array(z.number().gt(0).lt(100)).max(MAX_LINE_POINTS).default([10, 50, 90]).describe("Intermediate fault points along lines, percent of length"),
  pairCti: z
    .array(z.looseObject({ primary: id, backup: id, cti_s: positive("CTI for this pair", 10) }))
    .default([]),
});
export type Criteria = z.infer<typeof criteriaSchema>;

export const layoutSchema = z.record(
  z.string(),
  z.looseObject({ x: within(-1e7, 1e7, "Centre x in canvas units"), y: within(-1e7, 1e7, "Centre y in canvas units"), w: positive("Bus bar width", 1e6).optional(), rot: within(-360, 360, "Rotation in degrees").optional() }),
);
export type Layout = z.infer<typeof layoutSchema>;

export const projectSchema = z.looseObject({
  format: z.literal(FORMAT_TAG),
  formatVersion: z.literal(FORMAT_VERSION),
  meta: z.looseObject({
    name: z.string().min(1),
    description: z.string().default(""),
    author: z.string().default(""),
    baseMVA: within(1e-3, 1e5, "Per-unit power base in MVA").default(100),
    frequency_Hz: z.union([z.literal(50), z.literal(60)]).default(50),
  }),
  study: studySettingsSchema.default(() => studySettingsSchema.parse({})),
  criteria: criteriaSchema.default(() => criteriaSchema.parse({})),
  elements: z.array(elementSchema),
  // each scenario is a study of its own (every bus, point and fault type at each limit)
  scenarios: z.array(scenarioSchema).max(MAX_SCENARIOS),
  layout: layoutSchema.default({}),
});
export type Project = z.infer<typeof projectSchema>;

export const PROTECTIVE_KINDS = ["relay", "fuse", "lvbreaker"] as const;
export const SOURCE_KINDS = ["grid", "generator", "inverter"] as const;
export const BRANCH_KINDS = ["transformer", "line"] as const;

export function isProtectiveDevice(e: Element): e is ProtectiveDevice {
  return e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker";
}
export function isBranch(e: Element): e is Branch {
  return e.kind === "transformer" || e.kind === "line";
}
export function isSource(e: Element): e is Source {
  return e.kind === "grid" || e.kind === "generator" || e.kind === "inverter";
}
/** Buses an element connects to, in order (branches: from/HV first). */
export function elementBuses(e: Element): string[] {
  switch (e.kind) {
    case "bus":
      return [e.id];
    case "transformer":
      return [e.hvBus, e.lvBus];
    case "line":
      return [e.fromBus, e.toBus];
    case "switch":
      return [e.busA, e.busB];
    case "relay":
    case "fuse":
    case "lvbreaker":
      return [];
    default:
      return [e.bus];
  }
}
