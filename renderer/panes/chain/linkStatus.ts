// The colour of a chain step: the worst verdict that names the device in this fault case,
// as the device judged (sensitivity, speed, ...) or as the other device of a pair (selectivity backup).
import type { Verdict } from "../../../src/study/types.ts";
import { worseStatus, type VerdictStatus } from "../shared/verdictStatus.ts";

/** Worst status per device id over `verdicts` of case `caseId` (verdicts of other cases are ignored). */
export function linkStatuses(verdicts: readonly Verdict[], caseId: string): Map<string, VerdictStatus> {
  const out = new Map<string, VerdictStatus>();
  const put = (device: string | null, s: VerdictStatus) => {
    if (!device) return;
    const w = worseStatus(out.get(device) ?? null, s);
    if (w) out.set(device, w);
  };
  for (const v of verdicts) {
    if (v.caseId !== caseId) continue;
    put(v.device, v.status);
    if (v.kind === "selectivity") put(v.other, v.status);
  }
  return out;
}
