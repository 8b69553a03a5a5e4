// Compiles one scenario of a project into the internal per-unit model: in-service elements, buses merged by
// closed switches (union-find), element stamps per sequence, islands and vector-group phase shifts.
import type { Element, Project, Scenario } from "../../model/schema.ts";
import { elementLabel } from "../../model/elementLabel.ts";
import { idRecord, ownValue } from "../../model/ownValue.ts";
import type { CompileOptions, CompileResult, EngineMessage, NetworkNode } from "../types.ts";
import type { BranchStamp, Model, ShuntStamp, InverterUnit } from "./model.ts";
import { resolveOptions } from "./resolveOptions.ts";
import { voltageFactor } from "../iec60909/factors.ts";
import { gridStamp } from "../elements/gridStamp.ts";
import { lineImpedance } from "../elements/lineStamp.ts";
import { transformerStamp } from "../elements/transformerStamp.ts";
import { generatorStamp, motorStamp, standaloneGeneratorK } from "../elements/machineStamps.ts";
import { powerStationUnits } from "../elements/powerStationUnit.ts";
import { inverterUnit } from "../elements/inverterUnit.ts";
import { inv } from "../complex.ts";
import { assignIslands } from "./assignIslands.ts";
import { createEngineCache } from "./engineCache.ts";
import { stampRangeErrors } from "./stampRange.ts";
import { openEndError, openStamps, openedBranch } from "./openEnds.ts";

function err(text: string, element?: string): EngineMessage {
  return { level: "error", code: "invalid-input", text, element };
}

function positiveField(e: Element, field: string, value: unknown, errors: EngineMessage[]): void {
  if (typeof value !== "number" || !(value > 0) || !Number.isFinite(value)) {
    errors.push(err(`${elementLabel(e)}: ${field} must be > 0 (got ${String(value)})`, e.id));
  }
}

/**
 * Reactance of a closed breaker that carries a protective device, per unit on the study base: small enough to
 * change no fault current by more than rounding (a busbar section's own impedance is a hundred times more), large
 * enough for the device's current to be read from the voltage across it without loss of precision.
 */
export const PROTECTED_SWITCH_X_PU = 1e-5;

export function compileNetwork(project: Project, options: CompileOptions): CompileResult {
  const opts = resolveOptions(project, options.limit, options.method);
  const errors: EngineMessage[] = [];
  const messages: EngineMessage[] = [];
  let scenario: Scenario | undefined;
  if (options.scenario !== undefined) {
    scenario = project.scenarios.find((s) => s.id === options.scenario);
    if (!scenario) return { ok: false, errors: [err(`Scenario ${options.scenario}: not found in the project`)] };
  } else scenario = project.scenarios[0];
  const out = new Set(scenario?.outOfService ?? []);
  const states = scenario?.switchStates ?? {};
  const buses = new Map<string, Extract<Element, { kind: "bus" }>>();
  for (const e of project.elements) if (e.kind === "bus" && !out.has(e.id)) buses.set(e.id, e);
  const allIds = new Set(project.elements.map((e) => e.id));
  // Ends opened by protective devices: a switch that joins its buses into one node is open when either end is
  // opened; other elements (a protected breaker too, a branch of its own) are opened below.
  const openSwitches = new Set<string>();
  for (const o of options.openEnds ?? []) {
    const el = project.elements.find((e) => e.id === o.element);
    const bad = el ? openEndError(el, o.end) : `Opened end ${o.element} (${o.end}): unknown element`;
    if (bad) errors.push(err(bad, o.element));
    else if (el?.kind === "switch") openSwitches.add(o.element);
  }
  const busOf = (e: Element, field: string, id: string): boolean => {
    if (buses.has(id)) return true;
    if (!allIds.has(id)) errors.push(err(`${elementLabel(e)}: ${field} refers to unknown bus ${id}`, e.id));
    return false; // bus out of service: the element drops out with it
  };

  // A breaker-type switch that a protective device sits at is a branch, so that its current is known (see
  // PROTECTED_SWITCH_X_PU); every other closed switch joins its buses into one node.
  const protectedSwitches = new Set<string>();
  for (const e of project.elements)
    if ((e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker") && !out.has(e.id)) {
      const host = project.elements.find((x) => x.id === e.at.element);
      if (host?.kind === "switch" && host.device === "breaker") protectedSwitches.add(host.id);
    }
  // Union-find over closed in-service switches.
  const busIds = [...buses.keys()];
  const parent = new Map<string, string>(busIds.map((b) => [b, b]));
  const find = (b: string): string => {
    let r = b;
    while (parent.get(r) !== r) r = parent.get(r) as string;
    return r;
  };
  for (const e of project.elements) {
    if (e.kind !== "switch" || out.has(e.id) || protectedSwitches.has(e.id)) continue;
    const closed = (ownValue(states, e.id) ?? e.closed) && !openSwitches.has(e.id);
    if (!closed) continue;
    const okA = busOf(e, "busA", e.busA);
    const okB = busOf(e, "busB", e.busB);
    if (!okA || !okB) continue;
    const ua = buses.get(e.busA)!.un_kV;
    const ub = buses.get(e.busB)!.un_kV;
    if (Math.abs(ua - ub) > 1e-9 * Math.max(ua, ub)) {
      errors.push(err(`${elementLabel(e)}: busA and busB have different un_kV (${ua} and ${ub})`, e.id));
      continue;
    }
    const ra = find(e.busA);
    const rb = find(e.busB);
    if (ra !== rb) parent.set(rb, ra);
  }
  const nodeOfRoot = new Map<string, number>();
  const nodes: { buses: string[]; un_kV: number; shift_deg: number; island: number }[] = [];
  const busNode = new Map<string, number>();
  for (const b of busIds) {
    const r = find(b);
    let n = nodeOfRoot.get(r);
    if (n === undefined) {
      n = nodes.length;
      nodeOfRoot.set(r, n);
      nodes.push({ buses: [], un_kV: buses.get(r)!.un_kV, shift_deg: 0, island: -1 });
    }
    nodes[n].buses.push(b);
    busNode.set(b, n);
  }
  for (const b of buses.values()) positiveField(b, "un_kV", b.un_kV, errors);

  const iec = opts.method === "iec60909";
  const cOf = (un_kV: number) => (iec ? voltageFactor(un_kV, opts.limit, opts.lvTolerance_pct) : opts.prefault_pu);
  const cmaxOf = (un_kV: number) => (iec ? voltageFactor(un_kV, "max", opts.lvTolerance_pct) : null);
  const zBase = (un_kV: number) => (un_kV * un_kV) / opts.baseMVA;
  const branches: BranchStamp[] = [];
  const shunts: ShuntStamp[] = [];
  const inverters: InverterUnit[] = [];
  const units = powerStationUnits({ project, out, busNode, nodeUn_kV: (n) => nodes[n].un_kV, cmaxOf });
  errors.push(...units.errors);
  messages.push(...units.messages);
  // In-unit stamps of each unit's generator and transformer, for faults at the unit's LV node.
  const inUnitShunt = new Map<string, ShuntStamp>();
  const inUnitBranch = new Map<string, BranchStamp>();

  for (const e of project.elements) {
    if (out.has(e.id)) continue;
    const label = elementLabel(e);
    switch (e.kind) {
      case "grid": {
        if (!busOf(e, "bus", e.bus)) break;
        const sk = opts.limit === "max" ? e.skMax_MVA : e.skMin_MVA;
        positiveField(e, opts.limit === "max" ? "skMax_MVA" : "skMin_MVA", sk, errors);
        if (e.skMin_MVA > e.skMax_MVA) messages.push({ level: "warning", code: "sk-order", text: `${label}: skMin_MVA (${e.skMin_MVA}) exceeds skMax_MVA (${e.skMax_MVA})`, element: e.id });
        const n = busNode.get(e.bus)!;
        shunts.push(gridStamp(e, n, label, cOf(nodes[n].un_kV), sk, opts.baseMVA));
        break;
      }
      case "generator": {
        if (!busOf(e, "bus", e.bus)) break;
        for (const f of ["sr_MVA", "ur_kV", "xdss_pu", "x2_pu", "x0_pu"] as const) positiveField(e, f, e[f], errors);
        const n = busNode.get(e.bus)!;
        const un = nodes[n].un_kV;
        const plan = units.byGenerator.get(e.id);
        shunts.push(generatorStamp(e, n, label, un, opts.baseMVA, plan ? (plan.kOutside ?? 1) : standaloneGeneratorK(e, un, cmaxOf(un))));
        if (plan && plan.kGenInside !== null) inUnitShunt.set(e.id, generatorStamp(e, n, label, un, opts.baseMVA, plan.kGenInside));
        break;
      }
      case "motor": {
        if (!busOf(e, "bus", e.bus)) break;
        for (const f of ["pr_kW", "ur_kV", "ilrIr"] as const) positiveField(e, f, e[f], errors);
        // IEC 60909-0:2016: motors are left out of minimum short-circuit currents.
        if (opts.limit === "min" && iec) break;
        if (iec && e.polePairs === undefined) {
          messages.push({ level: "info", code: "motor-q", text: `${label}: polePairs is not given, so its breaking current uses q = 1 (IEC 60909-0:2016, 9.1.1), the largest value`, element: e.id });
        }
        const n = busNode.get(e.bus)!;
        shunts.push(motorStamp(e, n, label, nodes[n].un_kV, opts.baseMVA));
        break;
      }
      case "inverter": {
        if (!busOf(e, "bus", e.bus)) break;
        for (const f of ["sr_MVA", "ur_kV", "iMax_pu"] as const) positiveField(e, f, e[f], errors);
        const n = busNode.get(e.bus)!;
        const { unit, shunt } = inverterUnit(e, n, label, nodes[n].un_kV, opts.baseMVA);
        inverters.push(unit);
        if (shunt) shunts.push(shunt);
        break;
      }
      case "line": {
        const okF = busOf(e, "fromBus", e.fromBus);
        const okT = busOf(e, "toBus", e.toBus);
        positiveField(e, "length_km", e.length_km, errors);
        if (!okF || !okT) break;
        const f = busNode.get(e.fromBus)!;
        const t = busNode.get(e.toBus)!;
        // Both ends on one node (a closed coupler in parallel): no current for bus faults, but kept so that a
        // fault along it can be placed; its stamps cancel and assembly skips them.
        const uf = nodes[f].un_kV;
        if (Math.abs(uf - nodes[t].un_kV) > 1e-9 * uf) {
          errors.push(err(`${label}: fromBus and toBus have different un_kV (${uf} and ${nodes[t].un_kV})`, e.id));
          break;
        }
        const imp = lineImpedance(e, zBase(uf), opts.limit === "min" && iec ? opts.conductorEndTemp_C : null);
        if (imp.clamped) messages.push({ level: "warning", code: "zero-impedance", text: `${label}: impedance is zero; a small reactance was used`, element: e.id });
        branches.push({
          element: e.id,
          label,
          kind: "line",
          from: f,
          to: t,
          fromBus: e.fromBus,
          toBus: e.toBus,
          t: 1,
          shift_deg: 0,
          y: [inv(imp.z[0]), inv(imp.z[1]), inv(imp.z[2])],
          y0From: null,
          y0To: null,
          z1: imp.z[1],
          line: { z: imp.z },
          rated_A: e.ampacity_A * e.parallel,
        });
        break;
      }
      case "transformer": {
        const okH = busOf(e, "hvBus", e.hvBus);
        const okL = busOf(e, "lvBus", e.lvBus);
        for (const fld of ["sr_MVA", "urHv_kV", "urLv_kV", "uk_pct"] as const) positiveField(e, fld, e[fld], errors);
        if (!okH || !okL) break;
        const f = busNode.get(e.hvBus)!;
        const t = busNode.get(e.lvBus)!;
        if (f === t) {
          errors.push(err(`${label}: hvBus and lvBus are the same node`, e.id));
          break;
        }
        const plan = units.byTransformer.get(e.id);
        const input = { tr: plan ? plan.transformer : e, label, from: f, to: t, unHv_kV: nodes[f].un_kV, unLv_kV: nodes[t].un_kV, baseMVA: opts.baseMVA, cmaxLv: cmaxOf(nodes[t].un_kV) };
        const r = transformerStamp(plan?.kOutside != null ? { ...input, kUnit: plan.kOutside } : input);
        if (r.error) errors.push(err(r.error, e.id));
        branches.push(r.stamp);
        if (plan && plan.kTrInside !== null) inUnitBranch.set(e.id, transformerStamp({ ...input, kUnit: plan.kTrInside }).stamp);
        break;
      }
      case "switch": {
        if (!protectedSwitches.has(e.id)) break;
        // An opened end of it is opened below like any branch end (its ends stay, carrying nothing).
        const closed = ownValue(states, e.id) ?? e.closed;
        if (!closed || !busOf(e, "busA", e.busA) || !busOf(e, "busB", e.busB)) break;
        const f = busNode.get(e.busA)!;
        const t = busNode.get(e.busB)!;
        if (Math.abs(nodes[f].un_kV - nodes[t].un_kV) > 1e-9 * nodes[f].un_kV) {
          errors.push(err(`${label}: busA and busB have different un_kV (${nodes[f].un_kV} and ${nodes[t].un_kV})`, e.id));
          break;
        }
        const z = { re: 0, im: PROTECTED_SWITCH_X_PU };
        branches.push({ element: e.id, label, kind: "switch", from: f, to: t, fromBus: e.busA, toBus: e.busB, t: 1, shift_deg: 0, y: [inv(z), inv(z), inv(z)], y0From: null, y0To: null, z1: z });
        break;
      }
      default:
        break;
    }
  }
  if (errors.length > 0) return { ok: false, errors };

  const present = new Set<string>([...branches.map((b) => b.element), ...shunts.map((x) => x.element), ...inverters.map((u) => u.element)]);
  const devices: Model["devices"] = [];
  const seenLoc = new Set<string>();
  for (const e of project.elements) {
    if ((e.kind !== "relay" && e.kind !== "fuse" && e.kind !== "lvbreaker") || out.has(e.id)) continue;
    const key = `${e.at.element}|${e.at.end}`;
    if (!present.has(e.at.element) || seenLoc.has(key)) continue;
    seenLoc.add(key);
    devices.push({ element: e.at.element, end: e.at.end });
  }
  const model: Model = { nodes, branches, shunts, inverters, busNode, baseMVA: opts.baseMVA, devices, islandLive: [] };
  const rangeErrors = stampRangeErrors(model, new Map(project.elements.map((e) => [e.id, e] as const)), opts.baseMVA);
  if (rangeErrors.length > 0) return { ok: false, errors: rangeErrors };
  // Switches that join their buses into one node were opened above; a protected breaker is a branch like the rest.
  const openEnds = (options.openEnds ?? []).filter((o) => !openSwitches.has(o.element) || protectedSwitches.has(o.element));
  if (openEnds.length > 0) {
    try {
      Object.assign(model, openStamps(model, openEnds));
    } catch (x) {
      return { ok: false, errors: [err((x as Error).message, openEnds[0].element)] };
    }
  }
  const islandErrors = assignIslands(model);
  if (islandErrors.length > 0) return { ok: false, errors: islandErrors };
  for (const plan of units.byGenerator.values()) {
    const g = inUnitShunt.get(plan.generator.id);
    const t = inUnitBranch.get(plan.transformer.id);
    if (!g || !t) continue;
    const variant: Model = {
      ...model,
      // an opened terminal or end stays open in the unit's own variant
      shunts: model.shunts.map((x) => (x.element === g.element && !x.open ? g : x)),
      branches: model.branches.map((x) => (x.element === t.element ? (x.open ? openedBranch(t, x.open) : t) : x)),
    };
    model.inUnit ??= new Map();
    model.inUnit.set(plan.lvNode, { model: variant, cache: createEngineCache() });
  }
  for (let i = 0; i < model.islandLive.length; i++) {
    if (!model.islandLive[i]) {
      const bs = nodes.filter((n) => n.island === i).flatMap((n) => n.buses);
      messages.push({ level: "warning", code: "dead-island", text: `Buses ${bs.join(", ")} have no source in this scenario: fault currents there are zero` });
    }
  }
  const publicNodes: NetworkNode[] = nodes.map((n, index) => ({ index, buses: n.buses, un_kV: n.un_kV, shift_deg: n.shift_deg, island: n.island }));
  return {
    ok: true,
    network: {
      scenario: scenario?.id ?? "",
      options: opts,
      nodes: publicNodes,
      busNode: idRecord(busNode),
      messages,
      internal: { model, cache: createEngineCache() },
    },
  };
}
