// `islet check --json` as JSON Lines: one object a line, written as the study produces each scenario, so the
// output is never one giant string and a large network's study need not be held whole. Line types:
// header, case, verdict, warning, summary (README.md, section "islet check output"). A change to a line's
// meaning raises CHECK_LINES_VERSION.
import type { CaseResult, Verdict, VerdictKind, VerdictStatus } from "../../study/types.ts";
import { VERDICT_KINDS } from "../../study/types.ts";

/** Version of the line format; the header carries it. */
export const CHECK_LINES_VERSION = 2;

const r4 = (x: number | null): number | null => (x === null || !Number.isFinite(x) ? x : Math.round(x * 1e4) / 1e4);

export function headerLine(file: string, project: string, caution: string): object {
  return { type: "header", format: "islet-check", formatVersion: CHECK_LINES_VERSION, file, project, caution };
}

export function caseLine(c: CaseResult): object {
  const fc = c.faultCase;
  const o = c.operation;
  return {
    type: "case",
    id: fc.id,
    scenario: fc.scenario,
    location: fc.location,
    faultType: fc.faultType,
    limit: fc.limit,
    label: fc.label,
    // a case the engine could not solve carries no current
    iFault_A: c.unsolved ? null : r4(c.iFault_A),
    zoneBuses: o.zoneBuses,
    ideal: o.ideal,
    backups: o.backups,
    restrained: o.restrained,
    outOfReach: o.outOfReach,
    selfCeasing: o.selfCeasing,
    operations: o.operations.map((s) => ({ device: s.device, t_s: r4(s.t_s), action: s.action, element: s.element })),
    isolated_s: r4(o.isolated_s),
    unwanted: o.unwanted,
    loadLost_kW: o.loadLost_kW,
    idealLoadLost_kW: o.idealLoadLost_kW,
    withstand: o.withstand,
    failures: o.failures.map((f) => ({ device: f.device, backups: f.backups, operations: f.operations.map((s) => ({ device: s.device, t_s: r4(s.t_s), action: s.action, element: s.element })), isolated_s: r4(f.isolated_s), loadLost_kW: f.loadLost_kW })),
    devices: c.responses.map((r) => ({
      device: r.device,
      role: r.role,
      current_A: r4(r.iPhase_A),
      residual_A: r4(r.iResidual_A),
      negative_A: r4(r.iNegative_A),
      direction: r.direction,
      pickedUp: r.pickedUp,
      operatingElement: r.operatingElement,
      tOperate_s: r4(r.tOperate_s),
      tClear_s: r4(r.tClear_s),
    })),
    verdicts: c.verdictIds,
  };
}

export function verdictLine(v: Verdict): object {
  return { type: "verdict", ...v };
}

/** Counts of the verdicts streamed so far, by kind and status. */
export class VerdictTally {
  readonly totals = Object.fromEntries(VERDICT_KINDS.map((k) => [k, { pass: 0, warn: 0, fail: 0 }])) as Record<VerdictKind, Record<VerdictStatus, number>>;
  cases = 0;
  verdicts = 0;
  add(vs: readonly Verdict[]): void {
    for (const v of vs) {
      this.totals[v.kind][v.status]++;
      this.verdicts++;
    }
  }
  get failed(): number {
    return VERDICT_KINDS.reduce((n, k) => n + this.totals[k].fail, 0);
  }
  get warned(): number {
    return VERDICT_KINDS.reduce((n, k) => n + this.totals[k].warn, 0);
  }
}

export function summaryLine(t: VerdictTally, warnings: number): object {
  return { type: "summary", ok: t.failed === 0, cases: t.cases, verdicts: t.verdicts, failed: t.failed, warned: t.warned, warnings, totals: t.totals };
}
