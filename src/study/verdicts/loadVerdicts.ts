// Pickups against load: a device's phase pickup (a fuse's rated current) against the largest load-flow current
// through it, with criteria.loadMargin (common practice 1.25). Sensitivity to faults is judged per case
// (judges/sensitivity.ts).
import type { Criteria, ProtectiveDevice, Scenario } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import { verdictId } from "../keys.ts";
import type { Verdict, VerdictStatus } from "../types.ts";
import { deviceTag, fmtA, fmtX, round } from "./format.ts";

/** Phase pickup (fuse: rated current) against the largest load current from the load flow. */
export function loadVerdicts(
  scenario: Scenario,
  load_A: Record<string, number>,
  devices: ReadonlyMap<string, ProtectiveDevice>,
  model: DeviceModel,
  criteria: Criteria,
): Verdict[] {
  const out: Verdict[] = [];
  for (const [id, iLoad] of Object.entries(load_A)) {
    const device = devices.get(id);
    if (!device || !(iLoad > 0)) continue;
    const pickup = device.kind === "fuse" ? device.rating_A : model.pickups(device).overload_A;
    if (pickup === null) continue;
    const ratio = pickup / iLoad;
    const status: VerdictStatus = ratio >= criteria.loadMargin ? "pass" : ratio >= 1 ? "warn" : "fail";
    const what = device.kind === "fuse" ? "rated current" : "phase pickup";
    out.push({
      id: verdictId("load", id, null, scenario.id),
      kind: "load",
      status,
      scenario: scenario.id,
      caseId: null,
      device: id,
      other: null,
      numbers: { ratio: round(ratio, 3), margin: criteria.loadMargin, load_A: round(iLoad, 1), pickup_A: round(pickup, 1) },
      explanation: `${deviceTag(device, id)} against load: ${what} ${fmtA(pickup)} is ${fmtX(ratio)} the load-flow current ${fmtA(iLoad)} ${ratio >= criteria.loadMargin ? ">=" : "<"} ${criteria.loadMargin} (${scenario.name})`,
    });
  }
  return out;
}
