// Sensitivity (dependability): every device of the expected isolation operates within the horizon, and at
// the minimum fault its current is at least criteria.primaryMargin times its pickup (common practice 1.5).
import { verdictId } from "../keys.ts";
import { pickupRatio } from "../pickupRatio.ts";
import type { Verdict, VerdictStatus } from "../types.ts";
import { fmtA, fmtS, fmtX, round } from "../verdicts/format.ts";
import { deviceWords, type JudgeContext, type JudgedCase } from "./judgedCase.ts";

export function judgeSensitivity(ctx: JudgeContext, c: JudgedCase): Verdict[] {
  const out: Verdict[] = [];
  const margin = ctx.criteria.primaryMargin;
  for (const id of c.plan.devices) {
    const device = ctx.devices.get(id)!;
    const r = c.responses.get(id);
    const tripped = c.outcome.tripped.get(id);
    const pr = r ? pickupRatio(r, ctx.model.pickups(device)) : null;
    const numbers: Record<string, number> = { current_A: round(r?.iPhase_A ?? 0, 1) };
    if (pr && pr.quantity !== null) Object.assign(numbers, { ratio: round(pr.ratio, 3), margin, pickup_A: round(pr.pickup_A, 1), measured_A: round(pr.current_A, 1) });
    if (tripped !== undefined) numbers.trip_s = round(tripped);
    let status: VerdictStatus;
    let why: string;
    if (tripped === undefined) {
      const isolated = c.outcome.isolated_s;
      if (isolated !== null) {
        status = "warn";
        why = `does not operate (sees ${fmtA(r?.iPhase_A ?? 0)}); the fault was isolated by others at ${fmtS(isolated)}`;
      } else {
        status = "fail";
        why = `does not operate within ${fmtS(ctx.criteria.horizon_s)} (sees ${fmtA(r?.iPhase_A ?? 0)}${pr?.quantity ? `, ${fmtX(pr.ratio)} pickup ${fmtA(pr.pickup_A)}` : ""})`;
      }
    } else if (c.atSensitivityLimit && pr && pr.quantity !== null && pr.ratio < margin) {
      status = "warn";
      why = `operates at ${fmtS(tripped)} but the minimum fault current ${fmtA(pr.current_A)} is only ${fmtX(pr.ratio)} pickup ${fmtA(pr.pickup_A)} < ${margin}`;
    } else {
      status = "pass";
      why = pr?.quantity ? `operates at ${fmtS(tripped)}; ${fmtA(pr.current_A)} is ${fmtX(pr.ratio)} pickup` : `operates at ${fmtS(tripped)}`;
    }
    out.push({
      id: verdictId("sensitivity", id, null, c.fc.id),
      kind: "sensitivity",
      status,
      scenario: c.fc.scenario,
      caseId: c.fc.id,
      device: id,
      other: null,
      numbers,
      explanation: `${deviceWords(ctx, id, r?.operatingElement ?? null)} expected to isolate: ${why} at ${c.fc.label}`,
    });
  }
  return out;
}
