// Speed: each primary device must clear within the limit set for the faulted bus (bus.clearingLimit_s,
// else criteria.clearingLimit_s) and before the element it looks into exceeds its withstand.
import type { Criteria, Element, ProtectiveDevice } from "../../model/schema.ts";
import type { DeviceResponse, FaultCase, FaultChains, Verdict, VerdictStatus } from "../types.ts";
import { withstand_s, type WithstandFn } from "../withstand.ts";
import { deviceTag, fmtA, fmtS3 as fmtS, round } from "./format.ts";

/** The clearing limit for a fault location: the bus's own limit, for a line the tighter of its end buses'. */
export function clearingLimit_s(fc: FaultCase, elements: ReadonlyMap<string, Element>, criteria: Criteria): number {
  const busLimit = (id: string): number | undefined => {
    const b = elements.get(id);
    return b?.kind === "bus" ? b.clearingLimit_s : undefined;
  };
  if (fc.location.kind === "bus") return busLimit(fc.location.bus) ?? criteria.clearingLimit_s;
  const line = elements.get(fc.location.line);
  if (line?.kind !== "line") return criteria.clearingLimit_s;
  const limits = [busLimit(line.fromBus), busLimit(line.toBus)].filter((x): x is number => x !== undefined);
  return limits.length > 0 ? Math.min(...limits) : criteria.clearingLimit_s;
}

export function speedVerdicts(
  fc: FaultCase,
  chains: FaultChains,
  responses: ReadonlyMap<string, DeviceResponse>,
  elements: ReadonlyMap<string, Element>,
  criteria: Criteria,
  selfCeasing: (source: string) => boolean = () => false,
  withstand: WithstandFn = withstand_s,
): Verdict[] {
  const out: Verdict[] = [];
  const limit = clearingLimit_s(fc, elements, criteria);
  const seen = new Set<string>();
  for (const path of chains.paths) {
    const first = path.links[0];
    if (!first || seen.has(first.device)) continue;
    seen.add(first.device);
    const r = responses.get(first.device)!;
    const device = elements.get(r.device) as ProtectiveDevice;
    const tag = deviceTag(device, r.device, r.operatingElement);
    const element = elements.get(device.at.element);
    const limitOfElement = r.iPhase_A > 0 ? withstand(element, device.at.end, r.iPhase_A) : Infinity;
    const bound = Math.min(limit, limitOfElement);
    const boundText = limitOfElement < limit ? `withstand of ${device.at.element} ${fmtS(limitOfElement)} at ${fmtA(r.iPhase_A)}` : `limit ${fmtS(limit)}`;
    let status: VerdictStatus;
    let why: string;
    if (r.tClear_s === null && selfCeasing(path.source)) {
      status = "warn";
      why = `does not operate (sees ${fmtA(r.iPhase_A)}); the path relies on ${path.source}'s own protection to cease energising`;
    } else if (r.tClear_s === null) {
      status = "fail";
      why = `does not operate (sees ${fmtA(r.iPhase_A)})`;
    } else if ((r.tClearMax_s ?? r.tClear_s) <= bound) {
      status = "pass";
      why = `clears in ${fmtS(r.tClear_s)} <= ${boundText}`;
    } else if (r.tClear_s <= bound) {
      status = "warn";
      why = `clears in ${fmtS(r.tClear_s)}, slow edge ${fmtS(r.tClearMax_s)} > ${boundText}`;
    } else {
      status = "fail";
      why = `clears in ${fmtS(r.tClear_s)} > ${boundText}`;
    }
    const numbers: Record<string, number> = { current_A: round(r.iPhase_A, 1), limit_s: limit };
    if (r.tClear_s !== null) numbers.tClear_s = round(r.tClear_s);
    if (r.tClearMax_s !== null) numbers.tClearSlow_s = round(r.tClearMax_s);
    if (Number.isFinite(limitOfElement)) numbers.withstand_s = round(limitOfElement);
    out.push({
      id: `speed|${r.device}|${fc.id}`,
      kind: "speed",
      status,
      scenario: fc.scenario,
      caseId: fc.id,
      device: r.device,
      other: null,
      numbers,
      explanation: `${tag} primary for ${path.sourceName || path.source}: ${why} at ${fc.label}`,
    });
  }
  return out;
}
