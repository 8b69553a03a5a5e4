// Wraps a list of element records (defaults filled by the schema) into a one-scenario project for the reference tests.
import { projectSchema, type Project } from "../../../../src/model/schema.ts";

export function miniProject(elements: Array<Record<string, unknown>>, study: Record<string, unknown> = {}, scenario: Record<string, unknown> = {}): Project {
  return projectSchema.parse({
    format: "islet-project",
    formatVersion: 1,
    meta: { name: "phase-domain reference", baseMVA: 100, frequency_Hz: 50 },
    study: { method: "classic", prefault_pu: 1, faultR_ohm: 0, faultX_ohm: 0, ...study },
    elements,
    scenarios: [{ id: "s", name: "as drawn", ...scenario }],
  });
}
