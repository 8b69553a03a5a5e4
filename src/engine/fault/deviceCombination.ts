// A device location's current as a linear combination of node voltage changes, per sequence:
// I_s = sum_i coef_i * dV_i (dV = V - vpre in positive sequence, V otherwise). Used by the sweep, where one solve
// Z c per device and sequence gives the device current for a fault at every bus (reciprocity: Z symmetric).
import type { Model } from "../network/model.ts";
import type { Variant } from "../network/sequenceSystem.ts";

export interface Combination {
  node: number;
  bus: string;
  /** Per sequence: node indices and complex coefficients. */
  terms: { nodes: number[]; re: number[]; im: number[] }[];
  /** Index of the inverter unit whose injection flows out of this terminal (-1 if none). */
  unit: number;
}

/** Branches by element id, per model (a sweep looks up hundreds of device locations among thousands of branches). */
const branchIndex = new WeakMap<Model, Map<string, Model["branches"][number]>>();

function branchOf(model: Model, element: string): Model["branches"][number] | undefined {
  let index = branchIndex.get(model);
  if (!index) {
    index = new Map();
    // the first branch of an element, as a search from the start would find
    for (let i = model.branches.length - 1; i >= 0; i--) index.set(model.branches[i].element, model.branches[i]);
    branchIndex.set(model, index);
  }
  return index.get(element);
}

export function deviceCombination(model: Model, variant: Variant, element: string, end: "from" | "to" | "terminal"): Combination | null {
  const empty = () => ({ nodes: [] as number[], re: [] as number[], im: [] as number[] });
  const terms = [empty(), empty(), empty()];
  if (end !== "terminal") {
    const b = branchOf(model, element);
    if (!b) return null;
    for (let s = 0; s < 3; s++) {
      const y = b.y[s];
      if (y) {
        const t = b.t;
        if (end === "from") {
          terms[s].nodes.push(b.from, b.to);
          terms[s].re.push(y.re / (t * t), -y.re / t);
          terms[s].im.push(y.im / (t * t), -y.im / t);
        } else {
          terms[s].nodes.push(b.to, b.from);
          terms[s].re.push(y.re, -y.re / t);
          terms[s].im.push(y.im, -y.im / t);
        }
      }
      const ysh = s === 0 ? (end === "from" ? b.y0From : b.y0To) : null;
      if (ysh) {
        terms[s].nodes.push(end === "from" ? b.from : b.to);
        terms[s].re.push(ysh.re);
        terms[s].im.push(ysh.im);
      }
    }
    return { node: end === "from" ? b.from : b.to, bus: end === "from" ? b.fromBus : b.toBus, terms, unit: -1 };
  }
  const unit = model.inverters.findIndex((u) => u.element === element);
  const sh = model.shunts.find((x) => x.element === element && (!x.refinedOnly || variant === "refined"));
  if (!sh && unit < 0) return null;
  if (sh) {
    for (let s = 0; s < 3; s++) {
      const y = sh.y[s];
      if (!y) continue;
      terms[s].nodes.push(sh.node);
      terms[s].re.push(y.re);
      terms[s].im.push(y.im);
    }
  }
  const node = sh ? sh.node : model.inverters[unit].node;
  const bus = sh ? sh.bus : model.inverters[unit].bus;
  return { node, bus, terms, unit };
}
