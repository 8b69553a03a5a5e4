// Splits every line at the study's fault points into segments joined by point buses, so that a fault
// along a line becomes a bus fault and the engine's all-bus sweep covers line points too. Electrically the
// same network: segments carry the line's per-km impedances over their share of the length. A device at a
// line end moves to the segment at that end; opening it opens that segment.
import type { Element, Line, Project, Scenario } from "../model/schema.ts";
import type { FaultLocation } from "./types.ts";

export interface SplitProject {
  project: Project;
  /** Where a fault location of the original project lies in the split one (a point bus, an end bus, or a point along a segment). */
  locate(loc: FaultLocation): FaultLocation;
  /** The element that now sits at `end` of an original element (a segment for split lines, else itself). */
  endElement(element: string, end: "from" | "to" | "terminal"): string;
  /** A scenario of the original project translated to the split one (out-of-service lines take their segments with them). */
  scenario(s: Scenario): Scenario;
}

export function splitLines(project: Project, points_pct: readonly number[]): SplitProject {
  const points = [...new Set(points_pct.filter((p) => p > 0 && p < 100))].sort((a, b) => a - b);
  const segmentsOf = new Map<string, string[]>();
  const lineEnds = new Map<string, [string, string]>();
  const pointBusesOf = new Map<string, string[]>();
  const elements: Element[] = [];
  const busKv = new Map<string, number>();
  for (const e of project.elements) if (e.kind === "bus") busKv.set(e.id, e.un_kV);
  for (const e of project.elements) {
    if (e.kind !== "line" || points.length === 0) {
      elements.push(e);
      continue;
    }
    const cuts = [0, ...points, 100];
    const buses = [e.fromBus, ...points.map((p) => `${e.id}~${p}`), e.toBus];
    const segs: string[] = [];
    for (const p of points) elements.push({ kind: "bus", id: `${e.id}~${p}`, name: `${e.name ?? e.id} at ${p} %`, un_kV: busKv.get(e.fromBus) ?? 1 });
    for (let k = 0; k + 1 < cuts.length; k++) {
      const seg: Line = { ...e, id: `${e.id}~s${k}`, fromBus: buses[k], toBus: buses[k + 1], length_km: (e.length_km * (cuts[k + 1] - cuts[k])) / 100 };
      segs.push(seg.id);
      elements.push(seg);
    }
    segmentsOf.set(e.id, segs);
    lineEnds.set(e.id, [e.fromBus, e.toBus]);
    pointBusesOf.set(e.id, buses.slice(1, -1));
  }
  const endElement = (element: string, end: "from" | "to" | "terminal"): string => {
    const segs = segmentsOf.get(element);
    if (!segs) return element;
    return end === "to" ? segs[segs.length - 1] : segs[0];
  };
  // devices follow their line end
  const moved = elements.map((e) =>
    (e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker") && segmentsOf.has(e.at.element) ? { ...e, at: { ...e.at, element: endElement(e.at.element, e.at.end) } } : e,
  );
  const scenario = (s: Scenario): Scenario => {
    const out: string[] = [];
    for (const id of s.outOfService) {
      out.push(id);
      for (const x of segmentsOf.get(id) ?? []) out.push(x);
      for (const x of pointBusesOf.get(id) ?? []) out.push(x);
    }
    // a point bus of a line whose end bus is out of service stays energised from the other end, as the line would
    return { ...s, outOfService: out };
  };
  return {
    project: { ...project, elements: moved, scenarios: project.scenarios.map(scenario) },
    locate(loc: FaultLocation): FaultLocation {
      if (loc.kind === "bus") return loc;
      const segs = segmentsOf.get(loc.line);
      if (!segs) return loc;
      const ends = lineEnds.get(loc.line)!;
      if (loc.pct <= 0) return { kind: "bus", bus: ends[0] };
      if (loc.pct >= 100) return { kind: "bus", bus: ends[1] };
      if (points.includes(loc.pct)) return { kind: "bus", bus: `${loc.line}~${loc.pct}` };
      const cuts = [0, ...points, 100];
      const k = cuts.findIndex((c, i) => i + 1 < cuts.length && c < loc.pct && loc.pct < cuts[i + 1]);
      return { kind: "line", line: segs[k], pct: (100 * (loc.pct - cuts[k])) / (cuts[k + 1] - cuts[k]) };
    },
    endElement,
    scenario,
  };
}
