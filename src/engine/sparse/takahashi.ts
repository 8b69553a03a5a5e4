// Sparse subset of the inverse (Takahashi's equations) on an LDL^T factor: every diagonal entry Z_kk, i.e. every
// bus's driving-point impedance, without N solves. For A = L D L^T with unit lower L:
//   Z_ij = -sum_{k in pat(j)} Z_ik L_kj   (i in pat(j))
//   Z_jj = 1/d_j - sum_{k in pat(j)} L_kj Z_kj
// computed for j from n-1 down to 0; pat(j) is a clique of the filled graph, so every Z_ik needed is in the subset.
import type { LdltFactor } from "./ldlt.ts";

export interface InverseSubset {
  /** Diagonal of A^-1 in original indices. */
  re: Float64Array;
  im: Float64Array;
  /** Entry (i, j) of A^-1 (original indices) when it lies on the factor's pattern, else null. */
  entry(i: number, j: number): { re: number; im: number } | null;
}

/** Diagonal of A^-1 in original indices, as separate re/im arrays. */
export function inverseDiagonal(f: LdltFactor): { re: Float64Array; im: Float64Array } {
  const s = inverseSubset(f);
  return { re: s.re, im: s.im };
}

/** The sparse subset of A^-1 on the pattern of L + L^T (includes every branch's pair of nodes). */
export function inverseSubset(f: LdltFactor): InverseSubset {
  const { n, lre, lim, dre, dim } = f;
  const { perm, colPtr, rowIdx } = f.ordering;
  const zre = new Float64Array(lre.length);
  const zim = new Float64Array(lre.length);
  const dgr = new Float64Array(n);
  const dgi = new Float64Array(n);
  const pos = new Int32Array(n).fill(-1);
  let maxCol = 0;
  for (let j = 0; j < n; j++) maxCol = Math.max(maxCol, colPtr[j + 1] - colPtr[j]);
  const acr = new Float64Array(maxCol);
  const aci = new Float64Array(maxCol);
  for (let j = n - 1; j >= 0; j--) {
    const p0 = colPtr[j];
    const p1 = colPtr[j + 1];
    // Z_ij for each i in pat(j): -sum_k Z_ik L_kj over k in pat(j). Each pair (i < k) is read once from column i
    // (where Z_ki is stored) and used for both sums, by symmetry.
    for (let a = p0; a < p1; a++) {
      acr[a - p0] = 0;
      aci[a - p0] = 0;
    }
    for (let a = p0; a < p1; a++) {
      const i = rowIdx[a];
      for (let p = colPtr[i]; p < colPtr[i + 1]; p++) pos[rowIdx[p]] = p;
      // diagonal term k = i
      acr[a - p0] += dgr[i] * lre[a] - dgi[i] * lim[a];
      aci[a - p0] += dgr[i] * lim[a] + dgi[i] * lre[a];
      for (let b = a + 1; b < p1; b++) {
        const q = pos[rowIdx[b]];
        const zr = zre[q];
        const zi = zim[q];
        acr[a - p0] += zr * lre[b] - zi * lim[b];
        aci[a - p0] += zr * lim[b] + zi * lre[b];
        acr[b - p0] += zr * lre[a] - zi * lim[a];
        aci[b - p0] += zr * lim[a] + zi * lre[a];
      }
      for (let p = colPtr[i]; p < colPtr[i + 1]; p++) pos[rowIdx[p]] = -1;
    }
    for (let a = p0; a < p1; a++) {
      zre[a] = -acr[a - p0];
      zim[a] = -aci[a - p0];
    }
    const m = dre[j] * dre[j] + dim[j] * dim[j];
    let r = dre[j] / m;
    let i = -dim[j] / m;
    for (let a = p0; a < p1; a++) {
      r -= lre[a] * zre[a] - lim[a] * zim[a];
      i -= lre[a] * zim[a] + lim[a] * zre[a];
    }
    dgr[j] = r;
    dgi[j] = i;
  }
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    re[perm[k]] = dgr[k];
    im[perm[k]] = dgi[k];
  }
  const { inv } = f.ordering;
  const entry = (i: number, j: number) => {
    let a = inv[i];
    let b = inv[j];
    if (a === b) return { re: dgr[a], im: dgi[a] };
    if (a > b) [a, b] = [b, a];
    let lo = colPtr[a];
    let hi = colPtr[a + 1] - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      const r = rowIdx[mid];
      if (r === b) return { re: zre[mid], im: zim[mid] };
      if (r < b) lo = mid + 1;
      else hi = mid - 1;
    }
    return null;
  };
  return { re, im, entry };
}
