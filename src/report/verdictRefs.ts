// Short references for verdicts, numbered within their status in study order: F-0001, W-0001, P-0001.
import type { Verdict, VerdictStatus } from "../study/types.ts";

const PREFIX: Record<VerdictStatus, string> = { fail: "F", warn: "W", pass: "P" };

export function verdictRefs(verdicts: readonly Verdict[]): Map<string, string> {
  const counters: Record<VerdictStatus, number> = { fail: 0, warn: 0, pass: 0 };
  const refs = new Map<string, string>();
  for (const v of verdicts) refs.set(v.id, `${PREFIX[v.status]}-${String(++counters[v.status]).padStart(4, "0")}`);
  return refs;
}
