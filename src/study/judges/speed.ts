// Speed: the fault is isolated within the clearing limit of its zone where the user set one (a bus's
// clearingLimit_s, the tightest over the faulted zone; else criteria.clearingLimit_s when the project sets
// it), and before any equipment carrying the fault reaches its withstand (cables' adiabatic I^2 t,
// transformers' through-fault curve), integrated over the simulated states.
import { verdictId } from "../keys.ts";
import type { Verdict, VerdictStatus } from "../types.ts";
import { fmtA, fmtS3 as fmtS, fmtX, round } from "../verdicts/format.ts";
import { named, type JudgeContext, type JudgedCase } from "./judgedCase.ts";

/** The clearing limit of a faulted zone: the tightest bus limit in it, else the project's own; null: none set. */
export function zoneLimit_s(ctx: JudgeContext, zoneBuses: readonly string[]): number | null {
  let limit: number | null = null;
  for (const id of zoneBuses) {
    const b = ctx.elements.get(id);
    if (b?.kind === "bus" && b.clearingLimit_s !== undefined && (limit === null || b.clearingLimit_s < limit)) limit = b.clearingLimit_s;
  }
  return limit ?? ctx.criteria.clearingLimit_s ?? null;
}

export function judgeSpeed(ctx: JudgeContext, c: JudgedCase, zoneBuses: readonly string[]): Verdict[] {
  if (c.plan.edges.length === 0 && c.outcome.tripped.size === 0) return [];
  const limit = zoneLimit_s(ctx, zoneBuses);
  const iso = c.outcome.isolated_s;
  const worst = c.outcome.withstand[0];
  const last = [...c.outcome.steps].reverse().find((s) => s.action === "open" || s.action === "clear");
  const device = last?.device ?? c.plan.devices[0] ?? "";
  const numbers: Record<string, number> = { current_A: round(c.iFault_A, 1) };
  if (iso !== null) numbers.isolated_s = round(iso);
  if (limit !== null) numbers.limit_s = limit;
  if (worst) numbers.withstandUsed = round(worst.used, 3);
  let status: VerdictStatus;
  let why: string;
  if (iso === null) {
    status = "fail";
    why = `not isolated within ${fmtS(ctx.criteria.horizon_s)}`;
  } else if (worst && worst.used >= 1) {
    status = "fail";
    why = `isolated at ${fmtS(iso)}, but ${named(ctx, worst.element)} carries ${fmtA(worst.peak_A)} for ${fmtX(worst.used)} its withstand`;
  } else if (limit !== null && iso > limit) {
    status = "fail";
    why = `isolated at ${fmtS(iso)} > zone limit ${fmtS(limit)}`;
  } else {
    status = "pass";
    why = `isolated at ${fmtS(iso)}${limit !== null ? ` <= zone limit ${fmtS(limit)}` : ""}${worst ? `; largest withstand use ${(100 * worst.used).toFixed(0)} % (${named(ctx, worst.element)})` : ""}`;
  }
  return [
    {
      id: verdictId("speed", "zone", null, c.fc.id),
      kind: "speed",
      status,
      scenario: c.fc.scenario,
      caseId: c.fc.id,
      device,
      other: null,
      numbers,
      explanation: `Isolation: ${why}, at ${c.fc.label}`,
    },
  ];
}
