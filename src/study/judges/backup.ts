// Backup: for each device of the expected isolation, its breaker stuck: the backups (the zone grown past
// it) must isolate the fault within the horizon and before any equipment carrying the fault reaches its
// withstand; the verdict says what the failure costs in load. A backup that carries less than
// BACKUP_SHARE of the fault current is not judged on its margin (it cannot be expected to see the fault).
import { verdictId } from "../keys.ts";
import { pickupRatio } from "../pickupRatio.ts";
import type { Verdict, VerdictStatus } from "../types.ts";
import { fmtA, fmtS, fmtX, round } from "../verdicts/format.ts";
import { deviceWords, named, type JudgeContext, type JudgedCase } from "./judgedCase.ts";

/** Share of the fault current below which a backup's pickup margin is not judged. // common practice (our choice) */
export const BACKUP_SHARE = 0.05;

/** Device bus voltage over the fault's, to compare the device's current with the fault current on one base. */
function voltageRatio(ctx: JudgeContext, device: string, c: JudgedCase): number {
  const kv = (bus: string | undefined): number | undefined => {
    const b = bus === undefined ? undefined : ctx.elements.get(bus);
    return b?.kind === "bus" ? b.un_kV : undefined;
  };
  const edge = ctx.net.deviceEdge.get(device);
  const atDevice = kv(edge === undefined ? undefined : ctx.net.edges[edge].bus);
  const loc = c.fc.location;
  const line = loc.kind === "line" ? ctx.elements.get(loc.line) : undefined;
  const atFault = kv(loc.kind === "bus" ? loc.bus : line?.kind === "line" ? line.fromBus : undefined);
  return atDevice && atFault ? atDevice / atFault : 1;
}

export function judgeBackup(ctx: JudgeContext, c: JudgedCase, loadLost_kW: (openEdges: readonly number[]) => number): Verdict[] {
  const out: Verdict[] = [];
  for (const f of c.failures) {
    const primaries = c.plan.devices.filter((d) => ctx.net.deviceEdge.get(d) === f.edge);
    if (primaries.length === 0) continue;
    const p = primaries[0];
    const backups = f.plan.devices.filter((d) => !c.plan.devices.includes(d));
    const iso = f.outcome.isolated_s;
    const worst = f.outcome.withstand[0];
    const lost = loadLost_kW(f.outcome.openEdges);
    const numbers: Record<string, number> = { loadLost_kW: round(lost, 1) };
    if (iso !== null) numbers.isolated_s = round(iso);
    if (worst) numbers.withstandUsed = round(worst.used, 3);
    let status: VerdictStatus;
    let why: string;
    const opened = f.outcome.steps.filter((s) => s.action === "open" || s.action === "clear").map((s) => named(ctx, s.device));
    if (backups.length === 0 && f.plan.outOfReach.length > 0) {
      status = "warn";
      why = `no device of the project backs it up: ${f.plan.outOfReach.map((s) => named(ctx, s)).join(", ")} can only be disconnected upstream (the utility's or the source's own protection)`;
    } else if (iso === null) {
      status = "fail";
      why = `the fault is not isolated within ${fmtS(ctx.criteria.horizon_s)}${opened.length ? ` (only ${opened.join(", ")} opened)` : " (nothing opens)"}`;
    } else if (worst && worst.used >= 1) {
      status = "fail";
      why = `isolated at ${fmtS(iso)} by ${opened.join(", ")}, but ${named(ctx, worst.element)} reaches its withstand first (${fmtA(worst.peak_A)}, ${fmtX(worst.used)} its withstand)`;
    } else {
      status = "pass";
      why = `isolated at ${fmtS(iso)} by ${opened.join(", ") || "the sources' disconnection"}; ${lost.toFixed(0)} kW lost`;
    }
    // backup margin at the minimum fault, for backups that carry a real share of it
    if (c.atSensitivityLimit)
      for (const b of backups) {
        const r = c.responses.get(b);
        if (!r || !(c.iFault_A > 0) || r.iPhase_A * voltageRatio(ctx, b, c) < BACKUP_SHARE * c.iFault_A) continue;
        const pr = pickupRatio(r, ctx.model.pickups(ctx.devices.get(b)!));
        if (pr.quantity === null) continue;
        if (numbers.backupRatio === undefined || pr.ratio < numbers.backupRatio) {
          numbers.backupRatio = round(pr.ratio, 3);
          numbers.backupMargin = ctx.criteria.backupMargin;
        }
        if (pr.ratio < ctx.criteria.backupMargin) {
          if (status === "pass") status = "warn";
          why += `; ${named(ctx, b)} sees only ${fmtX(pr.ratio)} its pickup ${fmtA(pr.pickup_A)} (< ${ctx.criteria.backupMargin})`;
        }
      }
    out.push({
      id: verdictId("backup", p, null, c.fc.id),
      kind: "backup",
      status,
      scenario: c.fc.scenario,
      caseId: c.fc.id,
      device: p,
      other: backups[0] ?? null,
      numbers,
      explanation: `${deviceWords(ctx, p)} stuck: ${why}, at ${c.fc.label}`,
    });
  }
  return out;
}
