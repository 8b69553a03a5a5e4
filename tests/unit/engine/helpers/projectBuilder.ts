// Builds small projects for engine tests through the real schema (so defaults apply as in a loaded file).
import { projectSchema, type Project } from "../../../../src/model/schema.ts";

export type RawElement = Record<string, unknown> & { kind: string; id: string };

export function buildProject(elements: RawElement[], study: Record<string, unknown> = {}, scenarios: Record<string, unknown>[] = [], baseMVA = 100): Project {
  return projectSchema.parse({
    format: "islet-project",
    formatVersion: 1,
    meta: { name: "engine test", baseMVA, frequency_Hz: 50 },
    study,
    elements,
    scenarios,
  });
}

export const bus = (id: string, un_kV: number): RawElement => ({ kind: "bus", id, name: id, un_kV });

import type { Phasor } from "../../../../src/engine/index.ts";
export const toRect = (p: Phasor) => ({ re: p.mag * Math.cos((p.ang_deg * Math.PI) / 180), im: p.mag * Math.sin((p.ang_deg * Math.PI) / 180) });

/** Wraps an angle difference into (-180, 180]. */
export function wrapDeg(a: number): number {
  let x = a % 360;
  if (x <= -180) x += 360;
  if (x > 180) x -= 360;
  return x;
}
