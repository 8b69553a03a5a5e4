// Public API of the protective-device models (relays, fuses, LV trip units, bands, damage curves, plotting data).
// Everything here is pure: plain data in, plain data out; impossible settings throw SettingsError.
//
// Conventions:
// - currents are primary amperes at the device; sequence currents are positive from the bus into the element
//   the device looks into (forward); voltages are per unit.
// - bands: "min" is the fastest edge (low pickup, short time; fuse melting), "max" the slowest (high pickup,
//   long time; fuse total clearing). A relay's trip_s excludes the breaker; clearing_s includes it.
// - 67 is polarised by -jV1 (quadrature, no memory); 67N by -3V0, falling back to -V2 when |V0| < 0.01 pu.
// - 51V scales its pickup by clamp(|V1| / vFull_pu, kMin, 1).
// - LV long time picks up at 1.15 Ir, kept inside 1.05-1.30 Ir by every band.
// - Parametric fuse families are illustrative formulas of this project (FUSE_FAMILY_NOTE); current limitation
//   is not modelled (FUSE_LET_THROUGH_NOTE).
// - Show PROTECTION_CAUTION wherever these results are shown.
export type {
  Band,
  CurveBand,
  CurvePoint,
  CurveQuantity,
  LvRegion,
  Measurement,
  Message,
  OperatingOptions,
  OperatingResult,
  Phasor,
  Polyline,
  SampleOptions,
  SequenceQuantities,
  Severity,
  TravelState,
} from "./types.ts";

// one steady fault state
export { operatingTime } from "./operatingTime.ts";
export { deviceTimer } from "./deviceTimer.ts";
export type { BandTimes, DeviceTimer } from "./deviceTimer.ts";
export { measurementFromSequence, balancedMeasurement } from "./measurement.ts";
export { directionOf, POLARISING_MIN_PU } from "./directionOf.ts";
export type { Direction, DirectionDecision } from "./directionOf.ts";
export { restraintFactor } from "./relayElements.ts";
export { devicePickups } from "./devicePickups.ts";
export type { DevicePickups } from "./devicePickups.ts";

// a fault whose current changes in steps
export { initialTravel, accumulate, timeToOperate } from "./accumulate.ts";

// curves, inverse, plotting
export { curveTime, curveResetTime, curveMultipleForTime, curveMultiplierForPoint } from "./curveTime.ts";
export { CURVE_CONSTANTS, CURVE_TITLES, curveFamily } from "./curveConstants.ts";
export type { IecConstants, IeeeConstants, InverseCurveName } from "./curveConstants.ts";
export { currentForTime } from "./currentForTime.ts";
export type { InverseOptions } from "./currentForTime.ts";
export { sampleCurve, referScale } from "./sampleCurve.ts";
export { bandPickup, bandTime } from "./tolerance.ts";

// fuses
export { fuseMelt_s, fuseClear_s } from "./fuseElements.ts";
export { FUSE_FAMILY_LAWS, FUSE_FAMILY_TITLES, familyMelt_s, familyClear_s, familyMeltMultiple } from "./fuseFamilies.ts";
export type { FuseFamily, FuseFamilyLaw } from "./fuseFamilies.ts";
export { logLogInterpolate, logLogCurrentForTime } from "./logLogInterpolate.ts";

// LV trip-unit conventions
export { LT_PICKUP_X, LT_NO_TRIP_X, LT_TRIP_X, ST_RAMP_X, GF_RAMP_X } from "./lvBreakerElements.ts";

// settings
export { checkDeviceSettings, TMS_RANGE, TD_RANGE } from "./checkDeviceSettings.ts";
export { SettingsError } from "./settingsError.ts";
export { toSecondary_A, toPrimary_A, toCtMultiple } from "./ctRatio.ts";
export { deviceLabel } from "./deviceLabel.ts";

// damage and reference curves
export { transformerCategory, transformerWithstand, THERMAL_POINTS_PU, CATEGORY_I_K } from "./damage/transformerWithstand.ts";
export type { TransformerCategory, TransformerWithstand, TransformerWithstandInput } from "./damage/transformerWithstand.ts";
export { cableK, cableKFromTemperatures, cableWithstand_s, cableWithstandCurve, insulationTemperatures, IEC60949_MATERIAL, ADIABATIC_LIMIT_S } from "./damage/cableWithstand.ts";
export type { ConductorMaterial, CableInsulation } from "./damage/cableWithstand.ts";
export { inrushPoint, INRUSH_MULTIPLE, INRUSH_DURATION_S } from "./damage/inrushPoint.ts";
export { motorStarting } from "./damage/motorStarting.ts";
export type { MotorStarting, MotorStartingInput } from "./damage/motorStarting.ts";

// templates
export { loadTemplate, loadTemplates, instantiateTemplate, TemplateError, TEMPLATE_FORMAT, TEMPLATE_FORMAT_VERSION } from "./templates.ts";
export type { DeviceTemplate, DeviceBody } from "./templates.ts";

// fixed texts
export { PROTECTION_CAUTION, FUSE_LET_THROUGH_NOTE, FUSE_FAMILY_NOTE } from "./notes.ts";
