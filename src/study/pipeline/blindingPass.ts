// Pass 4 of a scenario's study: blinding. A generator or converter that connects inside the zone a device
// must clear (between that device and the fault) feeds the fault in parallel and takes current away from
// the device. Each such case is solved again with the infeed switched out, and the device's answers with
// and without it are compared (verdicts/blinding.ts). Only the locations and devices of the pairs are solved.
import type { Criteria, ProtectiveDevice, Scenario } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import { deviceResponse } from "../deviceResponse.ts";
import { backupDevices } from "../operation/expectedIsolation.ts";
import type { IsolationPlan } from "../operation/expectedIsolation.ts";
import { type ScenarioNetwork } from "../scenarioNetwork.ts";
import type { StudySolver } from "../studySolver.ts";
import type { DeviceResponse, FaultCase, FaultType, Verdict } from "../types.ts";
import { blindingVerdict, infeedsByBus, type BlindingPair } from "../verdicts/blinding.ts";
import type { ProtectionZones } from "../operation/zones.ts";

export interface BlindingCase {
  fc: FaultCase;
  locIndex: number;
  responses: ReadonlyMap<string, DeviceResponse>;
  plan: IsolationPlan;
  failures: IsolationPlan[];
}

/** Infeeds whose terminal bus lies inside the zones of `plan`. */
function infeedsInside(zones: ProtectionZones, plan: IsolationPlan, infeeds: Map<string, string[]>): string[] {
  const inside = new Set(plan.zones);
  const out: string[] = [];
  for (const [bus, sources] of infeeds) {
    const z = zones.zoneOf.get(bus);
    if (z !== undefined && inside.has(z)) out.push(...sources);
  }
  return out;
}

/** The device/infeed pairs of one case: expected devices with the infeeds in the faulted zone, backups with those in the grown zone. */
export function blindingPairsOf(net: ScenarioNetwork, zones: ProtectionZones, c: Pick<BlindingCase, "plan" | "failures">): BlindingPair[] {
  const infeeds = infeedsByBus(net);
  const pairs: BlindingPair[] = [];
  const seen = new Set<string>();
  const add = (device: string, role: BlindingPair["role"], infeed: string) => {
    const key = `${device}\u0000${infeed}`;
    if (seen.has(key)) return;
    seen.add(key);
    pairs.push({ device, role, infeed });
  };
  for (const s of infeedsInside(zones, c.plan, infeeds)) for (const d of c.plan.devices) add(d, "primary", s);
  c.failures.forEach((f) => {
    const backups = backupDevices(c.plan, f);
    if (backups.length === 0) return;
    for (const s of infeedsInside(zones, f, infeeds)) for (const b of backups) add(b, "backup", s);
  });
  return pairs;
}

export async function blindingPass(args: {
  scenario: Scenario;
  net: ScenarioNetwork;
  zones: ProtectionZones;
  cases: BlindingCase[];
  types: readonly FaultType[];
  limit: "max" | "min";
  solver: StudySolver;
  model: DeviceModel;
  criteria: Criteria;
  locations: import("../types.ts").FaultLocation[];
  yieldNow?: () => Promise<void>;
}): Promise<Map<string, Verdict[]>> {
  const { scenario, net, solver, model, criteria } = args;
  const byInfeed = new Map<string, { c: BlindingCase; pair: BlindingPair }[]>();
  for (const c of args.cases)
    for (const pair of blindingPairsOf(net, args.zones, c)) {
      const list = byInfeed.get(pair.infeed) ?? [];
      list.push({ c, pair });
      byInfeed.set(pair.infeed, list);
    }
  const out = new Map<string, Verdict[]>();
  for (const [infeed, items] of byInfeed) {
    const variant: Scenario = { ...scenario, outOfService: [...scenario.outOfService, infeed] };
    // the infeed switched out is its terminal opened: one low-rank update of the scenario's network serves every
    // location and fault type of its pairs (a solver without it builds the variant network)
    const locIdxAll = [...new Set(items.map((x) => x.c.locIndex))].sort((a, b) => a - b);
    const opened = solver.solveOpenedEach
      ? solver.solveOpenedEach(scenario, [{ element: infeed, end: "terminal" }], locIdxAll.map((k) => args.locations[k]), args.types.filter((t) => items.some((x) => x.c.fc.faultType === t)), args.limit)
      : null;
    const openedAt = new Map(locIdxAll.map((k, j) => [k, j] as const));
    for (const type of args.types) {
      const ofType = items.filter((x) => x.c.fc.faultType === type);
      if (ofType.length === 0) continue;
      const locIdx = [...new Set(ofType.map((x) => x.c.locIndex))].sort((a, b) => a - b);
      const position = new Map(locIdx.map((k, j) => [k, j] as const));
      const wanted = [...new Set(ofType.map((x) => x.pair.device))];
      const locs = locIdx.map((k) => args.locations[k]);
      const at = opened
        ? (j: number) => opened(openedAt.get(locIdx[j])!, type)
        : solver.solveEach
          ? solver.solveEach(variant, locs, type, args.limit, wanted)
          : ((s) => (j: number) => s[j])(solver.solveMany(variant, locs, type, args.limit, wanted));
      const snaps = new Map<number, ReturnType<typeof at>>();
      for (const j of [...new Set(ofType.map((x) => position.get(x.c.locIndex)!))].sort((a, b) => a - b)) snaps.set(j, at(j));
      for (const { c, pair } of ofType) {
        const device = net.devices.get(pair.device) as ProtectiveDevice;
        const withInfeed = c.responses.get(device.id) ?? deviceResponse(device, undefined, model);
        const without = deviceResponse(device, snaps.get(position.get(c.locIndex)!)!.readings[device.id], model);
        const v = blindingVerdict(c.fc, pair, withInfeed, without, device, model, criteria);
        const list = out.get(c.fc.id) ?? [];
        list.push(v);
        out.set(c.fc.id, list);
      }
    }
    await args.yieldNow?.();
  }
  return out;
}
