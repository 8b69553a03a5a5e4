// Balanced load flow of one scenario, for the maximum load current at every device location.
// Sources: grid feeders are the slack (1.0 pu); without one, the largest grid-forming source (generator or
// grid-forming inverter) of each island is. Other generators hold 1.0 pu at an assumed 80 % of rated active power
// (the document has no dispatch field); inverters deliver activePower_pu at unity power factor; loads are constant
// power; motors draw rated input power at rated power factor. Branches as in the short-circuit model without
// correction factors (classic compile: no KT, conductors at 20 C).
import type { Element, Project } from "../../model/schema.ts";
import { elementLabel } from "../../model/elementLabel.ts";
import { compileNetwork } from "../network/compileNetwork.ts";
import type { EngineInternal } from "../fault/solveFault.ts";
import type { EngineMessage, LoadFlowResult, LoadFlowShuntResult, LoadFlowBranchResult } from "../types.ts";
import { solveFlow } from "./currentInjection.ts";
import { branchEndCurrents } from "../fault/endCurrents.ts";

const SQRT3 = Math.sqrt(3);
export const GENERATOR_DISPATCH = 0.8;

export function runLoadFlow(project: Project, options: { scenario?: string } = {}): LoadFlowResult {
  const compiled = compileNetwork(project, { scenario: options.scenario, limit: "max", method: "classic" });
  if (!compiled.ok) {
    return { scenario: options.scenario ?? "", converged: false, iterations: 0, mismatch_pu: 0, slack: null, buses: [], branches: [], shunts: [], messages: compiled.errors };
  }
  const net = compiled.network;
  const { model } = net.internal as EngineInternal;
  const baseMVA = net.options.baseMVA;
  const n = model.nodes.length;
  const scenario = project.scenarios.find((s) => s.id === net.scenario);
  const out = new Set(scenario?.outOfService ?? []);
  const messages: EngineMessage[] = [];
  const kind = new Int8Array(n).fill(-1);
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  const vSet = new Float64Array(n).fill(1);
  const inService = (e: Element) => !out.has(e.id) && "bus" in e && typeof e.bus === "string" && model.busNode.has(e.bus);
  const shuntEls = project.elements.filter((e) => (e.kind === "grid" || e.kind === "generator" || e.kind === "inverter" || e.kind === "load" || e.kind === "motor") && inService(e));
  const nodeOf = (e: Element) => model.busNode.get((e as { bus: string }).bus)!;

  // Slack per island: grid feeders, else the largest grid-forming source.
  const islands = new Set(model.nodes.map((nd) => nd.island));
  const slackEls = new Set<string>();
  let slackName: string | null = null;
  for (const isl of islands) {
    const here = shuntEls.filter((e) => model.nodes[nodeOf(e)].island === isl);
    let chosen: Element[] = here.filter((e) => e.kind === "grid");
    if (chosen.length === 0) {
      const forming = here.filter((e) => e.kind === "generator" || (e.kind === "inverter" && e.control === "grid-forming")) as { id: string; sr_MVA: number }[];
      forming.sort((a, b) => b.sr_MVA - a.sr_MVA);
      chosen = forming.length ? [forming[0] as unknown as Element] : [];
    }
    if (chosen.length === 0) {
      if (here.some((e) => e.kind === "load" || e.kind === "motor" || e.kind === "inverter")) {
        const bs = model.nodes.filter((nd) => nd.island === isl).flatMap((nd) => nd.buses);
        messages.push({ level: "warning", code: "no-slack", text: `Buses ${bs.join(", ")}: no grid feeder or grid-forming source; left out of the load flow` });
      }
      continue;
    }
    for (const nd of model.nodes.keys()) if (model.nodes[nd].island === isl) kind[nd] = 0;
    for (const e of chosen) {
      slackEls.add(e.id);
      kind[nodeOf(e)] = 2;
      slackName ??= elementLabel(e);
    }
  }
  const base = (e: Element) => (kind[nodeOf(e)] >= 0 ? nodeOf(e) : -1);
  for (const e of shuntEls) {
    const i = base(e);
    if (i < 0 || slackEls.has(e.id)) continue;
    switch (e.kind) {
      case "load":
        p[i] -= e.p_kW / 1000 / baseMVA;
        q[i] -= e.q_kvar / 1000 / baseMVA;
        break;
      case "motor": {
        const pin = e.pr_kW / 1000 / e.eta;
        p[i] -= pin / baseMVA;
        q[i] -= (pin * Math.tan(Math.acos(e.cosPhi))) / baseMVA;
        break;
      }
      case "inverter":
        p[i] += (e.activePower_pu * e.sr_MVA) / baseMVA;
        break;
      case "generator":
        p[i] += (GENERATOR_DISPATCH * e.sr_MVA * e.cosPhi) / baseMVA;
        if (kind[i] === 0) kind[i] = 1;
        break;
      default:
        break;
    }
  }
  const sol = solveFlow({ n, branches: model.branches, kind, p, q, vSet });
  if (!sol.converged) messages.push({ level: "warning", code: "loadflow-not-converged", text: `Load flow did not converge (${sol.iterations} iterations, mismatch ${sol.mismatch_pu.toExponential(2)} pu)` });

  const iA = (node: number) => (baseMVA * 1000) / (SQRT3 * model.nodes[node].un_kV);
  const vpre = new Float64Array(n);
  const zero = { re: new Float64Array(n), im: new Float64Array(n) };
  const v = { re: sol.vre, im: sol.vim };
  // Element currents from the bus into the element, pu, per node (for the slack's share).
  const nodeSum = Array.from({ length: n }, () => ({ re: 0, im: 0 }));
  const branches: LoadFlowBranchResult[] = model.branches.map((b) => {
    const c = branchEndCurrents(b, [zero, v, zero], vpre);
    const end = (node: number, bus: string, i: { re: number; im: number }) => {
      nodeSum[node].re += i.re;
      nodeSum[node].im += i.im;
      const s = { re: (sol.vre[node] * i.re + sol.vim[node] * i.im) * baseMVA, im: (sol.vim[node] * i.re - sol.vre[node] * i.im) * baseMVA };
      return { bus, i_A: Math.hypot(i.re, i.im) * iA(node), p_MW: s.re, q_Mvar: s.im };
    };
    const from = end(b.from, b.fromBus, c.from[1]);
    const to = end(b.to, b.toBus, c.to[1]);
    const rated = b.rated_A ?? Infinity;
    // Lines: ampacity x parallel runs at either end; transformers: HV current over HV rated current.
    const loading_pct = (100 * (b.kind === "line" ? Math.max(from.i_A, to.i_A) : from.i_A)) / rated;
    return { element: b.element, from, to, loading_pct };
  });
  const shunts: LoadFlowShuntResult[] = [];
  const slackAt = new Map<number, Element[]>();
  for (const e of shuntEls) {
    const i = base(e);
    if (i < 0) {
      shunts.push({ element: e.id, bus: (e as { bus: string }).bus, i_A: 0, p_MW: 0, q_Mvar: 0 });
      continue;
    }
    if (slackEls.has(e.id)) {
      slackAt.set(i, [...(slackAt.get(i) ?? []), e]);
      continue;
    }
    let s_pu = { re: 0, im: 0 }; // power from bus into element
    if (e.kind === "load") s_pu = { re: e.p_kW / 1000 / baseMVA, im: e.q_kvar / 1000 / baseMVA };
    else if (e.kind === "motor") {
      const pin = e.pr_kW / 1000 / e.eta;
      s_pu = { re: pin / baseMVA, im: (pin * Math.tan(Math.acos(e.cosPhi))) / baseMVA };
    } else if (e.kind === "inverter") s_pu = { re: -(e.activePower_pu * e.sr_MVA) / baseMVA, im: 0 };
    else if (e.kind === "generator") {
      const share = shuntEls.filter((g) => g.kind === "generator" && base(g) === i).length;
      // Net reactive injection at the PV node plus what the node's loads draw, shared by its generators.
      s_pu = { re: -(GENERATOR_DISPATCH * e.sr_MVA * e.cosPhi) / baseMVA, im: -(sol.qPv[i] - q[i]) / share };
    }
    const vv = { re: sol.vre[i], im: sol.vim[i] };
    const v2 = vv.re * vv.re + vv.im * vv.im;
    // I = conj(S / V)
    const cur = v2 > 0 ? { re: (s_pu.re * vv.re + s_pu.im * vv.im) / v2, im: (s_pu.re * vv.im - s_pu.im * vv.re) / v2 } : { re: 0, im: 0 };
    nodeSum[i].re += cur.re;
    nodeSum[i].im += cur.im;
    shunts.push({ element: e.id, bus: (e as { bus: string }).bus, i_A: Math.hypot(cur.re, cur.im) * iA(i), p_MW: s_pu.re * baseMVA, q_Mvar: s_pu.im * baseMVA });
  }
  for (const [i, els] of slackAt) {
    // Kirchhoff at the slack node: the slack elements take what the rest leaves, shared equally.
    const cur = { re: -nodeSum[i].re / els.length, im: -nodeSum[i].im / els.length };
    const s = { re: (sol.vre[i] * cur.re + sol.vim[i] * cur.im) * baseMVA, im: (sol.vim[i] * cur.re - sol.vre[i] * cur.im) * baseMVA };
    for (const e of els) shunts.push({ element: e.id, bus: (e as { bus: string }).bus, i_A: Math.hypot(cur.re, cur.im) * iA(i), p_MW: s.re, q_Mvar: s.im });
  }
  const buses = model.nodes.flatMap((nd, i) =>
    nd.buses.map((bus) => ({
      bus,
      v_pu: Math.hypot(sol.vre[i], sol.vim[i]),
      ang_deg: kind[i] >= 0 ? (Math.atan2(sol.vim[i], sol.vre[i]) * 180) / Math.PI + nd.shift_deg : 0,
      v_kV: Math.hypot(sol.vre[i], sol.vim[i]) * nd.un_kV,
    })),
  );
  return { scenario: net.scenario, converged: sol.converged, iterations: sol.iterations, mismatch_pu: sol.mismatch_pu, slack: slackName, buses, branches, shunts, messages: [...net.messages, ...messages] };
}
