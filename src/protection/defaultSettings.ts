// Starting settings for a new protective device from the rating of the element it protects, so that
// a new relay on an 11 kV, 1 MVA transformer starts near its 52 A full-load current and a new LV
// breaker on a 280 A cable starts at or below the cable's ampacity. They are a starting point for the
// engineer, who coordinates and confirms them; nothing here replaces that review.
import type { DeviceLocation, Element, Project } from "../model/schema.ts";

/** Standard CT primary currents: IEC 61869-2:2012, 5.201 (10, 12.5, 15, 20, 25, 30, 40, 50, 60, 75 A
 * and their decimal multiples). // from memory */
const CT_PRIMARY_BASE = [10, 12.5, 15, 20, 25, 30, 40, 50, 60, 75];
/** Rated currents of LV breakers (sensor ratings), the R10 series of IEC 60059. // common practice */
const BREAKER_RATINGS_A = [16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 320, 400, 500, 630, 800, 1000, 1250, 1600, 2000, 2500, 3200, 4000, 5000, 6300];
/** Fuse rated currents, IEC 60269-1:2006, 5.3.1. // from memory */
const FUSE_RATINGS_A = [2, 4, 6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250];
/** Phase pickup over the full-load current of a transformer, machine or load (as criteria.loadMargin). // common practice */
export const PICKUP_OVER_RATED = 1.25;
/** CT primary at least this multiple of the full-load current, so the pickup sits inside the CT's range. // common practice */
const CT_OVER_RATED = 1.2;
/** Long-time setting steps of a trip unit (Ir / In). */
const IR_STEP = 0.05;

export interface RatedCurrent {
  /** The protected element's continuous current at the device's end, in A. */
  i_A: number;
  /** What the figure is, for the user: "full-load current of Transformer T1 at 11 kV". */
  what: string;
  /** True for a conductor's ampacity (the device must not exceed it), false for a full-load current. */
  isAmpacity: boolean;
}

const SQRT3 = Math.sqrt(3);

function busVoltage_kV(doc: Project, busId: string): number | undefined {
  const bus = doc.elements.find((e) => e.id === busId);
  return bus?.kind === "bus" ? bus.un_kV : undefined;
}

/** Rated current of the element a device at `at` looks into, or null when it has none (a grid feeder, a switch). */
export function ratedCurrentAt(doc: Project, at: DeviceLocation): RatedCurrent | null {
  const host = doc.elements.find((e) => e.id === at.element);
  if (!host) return null;
  const name = host.name ? `${host.name} (${host.id})` : host.id;
  switch (host.kind) {
    case "transformer": {
      const u_kV = at.end === "to" ? host.urLv_kV : host.urHv_kV;
      return { i_A: (host.sr_MVA * 1000) / (SQRT3 * u_kV), what: `full-load current of ${name} at ${u_kV} kV`, isAmpacity: false };
    }
    case "line":
      return { i_A: host.ampacity_A * host.parallel, what: `ampacity of ${name}`, isAmpacity: true };
    case "generator":
    case "inverter":
      return { i_A: (host.sr_MVA * 1000) / (SQRT3 * host.ur_kV), what: `rated current of ${name}`, isAmpacity: false };
    case "motor":
      return { i_A: host.pr_kW / (SQRT3 * host.ur_kV * host.eta * host.cosPhi), what: `rated current of ${name}`, isAmpacity: false };
    case "load": {
      const u_kV = busVoltage_kV(doc, host.bus);
      if (!u_kV) return null;
      return { i_A: Math.hypot(host.p_kW, host.q_kvar) / (SQRT3 * u_kV), what: `current of ${name} at ${u_kV} kV`, isAmpacity: false };
    }
    default:
      return null;
  }
}

/** Smallest standard CT primary current of at least `a`. */
export function ctPrimaryFor(a: number): number {
  for (let decade = 1; decade < 1e6; decade *= 10) for (const b of CT_PRIMARY_BASE) if (b * decade >= a - 1e-9) return b * decade;
  return Math.ceil(a);
}

/** Rounded up to a setting a person reads easily: whole amperes below 100 A ("66 A"), then steps of
 * half a unit of the second figure ("135 A", "1450 A"). */
function roundUpPickup(a: number): number {
  const step = a < 100 ? 1 : 10 ** (Math.floor(Math.log10(a)) - 1) / 2;
  return Math.ceil(a / step - 1e-9) * step;
}

function largestAtMost(list: readonly number[], a: number): number | undefined {
  return [...list].reverse().find((r) => r <= a + 1e-9);
}
function smallestAtLeast(list: readonly number[], a: number): number | undefined {
  return list.find((r) => r >= a - 1e-9);
}

export interface DefaultSettings {
  /** Fields to set on the new device record. */
  fields: Record<string, unknown>;
  /** Why, in a sentence. */
  basis: string;
}

/** Settings for a new relay, fuse or LV breaker at `at`, or null when the element has no rating to go by. */
export function defaultDeviceSettings(kind: "relay" | "fuse" | "lvbreaker", doc: Project, at: DeviceLocation): DefaultSettings | null {
  const rated = ratedCurrentAt(doc, at);
  if (!rated || !(rated.i_A > 0) || !Number.isFinite(rated.i_A)) return null;
  const i = rated.i_A;
  const figure = `${Number(i.toPrecision(3))} A`;
  if (kind === "relay") {
    // a conductor: pick up at its ampacity; a transformer, machine or load: 1.25 x its full-load current
    const pickup_A = rated.isAmpacity ? Number(i.toPrecision(2)) : roundUpPickup(PICKUP_OVER_RATED * i);
    const ctPrimary_A = ctPrimaryFor(Math.max(CT_OVER_RATED * i, pickup_A));
    return {
      fields: { ctPrimary_A, functions: [{ id: "f1", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A, multiplier: 0.1 }] },
      basis: rated.isAmpacity ? `51 pickup ${pickup_A} A at the ${rated.what} (${figure}); CT ${ctPrimary_A}/1` : `51 pickup ${pickup_A} A = about ${PICKUP_OVER_RATED} x the ${rated.what} (${figure}); CT ${ctPrimary_A}/1`,
    };
  }
  if (kind === "lvbreaker") {
    // a conductor: the largest rating not above its ampacity (IB <= In <= IZ); otherwise the smallest rating
    // carrying the full-load current, with Ir set just above it
    const in_A = rated.isAmpacity ? largestAtMost(BREAKER_RATINGS_A, i) : smallestAtLeast(BREAKER_RATINGS_A, i);
    if (!in_A) return null;
    const ir_x = rated.isAmpacity ? 1 : Math.min(1, Math.max(0.4, Math.ceil(i / in_A / IR_STEP - 1e-9) * IR_STEP));
    const ir = Math.round(ir_x * 100) / 100;
    return {
      fields: { in_A, longTime: { ir_x: ir, tr_s: 10 }, instantaneous: { ii_x: 10 } },
      basis: `In ${in_A} A, Ir ${ir} x In for the ${rated.what} (${figure})`,
    };
  }
  // a fuse on a conductor: I2 = 1.6 In must stay within 1.45 IZ, so In <= 0.9 IZ (IEC 60364-4-43, 433.1)
  const rating_A = rated.isAmpacity ? largestAtMost(FUSE_RATINGS_A, (1.45 / 1.6) * i) : smallestAtLeast(FUSE_RATINGS_A, i);
  if (!rating_A) return null;
  return { fields: { rating_A }, basis: `fuse ${rating_A} A for the ${rated.what} (${figure})` };
}

/** The device record with the rated defaults laid over its generic starting values (unchanged when none apply). */
export function withRatedDefaults<E extends Element>(device: E, doc: Project): { device: E; basis: string | null } {
  if (device.kind !== "relay" && device.kind !== "fuse" && device.kind !== "lvbreaker") return { device, basis: null };
  const d = defaultDeviceSettings(device.kind, doc, device.at);
  if (!d) return { device, basis: null };
  const merged = { ...device, ...d.fields } as Record<string, unknown>;
  if (device.kind === "lvbreaker") merged.longTime = { ...device.longTime, ...(d.fields.longTime as object) };
  if (device.kind === "relay") merged.functions = (d.fields.functions as object[]).map((f, k) => ({ ...device.functions[k], ...f }));
  return { device: merged as E, basis: d.basis };
}
