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
