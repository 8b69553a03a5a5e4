// Selectivity: no device outside the expected isolation trips before the fault is isolated, and between
// each expected device and each of its backups the backup keeps the coordination interval where both
// operate. The interval is judged on the nominal curves against criteria.cti_s (IEEE Std 242 builds the
// CTI from breaker time, overtravel and a margin, so it is not added on top of the tolerance bands); the
// band edges are reported beside it. Two direct-acting LV devices (trip units, fuses) need a clear space
// between their bands (criteria.ctiDirectActing_s). An unwanted trip on current flowing back from a
// healthy path is called sympathetic, and a directional element is the usual remedy.
import { verdictId } from "../keys.ts";
import { pairCti_s } from "../verdicts/selectivity.ts";
import type { Verdict, VerdictStatus } from "../types.ts";
import { fmtA, fmtS, round } from "../verdicts/format.ts";
import { faultNode } from "../faultNode.ts";
import { zoneAcross } from "../operation/zones.ts";
import { deviceWords, named, type JudgeContext, type JudgedCase } from "./judgedCase.ts";

const directActing = (kind: string | undefined): boolean => kind === "lvbreaker" || kind === "fuse";

/** Why an unwanted device tripped, in words, and whether it is a sympathetic trip. */
function mechanism(ctx: JudgeContext, c: JudgedCase, id: string): { sympathetic: boolean; why: string } {
  const device = ctx.devices.get(id)!;
  const element = ctx.elements.get(device.at.element);
  const r = c.responses.get(id);
  if (element && (element.kind === "grid" || element.kind === "generator" || element.kind === "inverter"))
    return { sympathetic: false, why: `disconnects ${named(ctx, element.id)} for a fault outside its zone: loss of generation` };
  const backupOf = c.failures.find((f) => f.plan.devices.includes(id));
  const side = ctx.sides.get(id) ?? "both";
  const faultSide = sideOfFault(ctx, c, id);
  const earthElement = r?.operatingElement === "ground-fault" || (device.kind === "relay" && device.functions.find((f) => f.id === r?.operatingElement)?.quantity === "residual");
  if (earthElement && element?.kind === "transformer") {
    const earthed = device.at.end === "to" ? element.earthingLv : element.earthingHv;
    if (earthed && earthed.kind !== "isolated")
      return { sympathetic: false, why: `its earth-fault element opens ${named(ctx, element.id)}, removing that winding's earth from the faulted system` };
  }
  if (side !== "both" && side !== faultSide)
    return { sympathetic: true, why: `trips on current flowing back to the fault from the healthy side it protects (${fmtA(r?.iPhase_A ?? 0)}); a directional element would restrain it` };
  if (backupOf) {
    const primary = c.plan.devices.filter((d) => ctx.net.deviceEdge.get(d) === backupOf.edge);
    return { sympathetic: false, why: `backup to ${primary.map((p) => named(ctx, p)).join(", ")} trips before it` };
  }
  return { sympathetic: false, why: `is outside the expected isolation` };
}

/** Which side of an unwanted device's location the fault lies on: where the fault's zone is reached from. */
function sideOfFault(ctx: JudgeContext, c: JudgedCase, id: string): "element" | "bus" {
  const edgeIndex = ctx.net.deviceEdge.get(id)!;
  const edge = ctx.net.edges[edgeIndex];
  const zones = ctx.isolation.zones;
  const target = zones.zoneOf.get(faultNode(c.fc.location));
  // walk the zone graph from the element side without crossing the device's own edge
  const start = zones.zoneOf.get(edge.elementKey)!;
  const seen = new Set<number>([start]);
  const queue = [start];
  for (let q = 0; q < queue.length; q++) {
    if (queue[q] === target) return "element";
    for (const e of zones.rim[queue[q]]) {
      if (e === edgeIndex) continue;
      const next = zoneAcross(zones, ctx.net, e, queue[q]);
      if (!seen.has(next)) {
        seen.add(next);
        queue.push(next);
      }
    }
  }
  return "bus";
}

export function judgeSelectivity(ctx: JudgeContext, c: JudgedCase): Verdict[] {
  const out: Verdict[] = [];
  const expectedEdges = new Set(c.plan.edges);
  // unwanted trips: devices not on an edge of the expected isolation
  for (const [id, t] of c.outcome.tripped) {
    const edge = ctx.net.deviceEdge.get(id);
    if (edge !== undefined && expectedEdges.has(edge)) continue;
    const { sympathetic, why } = mechanism(ctx, c, id);
    const r = c.responses.get(id);
    out.push({
      id: verdictId(sympathetic ? "sympathetic" : "selectivity", id, null, c.fc.id),
      kind: sympathetic ? "sympathetic" : "selectivity",
      status: "fail",
      scenario: c.fc.scenario,
      caseId: c.fc.id,
      device: id,
      other: null,
      numbers: { trip_s: round(t), current_A: round(r?.iPhase_A ?? 0, 1), ...(c.outcome.isolated_s !== null ? { isolated_s: round(c.outcome.isolated_s) } : {}) },
      explanation: `${deviceWords(ctx, id, r?.operatingElement ?? null)} trips at ${fmtS(t)} without being in the expected isolation: it ${why}, at ${c.fc.label}`,
    });
  }
  // coordination of each expected device with its backups (the backup's time from the stuck-breaker simulation)
  for (const f of c.failures) {
    for (const p of c.plan.devices) {
      if (ctx.net.deviceEdge.get(p) !== f.edge) continue;
      const tp = c.outcome.tripped.get(p);
      if (tp === undefined) continue;
      for (const b of f.plan.devices) {
        if (c.plan.devices.includes(b)) continue;
        const tb = f.outcome.tripped.get(b);
        if (tb === undefined) continue;
        const pr = c.responses.get(p);
        const br = c.responses.get(b);
        const cti = pairCti_s(ctx.criteria, p, b, ctx.devices);
        const bothDirect = directActing(ctx.devices.get(p)?.kind) && directActing(ctx.devices.get(b)?.kind);
        const nominal = tb - tp;
        const band = br?.tClearMin_s != null && pr?.tClearMax_s != null ? br.tClearMin_s - pr.tClearMax_s : null;
        let status: VerdictStatus;
        let why: string;
        if (bothDirect) {
          const space = band ?? nominal;
          status = space > cti || (cti > 0 && space >= cti) ? "pass" : "fail";
          why = status === "pass" ? `bands clear by ${fmtS(space)}` : `bands overlap or touch (space ${fmtS(space)}${cti > 0 ? ` < ${fmtS(cti)}` : ""})`;
        } else if (nominal >= cti) {
          status = band !== null && band <= 0 ? "warn" : "pass";
          why = `margin ${fmtS(nominal)} >= CTI ${fmtS(cti)}${band !== null ? `; band edges ${band > 0 ? "clear by" : "overlap by"} ${fmtS(Math.abs(band))}` : ""}`;
        } else {
          status = "fail";
          why = `margin ${fmtS(nominal)} < CTI ${fmtS(cti)}`;
        }
        const numbers: Record<string, number> = { margin_s: round(nominal), cti_s: cti, primaryTrip_s: round(tp), backupTrip_s: round(tb) };
        if (band !== null) numbers.bandMargin_s = round(band);
        if (pr) numbers.primaryCurrent_A = round(pr.iPhase_A, 1);
        if (br) numbers.backupCurrent_A = round(br.iPhase_A, 1);
        out.push({
          id: verdictId("selectivity", p, b, c.fc.id),
          kind: "selectivity",
          status,
          scenario: c.fc.scenario,
          caseId: c.fc.id,
          device: b,
          other: p,
          numbers,
          explanation: `${deviceWords(ctx, b, br?.operatingElement ?? null)} backup to ${deviceWords(ctx, p, pr?.operatingElement ?? null)}: ${why} (primary ${fmtS(tp)}, backup ${fmtS(tb)} with the primary's breaker stuck) at ${c.fc.label}`,
        });
      }
    }
  }
  return out;
}
