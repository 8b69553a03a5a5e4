// Small builders for test devices; they go through the document schemas so defaults are the real ones.
import { fuseSchema, lvBreakerSchema, relaySchema } from "../../../src/model/schema.ts";
import type { Fuse, LvBreaker, Relay } from "../../../src/protection/types.ts";

const at = { element: "L1", end: "from" as const };

export function relay(functions: Record<string, unknown>[], extra: Record<string, unknown> = {}): Relay {
  return relaySchema.parse({ kind: "relay", id: "R1", name: "Dock feeder", at, ctPrimary_A: 400, functions, ...extra });
}

export function fn51(extra: Record<string, unknown> = {}): Record<string, unknown> {
  return { id: "F51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 100, multiplier: 0.1, ...extra };
}

export function breaker(extra: Record<string, unknown> = {}): LvBreaker {
  return lvBreakerSchema.parse({
    kind: "lvbreaker",
    id: "Q1",
    name: "Main incomer",
    at,
    in_A: 630,
    longTime: { ir_x: 1, tr_s: 10, ref_x: 6 },
    shortTime: { isd_x: 6, tsd_s: 0.2, i2t: false },
    instantaneous: { ii_x: 12 },
    ...extra,
  });
}

export function fuse(curve?: Record<string, unknown>, rating_A = 100): Fuse {
  return fuseSchema.parse({ kind: "fuse", id: "FU1", name: "Pump fuse", at, rating_A, ...(curve ? { curve } : {}) });
}
