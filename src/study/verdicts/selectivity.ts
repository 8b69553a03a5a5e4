// The coordination interval a primary/backup pair must keep (judges/selectivity.ts applies it).
import type { Criteria, ProtectiveDevice } from "../../model/schema.ts";

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
