// Power station units (IEC 60909-0:2016, 6.7): a generator with its own step-up transformer is corrected as one unit.
// For faults outside the unit both impedances carry K_S (on-load tap changer) or K_SO (without), so that the unit
// seen from its HV side is Z_S = K_S (t_r^2 Z_G + Z_THV). For a fault between generator and transformer (the LV
// node) the generator carries K_G,S / K_G,SO and the transformer, feeding from the network, K_T,S / K_T,SO.
//
// Per scenario a unit is formed when the generator, its unit transformer and their buses are in service. Checked:
// the transformer exists and is a transformer, no other generator names it, its LV bus is the generator's node
// (buses joined by closed switches count as one), and the LV side reaches neither the HV node nor any other source
// (grid feeder, generator, inverter) except through the unit transformer: only auxiliaries (motors, loads, the
// branches feeding them) may hang off it.
import { isSource, type Element, type Generator, type Project, type Transformer } from "../../model/schema.ts";
import { elementLabel } from "../../model/elementLabel.ts";
import type { EngineMessage } from "../types.ts";
import { unitGeneratorK, unitKS, unitKSO, unitTransformerK } from "../iec60909/factors.ts";
import { transformerXT } from "./transformerStamp.ts";

export interface UnitPlan {
  generator: Generator;
  /** The unit transformer as stamped: with an on-load tap changer the rated ratio is used (tap dropped). */
  transformer: Transformer;
  lvNode: number;
  /** Factor on both impedances for faults outside the unit (null: classic method, no correction). */
  kOutside: number | null;
  /** In-unit factors for a fault at the LV node (null: classic method). */
  kGenInside: number | null;
  kTrInside: number | null;
}

export interface UnitScan {
  byGenerator: Map<string, UnitPlan>;
  byTransformer: Map<string, UnitPlan>;
  errors: EngineMessage[];
  messages: EngineMessage[];
}

export interface UnitScanInput {
  project: Project;
  out: ReadonlySet<string>;
  busNode: ReadonlyMap<string, number>;
  nodeUn_kV: (node: number) => number;
  /** cmax at a voltage level for the IEC method, null for the classic method. */
  cmaxOf: (un_kV: number) => number | null;
}

function invalid(text: string, element: string): EngineMessage {
  return { level: "error", code: "invalid-input", text, element };
}

/** Finds, checks and sizes every power station unit of one scenario. */
export function powerStationUnits(inp: UnitScanInput): UnitScan {
  const { project, out, busNode } = inp;
  const scan: UnitScan = { byGenerator: new Map(), byTransformer: new Map(), errors: [], messages: [] };
  const withUnit = project.elements.filter((e): e is Generator => e.kind === "generator" && e.unit !== undefined);
  if (withUnit.length === 0) return scan;

  const byId = new Map<string, Element>();
  for (const e of project.elements) if (!byId.has(e.id)) byId.set(e.id, e);
  const nodeOf = (bus: string) => (out.has(bus) ? undefined : busNode.get(bus));
  // Node adjacency over in-service branches, and the sources at each node.
  const adj = new Map<number, { node: number; element: string }[]>();
  const link = (a: number, b: number, element: string) => {
    if (!adj.has(a)) adj.set(a, []);
    adj.get(a)!.push({ node: b, element });
  };
  const sourcesAt = new Map<number, Element[]>();
  for (const e of project.elements) {
    if (out.has(e.id)) continue;
    if (e.kind === "line" || e.kind === "transformer") {
      const a = nodeOf(e.kind === "line" ? e.fromBus : e.hvBus);
      const b = nodeOf(e.kind === "line" ? e.toBus : e.lvBus);
      if (a === undefined || b === undefined) continue;
      link(a, b, e.id);
      link(b, a, e.id);
    } else if (isSource(e)) {
      const n = nodeOf(e.bus);
      if (n === undefined) continue;
      if (!sourcesAt.has(n)) sourcesAt.set(n, []);
      sourcesAt.get(n)!.push(e);
    }
  }

  const claimedBy = new Map<string, Generator>();
  for (const g of withUnit) {
    const unit = g.unit!;
    const gLabel = elementLabel(g);
    const gNode = nodeOf(g.bus);
    if (out.has(g.id) || gNode === undefined) continue;
    const tr = byId.get(unit.transformer);
    if (!tr || tr.kind !== "transformer") {
      const what = tr ? `names ${elementLabel(tr)}, not a transformer` : "names no element in the project";
      scan.errors.push(invalid(`${gLabel}: unit.transformer "${unit.transformer}" ${what}`, g.id));
      continue;
    }
    const trLabel = elementLabel(tr);
    const first = claimedBy.get(tr.id);
    if (first) {
      scan.errors.push(invalid(`${gLabel}: unit.transformer ${trLabel} is already the unit transformer of ${elementLabel(first)}; a power station unit has one generator`, g.id));
      continue;
    }
    claimedBy.set(tr.id, g);
    const hv = nodeOf(tr.hvBus);
    const lv = nodeOf(tr.lvBus);
    if (out.has(tr.id) || hv === undefined || lv === undefined) {
      scan.messages.push({ level: "info", code: "unit-incomplete", text: `${gLabel}: unit transformer ${trLabel} is out of service in this scenario; the generator is corrected with KG alone`, element: g.id });
      continue;
    }
    if (lv !== gNode) {
      scan.errors.push(invalid(`${gLabel}: unit.transformer ${trLabel} has its LV bus ${tr.lvBus} apart from the generator's bus ${g.bus} in this scenario; a unit transformer's LV side is the generator's bus`, g.id));
      continue;
    }
    const problem = lvSideProblem(lv, hv, tr.id, g.id, adj, sourcesAt);
    if (problem) {
      scan.errors.push(invalid(`${gLabel}: unit.transformer ${trLabel}: ${problem}`, g.id));
      continue;
    }
    const plan = sizeUnit(g, tr, lv, inp.nodeUn_kV(hv), inp.nodeUn_kV(lv), inp.cmaxOf(inp.nodeUn_kV(hv)), inp.cmaxOf(inp.nodeUn_kV(lv)));
    if (unit.onLoadTap !== false && tr.tap_pct !== 0) {
      scan.messages.push({
        level: "info",
        code: "unit-tap",
        text: `${trLabel}: tap_pct ${tr.tap_pct} is not used; the unit transformer of ${gLabel} has an on-load tap changer, so its rated ratio applies (IEC 60909-0:2016, 6.7.1)`,
        element: tr.id,
      });
    }
    scan.byGenerator.set(g.id, plan);
    scan.byTransformer.set(tr.id, plan);
  }
  return scan;
}

/** What is wrong with the unit's LV side, if anything: it may feed only auxiliaries. */
function lvSideProblem(
  lv: number,
  hv: number,
  trId: string,
  genId: string,
  adj: Map<number, { node: number; element: string }[]>,
  sourcesAt: Map<number, Element[]>,
): string | null {
  const seen = new Set<number>([lv]);
  const stack = [lv];
  while (stack.length) {
    const u = stack.pop()!;
    for (const s of sourcesAt.get(u) ?? []) {
      if (s.id !== genId) return `${elementLabel(s)} also feeds the unit's LV side; only auxiliaries (motors, loads) may hang off a power station unit's LV side`;
    }
    for (const e of adj.get(u) ?? []) {
      if (e.element === trId || seen.has(e.node)) continue;
      if (e.node === hv) return `the generator's bus reaches the HV side through ${e.element} as well as through the unit transformer`;
      seen.add(e.node);
      stack.push(e.node);
    }
  }
  return null;
}

function sizeUnit(g: Generator, tr: Transformer, lvNode: number, unHv_kV: number, unLv_kV: number, cmaxHv: number | null, cmaxLv: number | null): UnitPlan {
  const unit = g.unit!;
  // Read as the schema's defaults would fill them: an edited document may carry the group before they apply.
  const oltc = unit.onLoadTap !== false;
  const transformer = oltc ? { ...tr, tap_pct: 0 } : tr;
  if (cmaxHv === null || cmaxLv === null) return { generator: g, transformer, lvNode, kOutside: null, kGenInside: null, kTrInside: null };
  const xT = transformerXT(tr);
  const pG = oltc || !Number.isFinite(unit.pG_pct) ? 0 : unit.pG_pct / 100;
  const pT = oltc ? 0 : tr.tap_pct / 100;
  const k = oltc
    ? unitKS(unHv_kV, g.ur_kV, tr.urLv_kV, tr.urHv_kV, cmaxHv, g.xdss_pu, xT, g.cosPhi)
    : unitKSO(unHv_kV, g.ur_kV, tr.urLv_kV, tr.urHv_kV, cmaxHv, g.xdss_pu, g.cosPhi, pG, pT);
  // The stamps put (1 + pT)^2 into the referred impedances through the branch ratio, where the standard's Z_S uses
  // the rated t_r: divide it out so that the unit seen from the HV node is exactly K (t_r^2 Z_G + Z_THV).
  const kOutside = k / ((1 + pT) * (1 + pT));
  // In-unit: the equivalent source at the LV node is c Un(LV) where the standard writes c U_rG, hence Un/U_rG on the
  // generator's share (the LV bus is normally at U_rG, where the two agree).
  return {
    generator: g,
    transformer,
    lvNode,
    kOutside,
    kGenInside: (unLv_kV / g.ur_kV) * unitGeneratorK(cmaxLv, g.xdss_pu, g.cosPhi, pG),
    kTrInside: unitTransformerK(cmaxLv, xT, g.cosPhi, pG),
  };
}
