// Balanced load flow by current injection on the sparse LDL^T solver: the slack nodes are held, the rest solve
// Y_uu V_u = I_u(V) - Y_us V_s with I = conj(S / V) (Gauss iteration on the bus impedance matrix, which power
// distribution networks, radial and short, take well). PV nodes get the reactive power that holds their set
// voltage magnitude each iteration.
import { minimumDegree } from "../sparse/minimumDegree.ts";
import { factorLdlt, solveLdlt, type SymmetricTriplets } from "../sparse/ldlt.ts";
import type { BranchStamp } from "../network/model.ts";

export interface FlowProblem {
  n: number;
  branches: BranchStamp[];
  /** Node kind: 0 PQ, 1 PV, 2 slack, -1 dead (excluded). */
  kind: Int8Array;
  /** Specified injections (generation minus load), pu: P and Q (Q ignored at PV nodes). */
  p: Float64Array;
  q: Float64Array;
  /** Voltage set-point magnitude for PV and slack nodes (slack angle 0 in the unshifted frame). */
  vSet: Float64Array;
}

export interface FlowSolution {
  vre: Float64Array;
  vim: Float64Array;
  /** Reactive injection found at PV nodes. */
  qPv: Float64Array;
  iterations: number;
  converged: boolean;
  mismatch_pu: number;
}

export const MAX_FLOW_ITERATIONS = 500;
export const FLOW_TOLERANCE = 1e-10;

/** y V (branch currents summed per node) for the full vector V. */
function yTimes(pr: FlowProblem, vre: Float64Array, vim: Float64Array): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(pr.n);
  const im = new Float64Array(pr.n);
  for (const b of pr.branches) {
    const y = b.y[1];
    if (!y) continue;
    const t = b.t;
    const a = { re: vre[b.from], im: vim[b.from] };
    const c = { re: vre[b.to], im: vim[b.to] };
    const fr = a.re / (t * t) - c.re / t;
    const fi = a.im / (t * t) - c.im / t;
    const tr = c.re - a.re / t;
    const ti = c.im - a.im / t;
    re[b.from] += y.re * fr - y.im * fi;
    im[b.from] += y.re * fi + y.im * fr;
    re[b.to] += y.re * tr - y.im * ti;
    im[b.to] += y.re * ti + y.im * tr;
  }
  return { re, im };
}

export function solveFlow(pr: FlowProblem): FlowSolution {
  const { n } = pr;
  const unk: number[] = [];
  const pos = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    if (pr.kind[i] === 0 || pr.kind[i] === 1) {
      pos[i] = unk.length;
      unk.push(i);
    }
  }
  const m = unk.length;
  const vre = new Float64Array(n);
  const vim = new Float64Array(n);
  for (let i = 0; i < n; i++) if (pr.kind[i] >= 0) vre[i] = pr.kind[i] === 0 ? 1 : pr.vSet[i];
  const qPv = new Float64Array(n);
  if (m === 0) return { vre, vim, qPv, iterations: 0, converged: true, mismatch_pu: 0 };
  const a: SymmetricTriplets = { n: m, row: [], col: [], re: [], im: [] };
  const nb: number[][] = Array.from({ length: m }, () => []);
  for (const b of pr.branches) {
    const y = b.y[1];
    if (!y || b.from === b.to) continue;
    const f = pos[b.from];
    const t = pos[b.to];
    const tt = b.t * b.t;
    if (f >= 0) {
      a.row.push(f);
      a.col.push(f);
      a.re.push(y.re / tt);
      a.im.push(y.im / tt);
    }
    if (t >= 0) {
      a.row.push(t);
      a.col.push(t);
      a.re.push(y.re);
      a.im.push(y.im);
    }
    if (f >= 0 && t >= 0) {
      a.row.push(Math.max(f, t));
      a.col.push(Math.min(f, t));
      a.re.push(-y.re / b.t);
      a.im.push(-y.im / b.t);
      nb[f].push(t);
      nb[t].push(f);
    }
  }
  const factor = factorLdlt(a, minimumDegree(m, nb));
  let converged = false;
  let it = 0;
  let mismatch = Infinity;
  for (; it < MAX_FLOW_ITERATIONS; it++) {
    const yv = yTimes(pr, vre, vim);
    // PV nodes: reactive injection that the present voltages imply.
    for (const i of unk) {
      if (pr.kind[i] !== 1) continue;
      qPv[i] = vim[i] * yv.re[i] - vre[i] * yv.im[i]; // Im(V conj(YV))
    }
    // Mismatch at PQ nodes: S_spec - V conj(YV).
    mismatch = 0;
    for (const i of unk) {
      const sr = vre[i] * yv.re[i] + vim[i] * yv.im[i];
      const si = vim[i] * yv.re[i] - vre[i] * yv.im[i];
      const dq = pr.kind[i] === 1 ? 0 : pr.q[i] - si;
      mismatch = Math.max(mismatch, Math.hypot(pr.p[i] - sr, dq));
    }
    if (mismatch < FLOW_TOLERANCE) {
      converged = true;
      break;
    }
    const bre = new Float64Array(m);
    const bim = new Float64Array(m);
    for (let k = 0; k < m; k++) {
      const i = unk[k];
      const q = pr.kind[i] === 1 ? qPv[i] : pr.q[i];
      const v2 = vre[i] * vre[i] + vim[i] * vim[i];
      // I = conj(S / V) = (P - jQ) / conj(V)
      bre[k] = (pr.p[i] * vre[i] + q * vim[i]) / v2;
      bim[k] = (pr.p[i] * vim[i] - q * vre[i]) / v2;
    }
    // Minus the slack coupling Y_us V_s.
    for (const b of pr.branches) {
      const y = b.y[1];
      if (!y) continue;
      const f = pos[b.from];
      const t = pos[b.to];
      if (f >= 0 && t < 0 && pr.kind[b.to] === 2) {
        const cr = (-y.re / b.t) * vre[b.to] - (-y.im / b.t) * vim[b.to];
        const ci = (-y.re / b.t) * vim[b.to] + (-y.im / b.t) * vre[b.to];
        bre[f] -= cr;
        bim[f] -= ci;
      }
      if (t >= 0 && f < 0 && pr.kind[b.from] === 2) {
        const cr = (-y.re / b.t) * vre[b.from] - (-y.im / b.t) * vim[b.from];
        const ci = (-y.re / b.t) * vim[b.from] + (-y.im / b.t) * vre[b.from];
        bre[t] -= cr;
        bim[t] -= ci;
      }
    }
    solveLdlt(factor, bre, bim);
    for (let k = 0; k < m; k++) {
      const i = unk[k];
      let r = bre[k];
      let im = bim[k];
      if (pr.kind[i] === 1) {
        const mag = Math.hypot(r, im);
        if (mag > 0) {
          r = (r * pr.vSet[i]) / mag;
          im = (im * pr.vSet[i]) / mag;
        }
      }
      vre[i] = r;
      vim[i] = im;
    }
  }
  return { vre, vim, qPv, iterations: it + 1, converged, mismatch_pu: mismatch };
}
