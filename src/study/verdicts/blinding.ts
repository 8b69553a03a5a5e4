// Blinding: a generator or inverter connected between a device and the fault (inside the zone the device
// must clear) feeds the fault in parallel and takes current away from that device. The same case is solved
// with and without the infeed (pipeline/blindingPass.ts); the verdict flags a device whose current falls
// below its pickup margin, or whose time grows by more than the CTI budget, because of that infeed.
import type { Criteria, ProtectiveDevice } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import { pickupRatio } from "../pickupRatio.ts";
import { busNode, type ScenarioNetwork } from "../scenarioNetwork.ts";
import type { DeviceResponse, FaultCase, Verdict, VerdictStatus } from "../types.ts";
import { deviceTag, fmtA, fmtS, fmtX, round } from "./format.ts";

export interface BlindingPair {
  device: string;
  role: "primary" | "backup";
  /** The infeed (generator or inverter) between the device and the fault. */
  infeed: string;
}

/** Generators and inverters of the scenario, by the bus they connect to. */
export function infeedsByBus(net: ScenarioNetwork): Map<string, string[]> {
  const map = new Map<string, string[]>();
  for (const s of net.sources) {
    const e = net.elements.get(s);
    if (e?.kind !== "generator" && e?.kind !== "inverter") continue;
    const list = map.get(busNode(e.bus)) ?? [];
    list.push(s);
    map.set(busNode(e.bus), list);
  }
  return map;
}

export function blindingVerdict(
  fc: FaultCase,
  pair: BlindingPair,
  withInfeed: DeviceResponse,
  without: DeviceResponse,
  device: ProtectiveDevice,
  model: DeviceModel,
  criteria: Criteria,
): Verdict {
  const margin = pair.role === "primary" ? criteria.primaryMargin : criteria.backupMargin;
  const pickups = model.pickups(device);
  const rw = pickupRatio(withInfeed, pickups);
  const ro = pickupRatio(without, pickups);
  const tw = withInfeed.tClear_s;
  const to = without.tClear_s;
  const tag = deviceTag(device, device.id, withInfeed.operatingElement ?? without.operatingElement);
  let status: VerdictStatus = "pass";
  let why = `current ${fmtA(rw.current_A)} with ${pair.infeed}, ${fmtA(ro.current_A)} without; time ${fmtS(tw)} with, ${fmtS(to)} without`;
  if (rw.ratio < margin && ro.ratio >= margin) {
    status = "fail";
    why = `current falls to ${fmtA(rw.current_A)} (${fmtX(rw.ratio)} pickup < ${margin}) with ${pair.infeed} feeding, from ${fmtA(ro.current_A)} (${fmtX(ro.ratio)}) without`;
  } else if (to !== null && tw === null) {
    status = "fail";
    why = `operates in ${fmtS(to)} without ${pair.infeed} but not at all with it feeding (${fmtA(rw.current_A)})`;
  } else if (to !== null && tw !== null && tw - to > criteria.cti_s) {
    status = "warn";
    why = `time grows from ${fmtS(to)} to ${fmtS(tw)} with ${pair.infeed} feeding (+${fmtS(tw - to)} > CTI ${fmtS(criteria.cti_s)})`;
  }
  const numbers: Record<string, number> = {
    currentWith_A: round(rw.current_A, 1),
    currentWithout_A: round(ro.current_A, 1),
    ratioWith: round(rw.ratio, 3),
    ratioWithout: round(ro.ratio, 3),
    margin,
  };
  if (tw !== null) numbers.tClearWith_s = round(tw);
  if (to !== null) numbers.tClearWithout_s = round(to);
  return {
    id: `blinding|${device.id}|${pair.infeed}|${fc.id}`,
    kind: "blinding",
    status,
    scenario: fc.scenario,
    caseId: fc.id,
    device: device.id,
    other: pair.infeed,
    numbers,
    explanation: `${tag} ${pair.role} upstream of ${pair.infeed}: ${why} at ${fc.label}`,
  };
}
