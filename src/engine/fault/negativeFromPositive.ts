// The negative-sequence network usually differs from the positive one only in the diagonal at a few nodes (a
// synchronous machine's X(2) against X"d, IEC 60909-0:2016, 6.6.1). Then A2 = A1 + E D E^T with D diagonal (k x k)
// and, by the Woodbury identity (A1 and A2 complex symmetric, Z = A^-1),
//   Z2 = Z1 - W H W^T,   W = Z1 E (n x k),   H = (D^-1 + E^T W)^-1,
// so a device location's negative-sequence response needs no solve of its own:
//   X2_d = Z2 c2_d = X1_d - W alpha_d,   alpha_d = H X1_d[G] - (I - H W_G) dc_d,
// where X1_d = Z1 c1_d, X1_d[G] its rows at the nodes G of E, and dc_d = E^T (c2_d - c1_d) what the combination
// itself changes between the sequences (only at those nodes: a machine terminal's own admittance). The all-bus
// sweep then solves and stores two sequences instead of three.
import { smallComplexInverse } from "../network/lowRankUpdate.ts";
import type { LdltFactor } from "../sparse/ldlt.ts";
import { solveLdltBlock } from "../sparse/ldlt.ts";
import type { Combination } from "./deviceCombination.ts";

/** Up to this many nodes with a different negative-sequence admittance; beyond, the sweep solves all three. */
export const MAX_NEGATIVE_RANK = 4;

export interface NegativeCorrection {
  /** k: the number of nodes where the two sequences differ (0: identical networks). */
  rank: number;
  /** Those nodes in the factor's (permuted) order. */
  rowsG: Int32Array;
  /** W = Z1 E in the factor's order, [(row * k + h) * 2 + re/im]. */
  w: Float64Array;
  /** H, [(a * k + b) * 2 + re/im]. */
  h: Float64Array;
  /** I - H W_G, same layout. */
  ihw: Float64Array;
  /** Per device location, the combination's own change between the sequences at the nodes G: [h, re, im, ...]. */
  dc: (number[] | null)[];
}

/**
 * The correction for the two factors (same ordering), or null when the networks differ elsewhere than in the
 * diagonal, at more than MAX_NEGATIVE_RANK nodes, or a device combination changes between the sequences off G.
 */
export function negativeCorrection(f1: LdltFactor, f2: LdltFactor, combos: (Combination | null)[]): NegativeCorrection | null {
  const n = f1.n;
  if (f2.n !== n || f1.ordering !== f2.ordering || f1.aPtr.length !== f2.aPtr.length) return null;
  for (let j = 0; j <= n; j++) if (f1.aPtr[j] !== f2.aPtr[j]) return null;
  const g: number[] = [];
  const dr: number[] = [];
  const di: number[] = [];
  for (let j = 0; j < n; j++) {
    for (let p = f1.aPtr[j]; p < f1.aPtr[j + 1]; p++) {
      if (f1.aRow[p] !== f2.aRow[p]) return null;
      if (f1.aRe[p] === f2.aRe[p] && f1.aIm[p] === f2.aIm[p]) continue;
      // Duplicates of one entry are summed; a changed off-diagonal is a different network.
      if (f1.aRow[p] !== j) return null;
      const at = g.indexOf(j);
      if (at < 0) {
        g.push(j);
        dr.push(f2.aRe[p] - f1.aRe[p]);
        di.push(f2.aIm[p] - f1.aIm[p]);
      } else {
        dr[at] += f2.aRe[p] - f1.aRe[p];
        di[at] += f2.aIm[p] - f1.aIm[p];
      }
    }
  }
  // Entries that differed piecewise but sum to the same diagonal are no difference.
  for (let a = g.length - 1; a >= 0; a--)
    if (dr[a] === 0 && di[a] === 0) {
      g.splice(a, 1);
      dr.splice(a, 1);
      di.splice(a, 1);
    }
  const k = g.length;
  if (k > MAX_NEGATIVE_RANK) return null;
  const inv = f1.ordering.inv;
  const dc: (number[] | null)[] = [];
  for (const combo of combos) {
    if (!combo) {
      dc.push(null);
      continue;
    }
    const t1 = combo.terms[1];
    const t2 = combo.terms[2];
    // The change c2 - c1, summed per node, must sit at nodes of G.
    const change = new Map<number, { re: number; im: number }>();
    const addTerm = (node: number, re: number, im: number) => {
      const e = change.get(node) ?? { re: 0, im: 0 };
      e.re += re;
      e.im += im;
      change.set(node, e);
    };
    t2.nodes.forEach((node, q) => addTerm(node, t2.re[q], t2.im[q]));
    t1.nodes.forEach((node, q) => addTerm(node, -t1.re[q], -t1.im[q]));
    const list: number[] = [];
    for (const [node, v] of change) {
      if (v.re === 0 && v.im === 0) continue;
      const h = g.indexOf(inv[node]);
      if (h < 0) return null;
      list.push(h, v.re, v.im);
    }
    dc.push(list.length ? list : null);
  }
  // W = Z1 E: k solves of the positive-sequence factor, all at once in its block layout.
  const w = new Float64Array(n * k * 2);
  if (k > 0) {
    const xr = new Float64Array(n * k);
    const xi = new Float64Array(n * k);
    g.forEach((row, h) => (xr[row * k + h] = 1));
    solveLdltBlock(f1, xr, xi, k);
    for (let q = 0; q < n * k; q++) {
      w[2 * q] = xr[q];
      w[2 * q + 1] = xi[q];
    }
  }
  // H = (D^-1 + W_G)^-1 and I - H W_G.
  const m = new Float64Array(k * k * 2);
  for (let a = 0; a < k; a++)
    for (let b = 0; b < k; b++) {
      m[(a * k + b) * 2] = w[(g[a] * k + b) * 2];
      m[(a * k + b) * 2 + 1] = w[(g[a] * k + b) * 2 + 1];
    }
  const wg = m.slice();
  for (let a = 0; a < k; a++) {
    const d2 = dr[a] * dr[a] + di[a] * di[a];
    m[(a * k + a) * 2] += dr[a] / d2;
    m[(a * k + a) * 2 + 1] -= di[a] / d2;
  }
  const h = smallComplexInverse(m, k);
  if (!h) return null;
  const ihw = new Float64Array(k * k * 2);
  for (let a = 0; a < k; a++)
    for (let b = 0; b < k; b++) {
      let sr = a === b ? 1 : 0;
      let si = 0;
      for (let q = 0; q < k; q++) {
        const pr = h[(a * k + q) * 2];
        const pi = h[(a * k + q) * 2 + 1];
        const qr = wg[(q * k + b) * 2];
        const qi = wg[(q * k + b) * 2 + 1];
        sr -= pr * qr - pi * qi;
        si -= pr * qi + pi * qr;
      }
      ihw[(a * k + b) * 2] = sr;
      ihw[(a * k + b) * 2 + 1] = si;
    }
  return { rank: k, rowsG: Int32Array.from(g), w, h, ihw, dc };
}

/**
 * alpha_d into out[0 .. 2k): from the positive-sequence response x1 (real xr, imaginary xi, factor order, column c
 * of a block of `stride` columns) and the device's own change dc.
 */
export function negativeAlpha(nc: NegativeCorrection, xr: Float64Array, xi: Float64Array, stride: number, c: number, dc: number[] | null, out: Float64Array, at: number): void {
  const k = nc.rank;
  for (let a = 0; a < k; a++) {
    let sr = 0;
    let si = 0;
    for (let b = 0; b < k; b++) {
      const hr = nc.h[(a * k + b) * 2];
      const hi = nc.h[(a * k + b) * 2 + 1];
      const row = nc.rowsG[b] * stride + c;
      sr += hr * xr[row] - hi * xi[row];
      si += hr * xi[row] + hi * xr[row];
    }
    if (dc)
      for (let q = 0; q < dc.length; q += 3) {
        const b = dc[q];
        const pr = nc.ihw[(a * k + b) * 2];
        const pi = nc.ihw[(a * k + b) * 2 + 1];
        sr -= pr * dc[q + 1] - pi * dc[q + 2];
        si -= pr * dc[q + 2] + pi * dc[q + 1];
      }
    out[at + 2 * a] = sr;
    out[at + 2 * a + 1] = si;
  }
}

