// Turns the engine's fault result into what the one-line draws: I"k at the fault, the smallest
// phase voltage of each bus, and for each element the largest phase current with its direction.
import type { FaultResult } from "../../src/engine/index.ts";
import type { Project } from "../../src/model/schema.ts";
import type { FaultOverlay, BranchFlow } from "./overlayTypes.ts";
import type { CaseResult } from "../../src/study/types.ts";

const MIN_FLOW_A = 0.5; // below this a flow is numerical noise, not worth an arrow

export function toOverlay(project: Project, result: FaultResult, caseResult: CaseResult | null): FaultOverlay {
  const busVoltages_pu: Record<string, number> = {};
  const v1: Record<string, number> = {};
  for (const b of result.buses) {
    busVoltages_pu[b.bus] = Math.min(...b.phase_pu.map((p) => p.mag));
    v1[b.bus] = b.seq_pu[1].mag;
  }
  const flows: Record<string, BranchFlow> = {};
  const ends = new Map<string, { from?: number; to?: number; fromBus?: string; toBus?: string }>();
  for (const end of result.branchEnds) {
    const i = Math.max(...end.phase_A.map((p) => p.mag));
    const rec = ends.get(end.element) ?? {};
    if (end.end === "from") {
      rec.from = i;
      rec.fromBus = end.bus;
    } else {
      rec.to = i;
      rec.toBus = end.bus;
    }
    ends.set(end.element, rec);
  }
  for (const [id, rec] of ends) {
    const i_A = Math.max(rec.from ?? 0, rec.to ?? 0);
    if (i_A < MIN_FLOW_A) continue;
    // fault current flows from the end whose voltage held up better towards the fault
    const va = rec.fromBus !== undefined ? (v1[rec.fromBus] ?? 0) : 0;
    const vb = rec.toBus !== undefined ? (v1[rec.toBus] ?? 0) : 0;
    flows[id] = { i_A: rec.from ?? i_A, towards: va >= vb ? "b" : "a" };
  }
  for (const s of result.shunts) {
    const i_A = Math.max(...s.phase_A.map((p) => p.mag));
    if (i_A >= MIN_FLOW_A) flows[s.element] = { i_A, towards: "a" };
  }
  const devices: FaultOverlay["devices"] = {};
  for (const r of caseResult?.responses ?? []) devices[r.device] = { role: r.role, tClear_s: r.tClear_s };
  const at = result.location.kind === "bus" ? result.location.bus : result.location.line;
  const el = project.elements.find((e) => e.id === at);
  const where = result.location.kind === "bus" ? `bus ${el?.name || at}` : `${el?.name || at} at ${result.location.pct} %`;
  return { at, label: `${result.faultType} fault on ${where}`, faultType: result.faultType, ikss_kA: result.ikss_kA, busVoltages_pu, flows, devices };
}
