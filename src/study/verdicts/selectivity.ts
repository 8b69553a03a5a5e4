// Selectivity: along every chain, the backup must clear at least one CTI after its primary in every case
// where both operate. The tolerance bands are used: the primary's slow edge against the backup's fast edge.
import type { Criteria, ProtectiveDevice } from "../../model/schema.ts";
import type { DeviceResponse, FaultCase, FaultChains, Verdict, VerdictStatus } from "../types.ts";
import { deviceTag, fmtS, round } from "./format.ts";

const directActing = (d: ProtectiveDevice | undefined): boolean => d?.kind === "lvbreaker" || d?.kind === "fuse";

/** The interval a pair must keep: the pair's own override, else a clear space between the bands of two
 * direct-acting LV devices (their curves include operating and clearing time; IEEE Std 242, from memory),
 * else the relay CTI. */
export function pairCti_s(criteria: Criteria, primary: string, backup: string, devices?: ReadonlyMap<string, ProtectiveDevice>): number {
  const own = criteria.pairCti.find((p) => p.primary === primary && p.backup === backup);
  if (own) return own.cti_s;
  if (devices && directActing(devices.get(primary)) && directActing(devices.get(backup))) return criteria.ctiDirectActing_s;
  return criteria.cti_s;
}

export function selectivityVerdicts(
  fc: FaultCase,
  chains: FaultChains,
  responses: ReadonlyMap<string, DeviceResponse>,
  devices: ReadonlyMap<string, ProtectiveDevice>,
  criteria: Criteria,
): Verdict[] {
  const out: Verdict[] = [];
  // pairs already judged, primary and backup side by side (a case has a handful: a scan beats building keys);
  // ids holding ">" compare as the joined "primary>backup" of the verdict id
  const seen: string[] = [];
  const judged = (p: string, b: string): boolean => {
    for (let j = 0; j < seen.length; j += 2) {
      const sp = seen[j];
      const sb = seen[j + 1];
      if (sp === p && sb === b) return true;
      if ((sp.includes(">") || sb.includes(">") || p.includes(">") || b.includes(">")) && `${sp}>${sb}` === `${p}>${b}`) return true;
    }
    return false;
  };
  for (const path of chains.paths) {
    for (let k = 0; k + 1 < path.links.length; k++) {
      const p = responses.get(path.links[k].device)!;
      const b = responses.get(path.links[k + 1].device)!;
      if (p.tClear_s === null || b.tClear_s === null) continue;
      if (judged(p.device, b.device)) continue;
      seen.push(p.device, b.device);
      const cti = pairCti_s(criteria, p.device, b.device, devices);
      const pMax = p.tClearMax_s ?? p.tClear_s;
      const bMin = b.tClearMin_s ?? b.tClear_s;
      const band = bMin - pMax;
      const nominal = b.tClear_s - p.tClear_s;
      let status: VerdictStatus;
      let why: string;
      const bTag = deviceTag(devices.get(b.device), b.device, b.operatingElement);
      const pTag = deviceTag(devices.get(p.device), p.device, p.operatingElement);
      if (nominal < 0) {
        status = "fail";
        why = `backup operates first (${fmtS(b.tClear_s)} before ${fmtS(p.tClear_s)})`;
      } else if (band >= cti && (cti > 0 || band > 0)) {
        status = "pass";
        why = `margin ${fmtS(band)} >= CTI ${fmtS(cti)}`;
      } else if (nominal >= cti) {
        status = "warn";
        why = `margin ${fmtS(band)} < CTI ${fmtS(cti)} across the tolerance bands (nominal curves give ${fmtS(nominal)})`;
      } else {
        status = "fail";
        why = `margin ${fmtS(band)} < CTI ${fmtS(cti)}`;
      }
      out.push({
        id: `selectivity|${p.device}>${b.device}|${fc.id}`,
        kind: "selectivity",
        status,
        scenario: fc.scenario,
        caseId: fc.id,
        device: b.device,
        other: p.device,
        numbers: {
          margin_s: round(band),
          nominalMargin_s: round(nominal),
          cti_s: cti,
          primarySlow_s: round(pMax),
          backupFast_s: round(bMin),
          primaryCurrent_A: round(p.iPhase_A, 1),
          backupCurrent_A: round(b.iPhase_A, 1),
        },
        explanation: `${bTag} backup to ${pTag}: ${why} (primary slow edge ${fmtS(pMax)}, backup fast edge ${fmtS(bMin)}) at ${fc.label}`,
      });
    }
  }
  return out;
}
