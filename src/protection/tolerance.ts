// Tolerance bands: a pickup moves by +/- pickup_pct, a time by +/- max(time_pct of it, time_min_s).
import type { Tolerance } from "../model/schema.ts";
import type { Band } from "./types.ts";

/** Pickup on a band: min band picks up lower (operates sooner), max band higher. */
export function bandPickup(pickup_A: number, tol: Tolerance, band: Band): number {
  if (band === "nominal") return pickup_A;
  const f = tol.pickup_pct / 100;
  return band === "min" ? pickup_A * (1 - f) : pickup_A * (1 + f);
}

/** Time on a band; never below 0, Infinity stays Infinity. */
export function bandTime(t_s: number, tol: Tolerance, band: Band): number {
  if (band === "nominal" || !Number.isFinite(t_s)) return t_s;
  const dt = Math.max((t_s * tol.time_pct) / 100, tol.time_min_s);
  return band === "min" ? Math.max(0, t_s - dt) : t_s + dt;
}
