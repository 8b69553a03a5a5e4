// Study settings resolved into the options every result records.
import { studySettingsSchema, type Project } from "../../model/schema.ts";
import type { Limit, Method, ResolvedOptions } from "../types.ts";

export function resolveOptions(project: Project, limit: Limit, method?: Method): ResolvedOptions {
  // Projects from the loader carry defaults; parse again so hand-built documents get them too.
  const s = studySettingsSchema.parse(project.study ?? {});
  const m = method ?? s.method;
  return {
    method: m,
    limit,
    inverterModel: s.inverterModel,
    prefault_pu: m === "classic" ? s.prefault_pu : 1,
    lvTolerance_pct: s.lvTolerance_pct,
    breakingTime_s: s.breakingTime_s,
    thermalTime_s: s.thermalTime_s,
    conductorEndTemp_C: s.conductorEndTemp_C,
    faultR_ohm: s.faultR_ohm,
    faultX_ohm: s.faultX_ohm,
    baseMVA: project.meta.baseMVA ?? 100,
    frequency_Hz: project.meta.frequency_Hz ?? 50,
  };
}
