// Disk-travel model for a fault whose current changes in steps: each element travels
// d(travel) = dt / t(I) towards operation at travel 1, and resets while the current is below pickup
// (instantaneously, by the IEEE C37.112 reset law, or never for a fuse).
import type { Measurement, OperatingOptions, OperatingResult, ProtectiveDevice, TravelState } from "./types.ts";
import { deviceElements } from "./deviceElements.ts";
import { elementTimings } from "./operatingTime.ts";
import { deviceLabel } from "./deviceLabel.ts";

const CLEAR_SUFFIX = "/clear";

/** The state before the fault: nothing travelled. */
export function initialTravel(): TravelState {
  return { travel: {}, elapsed_s: 0 };
}

function step(travel: number, t_s: number, reset_s: number, picked: boolean, dt_s: number): number {
  if (picked) return t_s <= 0 ? 1 : travel + dt_s / t_s;
  if (reset_s === 0) return 0;
  if (!Number.isFinite(reset_s)) return travel;
  return Math.max(0, travel - dt_s / reset_s);
}

/** Advance the state by dt_s with the measurement held constant over the step. */
export function accumulate(state: TravelState, device: ProtectiveDevice, m: Measurement, dt_s: number, opts: OperatingOptions = {}): TravelState {
  if (!(dt_s >= 0)) throw new RangeError(`${deviceLabel(device)}: accumulate step dt_s must be >= 0 (got ${dt_s})`);
  const band = opts.band ?? "nominal";
  const travel: Record<string, number> = { ...state.travel };
  let operated = state.operated;
  for (const t of elementTimings(deviceElements(device), m, opts)) {
    const el = t.element;
    const picked = Number.isFinite(t.trip_s);
    const before = travel[el.id] ?? 0;
    // a blocked directional element resets as if no current flowed (torque reversed or withheld)
    const reset = el.reset_s(t.blocked ? 0 : t.effective_A, band);
    const after = step(before, t.trip_s, reset, picked, dt_s);
    travel[el.id] = after;
    if (el.clear_s) {
      const key = el.id + CLEAR_SUFFIX;
      travel[key] = step(travel[key] ?? 0, t.clearing_s, reset, picked, dt_s);
    }
    if (picked && after >= 1 && before < 1) {
      const at_s = state.elapsed_s + Math.min(dt_s, (1 - before) * t.trip_s);
      if (!operated || at_s < operated.at_s) operated = { functionId: el.id, at_s };
    }
  }
  return operated ? { travel, elapsed_s: state.elapsed_s + dt_s, operated } : { travel, elapsed_s: state.elapsed_s + dt_s };
}

/** Time still needed to operate from `state` if the measurement stays as it is. */
export function timeToOperate(state: TravelState, device: ProtectiveDevice, m: Measurement, opts: OperatingOptions = {}): OperatingResult {
  const label = deviceLabel(device);
  if (state.operated) {
    return { picked: true, trip_s: 0, clearing_s: 0, functionId: state.operated.functionId, reason: `${label} already operated (${state.operated.functionId}) at ${state.operated.at_s} s` };
  }
  let best: OperatingResult | undefined;
  for (const t of elementTimings(deviceElements(device), m, opts)) {
    if (!Number.isFinite(t.trip_s)) continue;
    const el = t.element;
    const left = Math.max(0, 1 - (state.travel[el.id] ?? 0));
    const trip_s = left * t.trip_s;
    const clearing_s = el.clear_s ? Math.max(trip_s, Math.max(0, 1 - (state.travel[el.id + CLEAR_SUFFIX] ?? 0)) * t.clearing_s) : trip_s + el.added_s;
    if (!best || trip_s < best.trip_s) {
      best = { picked: true, trip_s, clearing_s, functionId: el.id, reason: `${el.title} (${el.id}) has ${(100 * (1 - left)).toFixed(1)} % travel, operates in ${Number(trip_s.toPrecision(4))} s more` };
    }
  }
  return best ?? { picked: false, trip_s: Infinity, clearing_s: Infinity, reason: `${label} does not pick up at this current` };
}
