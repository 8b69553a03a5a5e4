// The phase-domain reference at a fault location as the engine names it: a bus, or a point along a line. A point
// along a line is a bus fault on the line cut in two at that point (the cut is a new bus "<id>#F"); the result is
// reported back under the line's id (its from half's from end and its to half's to end), without the cut's own bus.
import type { Project } from "../../../../src/model/schema.ts";
import { phaseDomainFault, type PhaseFaultType, type PhaseModelOptions, type PhaseSolution } from "./phaseDomainFault.ts";

export type FaultAt = { kind: "bus"; bus: string } | { kind: "line"; line: string; pct: number };

function splitLineProject(project: Project, lineId: string, pct: number): Project {
  const elements = project.elements.flatMap((e) => {
    if (e.id !== lineId || e.kind !== "line") return [e];
    const from = project.elements.find((b) => b.id === e.fromBus && b.kind === "bus") as { un_kV: number };
    const f = pct / 100;
    return [
      { kind: "bus" as const, id: `${lineId}#F`, name: "fault point", un_kV: from.un_kV },
      { ...e, id: `${lineId}#a`, toBus: `${lineId}#F`, length_km: e.length_km * f },
      { ...e, id: `${lineId}#b`, fromBus: `${lineId}#F`, length_km: e.length_km * (1 - f) },
    ];
  });
  return { ...project, elements };
}

export function phaseDomainAt(project: Project, at: FaultAt, type: PhaseFaultType, zf_ohm: { re: number; im: number }, options: Partial<PhaseModelOptions>): PhaseSolution {
  if (at.kind === "bus") return phaseDomainFault(project, { bus: at.bus, type, zf_ohm }, options);
  const s = phaseDomainFault(splitLineProject(project, at.line, at.pct), { bus: `${at.line}#F`, type, zf_ohm }, options);
  s.busVoltage_pu.delete(`${at.line}#F`);
  const ends = s.ends
    .filter((e) => !(e.element === `${at.line}#a` && e.end === "to") && !(e.element === `${at.line}#b` && e.end === "from"))
    .map((e) => (e.element.startsWith(`${at.line}#`) ? { ...e, element: at.line } : e));
  return { ...s, ends };
}
