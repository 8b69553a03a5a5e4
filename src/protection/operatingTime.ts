// When a device operates for one steady fault state: the fastest enabled function or region that picks up.
import type { Measurement, OperatingOptions, OperatingResult, ProtectiveDevice } from "./types.ts";
import type { TimeElement } from "./timeElement.ts";
import { measuredCurrent } from "./timeElement.ts";
import { deviceElements } from "./deviceElements.ts";
import { deviceLabel } from "./deviceLabel.ts";

export interface ElementTiming {
  element: TimeElement;
  /** Measured magnitude divided by the 51V pickup scale: the current the curve is read at. */
  effective_A: number;
  /** 51V pickup multiplier applied (1 otherwise). */
  pickupScale: number;
  trip_s: number;
  clearing_s: number;
  note: string;
  blocked: boolean;
}

/** Timing of each element for a measurement (Infinity when it does not pick up or is blocked). */
export function elementTimings(elements: readonly TimeElement[], m: Measurement, opts: OperatingOptions = {}): ElementTiming[] {
  const band = opts.band ?? "nominal";
  return elements.map((element) => {
    const gate = element.gate?.(m, opts.ignoreDirection ?? false) ?? { ok: true, pickupScale: 1, note: "" };
    const effective_A = measuredCurrent(m, element.quantity) / gate.pickupScale;
    const pickupScale = gate.pickupScale;
    if (!gate.ok) return { element, effective_A, pickupScale, trip_s: Infinity, clearing_s: Infinity, note: gate.note, blocked: true };
    const trip_s = element.time_s(effective_A, band);
    const clearing_s = !Number.isFinite(trip_s) ? Infinity : element.clear_s ? element.clear_s(effective_A, band) : trip_s + element.added_s;
    return { element, effective_A, pickupScale, trip_s, clearing_s: Math.max(clearing_s, trip_s), note: gate.note, blocked: false };
  });
}

/** Four significant digits; plain arithmetic because toPrecision dominated the cost of a study sweep. */
function fmt(x: number): string {
  if (!Number.isFinite(x)) return "never";
  if (x === 0) return "0";
  const scale = Math.pow(10, 3 - Math.floor(Math.log10(Math.abs(x))));
  return String(Math.round(x * scale) / scale);
}

const clearText = (c: number) => (Number.isFinite(c) ? `clears in ${fmt(c)} s` : "total clearing not assured at this current");

/** Relay: min over enabled functions; fuse: melting (trip) and total clearing; LV breaker: min over regions. */
export function operatingTime(device: ProtectiveDevice, m: Measurement, opts: OperatingOptions = {}): OperatingResult {
  const timings = elementTimings(deviceElements(device), m, opts);
  let best: ElementTiming | undefined;
  for (const t of timings) if (Number.isFinite(t.trip_s) && (!best || t.trip_s < best.trip_s)) best = t;
  if (!best) {
    const blocked = timings.filter((t) => t.blocked && t.effective_A >= t.element.pickup_A(opts.band ?? "nominal"));
    const why = blocked.length > 0 ? blocked.map((t) => `${t.element.id} blocked: ${t.note}`).join("; ") : "current below every pickup";
    return { picked: false, trip_s: Infinity, clearing_s: Infinity, reason: `${deviceLabel(device)} does not operate: ${why}` };
  }
  const el = best.element;
  const extra = best.note ? `; ${best.note}` : "";
  return {
    picked: true,
    trip_s: best.trip_s,
    clearing_s: best.clearing_s,
    functionId: el.id,
    reason: `${el.title} (${el.id}) operates at ${fmt(best.effective_A * best.pickupScale)} A against pickup ${fmt(el.pickup_A(opts.band ?? "nominal") * best.pickupScale)} A in ${fmt(best.trip_s)} s, ${clearText(best.clearing_s)}${extra}`,
  };
}
