// Duty: a breaker's rated breaking current against the breaking current Ib at its bus, and its rated making
// current against the peak ip (IEC 60909-0:2016, 4.3.1 and 4.3.1.2: Ib and ip are what a breaker breaks and
// makes; IEC 62271-100 and IEC 60947-2 rate them so, from memory); a fuse's breaking capacity against the
// prospective I"k (a fuse interrupts within the first half cycle). The largest over the four fault types at the
// maximum limit; only ratings the project gives are judged.
import { deviceBus } from "../../model/deviceBus.ts";
import type { Element, ProtectiveDevice, Scenario } from "../../model/schema.ts";
import { verdictId } from "../keys.ts";
import type { StudySolver } from "../studySolver.ts";
import type { Verdict, VerdictStatus } from "../types.ts";
import { round } from "../verdicts/format.ts";

const kA = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} kA`;

export function judgeDuty(scenario: Scenario, devices: ReadonlyMap<string, ProtectiveDevice>, elements: ReadonlyMap<string, Element>, solver: StudySolver): { verdicts: Verdict[]; warnings: string[] } {
  const verdicts: Verdict[] = [];
  const warnings: string[] = [];
  for (const d of devices.values()) {
    const breaking = d.breaking_kA;
    const making = d.kind === "fuse" ? undefined : d.making_kA;
    if (breaking === undefined && making === undefined) continue;
    const bus = deviceBus(d, elements);
    const name = d.name ? `${d.id} "${d.name}"` : d.id;
    const duty = bus && solver.busDuty ? solver.busDuty(scenario, bus) : null;
    if (!duty) {
      warnings.push(`${name}: the short-circuit duty at its bus could not be computed in ${scenario.name}; its ratings were not checked`);
      continue;
    }
    const needBreak_kA = d.kind === "fuse" ? duty.ikss_kA : duty.ib_kA;
    const numbers: Record<string, number> = {};
    const parts: string[] = [];
    let status: VerdictStatus = "pass";
    if (breaking !== undefined) {
      numbers.breaking_kA = breaking;
      numbers[d.kind === "fuse" ? "ikss_kA" : "ib_kA"] = round(needBreak_kA, 3);
      const ok = breaking >= needBreak_kA;
      if (!ok) status = "fail";
      parts.push(`breaking ${kA(breaking)} ${ok ? ">=" : "<"} ${d.kind === "fuse" ? 'I"k' : "Ib"} ${kA(needBreak_kA)}`);
    }
    if (making !== undefined) {
      numbers.making_kA = making;
      numbers.ip_kA = round(duty.ip_kA, 3);
      const ok = making >= duty.ip_kA;
      if (!ok) status = "fail";
      parts.push(`making ${kA(making)} ${ok ? ">=" : "<"} ip ${kA(duty.ip_kA)}`);
    }
    verdicts.push({
      id: verdictId("duty", d.id, null, scenario.id),
      kind: "duty",
      status,
      scenario: scenario.id,
      caseId: null,
      device: d.id,
      other: null,
      numbers,
      explanation: `${name} at bus ${bus}: ${parts.join(", ")} (largest over the fault types at the maximum limit, ${scenario.name})`,
    });
  }
  return { verdicts, warnings };
}
