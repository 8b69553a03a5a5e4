// The voltage sources' share of a three-phase I"k, for the peak current (see peakCurrent_kA): the fault with every
// converter removed, grid-forming units included (their current is limited and controlled, with no decaying d.c.
// component). The refined model's network holds a grid-forming unit as a shunt y_g = 1 / zForming at its node; the
// network without it follows from the refined one by the Woodbury identity over those few nodes G:
//   Z_iec[k,k] = Z[k,k] + Z[k,G] (diag(zForming) - Z[G,G])^-1 Z[G,k].
import type { Cx, Model } from "../network/model.ts";
import { sequenceComponents } from "../network/sequenceSystem.ts";
import { denseSolve } from "../inverter/newtonFallback.ts";
import type { ComplexVec } from "./solveLinearFault.ts";

/** Per island: the grid-forming units (positions in the island's unit list) and M = (diag(zForming) - Z[G,G])^-1. */
export class SourceShare {
  /** Positions l (into the island's units) of the grid-forming units. */
  readonly forming: number[];
  /** M as [(i * g + j) * 2 + re/im]. */
  readonly m: Float64Array;
  /** Whether the island has a voltage source once the converters are removed. */
  readonly hasSource: boolean;

  constructor(model: Model, island: number, unitIdx: number[], colU: ComplexVec[][], iecFloating: (node: number) => boolean) {
    this.forming = unitIdx.map((g, l) => (model.inverters[g].control === "grid-forming" ? l : -1)).filter((l) => l >= 0);
    const first = model.nodes.findIndex((nd) => nd.island === island);
    this.hasSource = first >= 0 && !iecFloating(first);
    const g = this.forming.length;
    this.m = new Float64Array(g * g * 2);
    if (g === 0 || !this.hasSource) return;
    // A = diag(zForming) - Z[G,G] as a real 2g x 2g system; M column by column.
    const a = new Float64Array(4 * g * g);
    for (let i = 0; i < g; i++)
      for (let j = 0; j < g; j++) {
        const ui = model.inverters[unitIdx[this.forming[i]]];
        const uj = model.inverters[unitIdx[this.forming[j]]];
        const col = colU[1][unitIdx[this.forming[j]]];
        let re = -col.re[ui.node];
        let im = -col.im[ui.node];
        if (i === j) {
          re += uj.zForming.re;
          im += uj.zForming.im;
        }
        a[i * 2 * g + j] = re;
        a[i * 2 * g + g + j] = -im;
        a[(g + i) * 2 * g + j] = im;
        a[(g + i) * 2 * g + g + j] = re;
      }
    for (let j = 0; j < g; j++) {
      const e = new Float64Array(2 * g);
      e[j] = 1;
      const x = denseSolve(a, e, 2 * g);
      if (!x) continue;
      for (let i = 0; i < g; i++) {
        this.m[(i * g + j) * 2] = x[i];
        this.m[(i * g + j) * 2 + 1] = x[g + i];
      }
    }
  }

  /**
   * Z_iec[k,k] from the refined network's Z[k,k] (zkk) and Z[u_l,k] of the island's units (z1r, z1i), written into
   * `out`; null when no voltage source is left.
   */
  drivingPoint(zkk: Cx, z1r: Float64Array, z1i: Float64Array, out: Cx): Cx | null {
    if (!this.hasSource) return null;
    const f = this.forming;
    const g = f.length;
    out.re = zkk.re;
    out.im = zkk.im;
    for (let i = 0; i < g; i++) {
      // (M z_Gk)_i
      let wr = 0;
      let wi = 0;
      for (let j = 0; j < g; j++) {
        const mr = this.m[(i * g + j) * 2];
        const mi = this.m[(i * g + j) * 2 + 1];
        wr += mr * z1r[f[j]] - mi * z1i[f[j]];
        wi += mr * z1i[f[j]] + mi * z1r[f[j]];
      }
      out.re += z1r[f[i]] * wr - z1i[f[i]] * wi;
      out.im += z1r[f[i]] * wi + z1i[f[i]] * wr;
    }
    return out;
  }
}

/** Whether each node's positive-sequence part floats once the converters' shunts are removed. */
export function iecFloatingOf(model: Model): (node: number) => boolean {
  const { comp, floating } = sequenceComponents(model, 1, "iec");
  return (node) => floating[comp[node]];
}
