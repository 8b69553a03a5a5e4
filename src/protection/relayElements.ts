// Time elements of a relay: one per enabled function.
import type { RelayFunction, Tolerance } from "../model/schema.ts";
import type { Band, Measurement, Relay } from "./types.ts";
import type { GateResult, TimeElement } from "./timeElement.ts";
import { CURVE_TITLES } from "./curveConstants.ts";
import { curveMultipleForTime, curveResetTime, curveTime } from "./curveTime.ts";
import { bandPickup, bandTime } from "./tolerance.ts";
import { directionOf } from "./directionOf.ts";
import { abs } from "./phasor.ts";

/** 51V defaults when the restraint block is absent. // common practice */
const RESTRAINT_DEFAULT = { vFull_pu: 0.9, kMin: 0.25 };

/** 51V pickup multiplier: linear in the restraint voltage |V1|, between kMin and 1. */
export function restraintFactor(fn: Pick<RelayFunction, "restraint">, v_pu: number): number {
  const r = fn.restraint ?? RESTRAINT_DEFAULT;
  return Math.min(1, Math.max(r.kMin, v_pu / r.vFull_pu));
}

function limitTime(fn: RelayFunction, t: number): number {
  if (!Number.isFinite(t)) return t;
  let out = Math.max(t, fn.tMin_s);
  if (fn.tMax_s !== undefined) out = Math.min(out, fn.tMax_s);
  return out;
}

function gateFor(fn: RelayFunction): ((m: Measurement, ignoreDirection: boolean) => GateResult) | undefined {
  const directional = fn.direction !== "non-directional";
  const restrained = fn.ansi === "51V";
  if (!directional && !restrained) return undefined;
  return (m, ignoreDirection) => {
    let pickupScale = 1;
    let note = "";
    if (restrained) {
      if (m.sequence) {
        const v = abs(m.sequence.v1_pu);
        pickupScale = restraintFactor(fn, v);
        note = `restraint |V1| ${v.toFixed(3)} pu scales pickup by ${pickupScale.toFixed(3)}`;
      } else note = "no voltage given: no restraint applied";
    }
    if (directional && !ignoreDirection) {
      if (!m.sequence) return { ok: false, pickupScale, note: "directional: no sequence voltages given" };
      const d = directionOf(fn, m.sequence);
      if (d.direction !== fn.direction) {
        const seen = d.direction === "undetermined" ? "direction undetermined (polarising voltage too small)" : `sees ${d.direction}`;
        return { ok: false, pickupScale, note: `directional ${fn.direction}: ${seen}, ${d.polarisation}` };
      }
      note = [note, `${d.direction} (${d.polarisation}, ${d.angle_deg.toFixed(1)} deg)`].filter(Boolean).join("; ");
    }
    return { ok: true, pickupScale, note };
  };
}

/** `gateFor` without its text: the 51V pickup multiplier, or NaN when the direction blocks the function. */
function gateScaleFor(fn: RelayFunction): ((m: Measurement, ignoreDirection: boolean) => number) | undefined {
  const directional = fn.direction !== "non-directional";
  const restrained = fn.ansi === "51V";
  if (!directional && !restrained) return undefined;
  return (m, ignoreDirection) => {
    const pickupScale = restrained && m.sequence ? restraintFactor(fn, abs(m.sequence.v1_pu)) : 1;
    if (directional && !ignoreDirection && (!m.sequence || directionOf(fn, m.sequence).direction !== fn.direction)) return NaN;
    return pickupScale;
  };
}

export function relayFunctionElement(fn: RelayFunction, tol: Tolerance, breakerTime_s: number): TimeElement {
  const pickup = (band: Band) => bandPickup(fn.pickup_A, tol, band);
  const time_s = (current_A: number, band: Band) => {
    const t = limitTime(fn, curveTime(fn.curve, current_A / pickup(band), fn.multiplier, fn.delay_s));
    return bandTime(t, tol, band);
  };
  return {
    id: fn.id,
    title: `${fn.ansi} ${CURVE_TITLES[fn.curve]}`,
    quantity: fn.quantity,
    pickup_A: pickup,
    time_s,
    reset_s: (current_A, band) => (fn.reset === "ieee" ? curveResetTime(fn.curve, current_A / pickup(band), fn.multiplier) : 0),
    breakpoints_A: (band) => {
      const p = pickup(band);
      const out = [p];
      if (fn.curve !== "definite-time") {
        for (const lim of [fn.tMin_s, fn.tMax_s]) {
          if (lim !== undefined && lim > 0) {
            const m = curveMultipleForTime(fn.curve, lim, fn.multiplier);
            if (Number.isFinite(m) && m > 1) out.push(m * p);
          }
        }
      }
      return out;
    },
    added_s: breakerTime_s,
    gate: gateFor(fn),
    gateScale: gateScaleFor(fn),
  };
}

export function relayElements(relay: Relay): TimeElement[] {
  return relay.functions.filter((f) => f.enabled).map((f) => relayFunctionElement(f, relay.tolerance, relay.breakerTime_s));
}
