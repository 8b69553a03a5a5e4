// Sensitivity: a device's pickup against the smallest fault current it sees at the end of its primary
// zone (the cases where it is the first device on a source path) and of its backup zone (where it is
// the second), with margins criteria.primaryMargin and criteria.backupMargin (common practice 1.5 / 1.2);
// and its phase pickup against the largest load current (criteria.loadMargin, common practice 1.25).
import type { Criteria, ProtectiveDevice, Scenario } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import { pickupRatio } from "../pickupRatio.ts";
import type { DeviceResponse, FaultCase, Verdict, VerdictStatus } from "../types.ts";
import { deviceTag, fmtA, fmtX, round } from "./format.ts";

export interface ZoneObservation {
  device: string;
  role: "primary" | "backup";
  response: DeviceResponse;
  faultCase: FaultCase;
}

/** Keeps, per device and role, the observation with the lowest pickup ratio. */
export class ZoneMinimum {
  private readonly worst = new Map<string, { obs: ZoneObservation; ratio: number }>();
  constructor(
    private readonly devices: ReadonlyMap<string, ProtectiveDevice>,
    private readonly model: DeviceModel,
  ) {}
  add(obs: ZoneObservation): void {
    const device = this.devices.get(obs.device);
    if (!device) return;
    const ratio = pickupRatio(obs.response, this.model.pickups(device)).ratio;
    const key = `${obs.device}|${obs.role}`;
    const prev = this.worst.get(key);
    if (!prev || ratio < prev.ratio) this.worst.set(key, { obs, ratio });
  }
  observations(): ZoneObservation[] {
    return [...this.worst.values()].map((w) => w.obs);
  }
}

export function sensitivityVerdicts(
  scenario: Scenario,
  observations: ZoneObservation[],
  devices: ReadonlyMap<string, ProtectiveDevice>,
  model: DeviceModel,
  criteria: Criteria,
): Verdict[] {
  const out: Verdict[] = [];
  for (const obs of observations) {
    const device = devices.get(obs.device)!;
    const pr = pickupRatio(obs.response, model.pickups(device));
    if (pr.quantity === null) continue;
    const margin = obs.role === "primary" ? criteria.primaryMargin : criteria.backupMargin;
    const status: VerdictStatus = pr.ratio >= margin ? "pass" : pr.ratio >= 1 ? "warn" : "fail";
    const cmp = pr.ratio >= margin ? ">=" : "<";
    const q = pr.quantity === "phase" ? "" : pr.quantity === "residual" ? " 3I0" : " I2";
    out.push({
      id: `sensitivity|${obs.device}|${obs.role}|${scenario.id}`,
      kind: "sensitivity",
      status,
      scenario: scenario.id,
      caseId: obs.faultCase.id,
      device: obs.device,
      other: null,
      numbers: { ratio: round(pr.ratio, 3), margin, current_A: round(pr.current_A, 1), pickup_A: round(pr.pickup_A, 1) },
      explanation: `${deviceTag(device, obs.device)} ${obs.role} zone: minimum fault current${q} ${fmtA(pr.current_A)} is ${fmtX(pr.ratio)} pickup ${fmtA(pr.pickup_A)} ${cmp} ${margin} at ${obs.faultCase.label}`,
    });
  }
  return out;
}

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
      id: `load|${id}|${scenario.id}`,
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
