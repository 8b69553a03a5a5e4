// The fault table: I"k per bus and fault type, ip and X/R, for every scenario and every IEC 60909 limit the
// scenario asks for. Read from the engine's all-bus sweep (the same engine the study uses).
import type { Project } from "../model/schema.ts";
import { compileNetwork, sweepFaults, EngineFailure, FAULT_TYPES, type FaultType, type Limit } from "../engine/index.ts";

export interface FaultRow {
  scenario: string;
  scenarioName: string;
  limit: Limit;
  bus: string;
  busName: string;
  un_kV: number;
  /** I"k in kA per fault type, as the engine defines it (3ph symmetrical, LL line current, LG and LLG earth current 3I0). */
  ikss_kA: Record<FaultType, number>;
  /** Peak short-circuit current and X/R at the fault, three-phase basis. */
  ip_kA: number;
  xr: number;
}

export interface FaultTable {
  rows: FaultRow[];
  /** Engine messages worth a reader's attention (compile errors, dead buses), naming the element. */
  messages: string[];
}

export function faultTable(project: Project): FaultTable {
  const rows: FaultRow[] = [];
  const messages: string[] = [];
  const buses = project.elements.filter((e) => e.kind === "bus");
  for (const scenario of project.scenarios) {
    const inService = buses.filter((b) => !scenario.outOfService.includes(b.id));
    for (const limit of scenario.limits) {
      const compiled = compileNetwork(project, { scenario: scenario.id, limit });
      if (!compiled.ok) {
        for (const e of compiled.errors) messages.push(`Scenario ${scenario.id} "${scenario.name}" (${limit}): ${e.text}`);
        continue;
      }
      let sweep: ReturnType<typeof sweepFaults>;
      try {
        sweep = sweepFaults(compiled.network, { types: [...FAULT_TYPES], buses: inService.map((b) => b.id), devices: [] });
      } catch (err) {
        // a network the engine could not solve gets no rows (never zeros), only the message naming the buses
        if (!(err instanceof EngineFailure)) throw err;
        messages.push(`Scenario ${scenario.id} "${scenario.name}" (${limit}): ${err.message}`);
        continue;
      }
      for (const m of sweep.messages)
        if (m.level !== "info") messages.push(`Scenario ${scenario.id} "${scenario.name}" (${limit}): ${m.text}`);
      const T = sweep.types.length;
      sweep.busIds.forEach((id, b) => {
        const bus = inService.find((x) => x.id === id)!;
        const ikss = {} as Record<FaultType, number>;
        sweep.types.forEach((t, k) => (ikss[t] = sweep.ikss_kA[b * T + k]));
        rows.push({
          scenario: scenario.id,
          scenarioName: scenario.name,
          limit,
          bus: id,
          busName: bus.name ?? "",
          un_kV: bus.un_kV,
          ikss_kA: ikss,
          ip_kA: sweep.ip_kA[b],
          xr: sweep.xr[b],
        });
      });
    }
  }
  return { rows, messages: [...new Set(messages)] };
}
