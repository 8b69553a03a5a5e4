// Sympathetic tripping: a device on no source path into the fault (or on one only as a healthy feeder
// carrying a downstream source's infeed) that sees reverse current above pickup and would operate before
// the fault is cleared. A directional element that blocks the reverse current clears the verdict.
import type { Criteria, ProtectiveDevice } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import { pickupRatio } from "../pickupRatio.ts";
import type { DeviceResponse, FaultCase, FaultChains, Verdict, VerdictStatus } from "../types.ts";
import { deviceTag, fmtA, fmtS, fmtX, round } from "./format.ts";

/** When the fault is cleared: every source path opened by its fastest operating device; Infinity if one never opens. */
export function faultClearedAt_s(chains: FaultChains, responses: ReadonlyMap<string, DeviceResponse>): number {
  let latest = 0;
  for (const path of chains.paths) {
    let first = Infinity;
    for (const l of path.links) {
      const t = responses.get(l.device)?.tClear_s;
      if (t !== null && t !== undefined && t < first) first = t;
    }
    latest = Math.max(latest, first);
  }
  return latest;
}

export function sympatheticVerdicts(
  fc: FaultCase,
  chains: FaultChains,
  candidates: Iterable<string>,
  responses: ReadonlyMap<string, DeviceResponse>,
  devices: ReadonlyMap<string, ProtectiveDevice>,
  model: DeviceModel,
  criteria: Criteria,
): Verdict[] {
  const out: Verdict[] = [];
  const cleared = faultClearedAt_s(chains, responses);
  for (const id of candidates) {
    const r = responses.get(id);
    const device = devices.get(id);
    if (!r || !device || r.direction === "forward") continue;
    const pr = pickupRatio(r, model.pickups(device));
    if (pr.ratio < 1) continue;
    const tag = deviceTag(device, id, r.operatingElement);
    const sees = `sees reverse ${fmtA(pr.current_A)} (${fmtX(pr.ratio)} pickup)`;
    let status: VerdictStatus;
    let why: string;
    if (r.tClear_s === null) {
      status = "pass";
      why = `${sees} but does not operate (blocked by its directional element)`;
    } else {
      const fast = r.tClearMin_s ?? r.tClear_s;
      if (fast < cleared) {
        status = "fail";
        why = `${sees} and trips in ${fmtS(fast)} before the fault is cleared at ${Number.isFinite(cleared) ? fmtS(cleared) : "no time (never)"}; consider a directional element (67/67N)`;
      } else if (fast < cleared + criteria.cti_s) {
        status = "warn";
        why = `${sees}; trips in ${fmtS(fast)}, less than CTI ${fmtS(criteria.cti_s)} after the fault is cleared at ${fmtS(cleared)}; consider a directional element (67/67N)`;
      } else {
        status = "pass";
        why = `${sees}; trips in ${fmtS(fast)}, after the fault is cleared at ${fmtS(cleared)}`;
      }
    }
    const numbers: Record<string, number> = { current_A: round(pr.current_A, 1), pickup_A: round(pr.pickup_A, 1), ratio: round(pr.ratio, 3) };
    if (r.tClear_s !== null) numbers.tClearFast_s = round(r.tClearMin_s ?? r.tClear_s);
    if (Number.isFinite(cleared)) numbers.faultCleared_s = round(cleared);
    out.push({
      id: `sympathetic|${id}|${fc.id}`,
      kind: "sympathetic",
      status,
      scenario: fc.scenario,
      caseId: fc.id,
      device: id,
      other: null,
      numbers,
      explanation: `${tag} on a healthy feeder: ${why} at ${fc.label}`,
    });
  }
  return out;
}
