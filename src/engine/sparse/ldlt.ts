// Complex symmetric LDL^T factorisation (no pivoting) on typed arrays. Sequence admittance matrices are complex
// symmetric with every stamp in the closed fourth quadrant; rotated by +45 degrees their real part is positive
// definite once each connected part has a shunt, so every leading minor is non-singular and no pivoting is needed.
import type { Ordering } from "./minimumDegree.ts";

/** A symmetric sparse matrix in original indices: lower triangle incl. diagonal as coordinate triplets (summed). */
export interface SymmetricTriplets {
  n: number;
  row: number[];
  col: number[];
  re: number[];
  im: number[];
}

export interface LdltFactor {
  n: number;
  ordering: Ordering;
  /** The permuted matrix itself (lower CSC incl. diagonal), kept for iterative refinement. */
  aPtr: Int32Array;
  aRow: Int32Array;
  aRe: Float64Array;
  aIm: Float64Array;
  lre: Float64Array;
  lim: Float64Array;
  dre: Float64Array;
  dim: Float64Array;
}

/** Numeric factorisation on the ordering's pattern. Throws with the pivot index when a pivot vanishes. */
/** A zero, NaN or overflowing pivot: the matrix is singular (or beyond floating point) at `node` (original index). */
export class SingularPivot extends Error {
  readonly node: number;
  constructor(node: number) {
    super(`singular pivot at node ${node}`);
    this.node = node;
    this.name = "SingularPivot";
  }
}

export function factorLdlt(a: SymmetricTriplets, ordering: Ordering): LdltFactor {
  const { n } = a;
  const { inv, colPtr, rowIdx } = ordering;
  // Permuted lower CSC of A: column j holds rows >= j.
  const cnt = new Int32Array(n + 1);
  const pr: number[] = [];
  const pc: number[] = [];
  for (let t = 0; t < a.row.length; t++) {
    let i = inv[a.row[t]];
    let j = inv[a.col[t]];
    if (i < j) [i, j] = [j, i];
    pr.push(i);
    pc.push(j);
    cnt[j + 1]++;
  }
  for (let j = 0; j < n; j++) cnt[j + 1] += cnt[j];
  const aPtr = cnt.slice();
  const aRow = new Int32Array(pr.length);
  const aRe = new Float64Array(pr.length);
  const aIm = new Float64Array(pr.length);
  const fill = cnt.slice();
  for (let t = 0; t < pr.length; t++) {
    const p = fill[pc[t]]++;
    aRow[p] = pr[t];
    aRe[p] = a.re[t];
    aIm[p] = a.im[t];
  }
  // Row lists of L: for row j, the columns k < j holding it, and the position inside column k.
  const rowCnt = new Int32Array(n + 1);
  for (let p = 0; p < rowIdx.length; p++) rowCnt[rowIdx[p] + 1]++;
  for (let j = 0; j < n; j++) rowCnt[j + 1] += rowCnt[j];
  const rCol = new Int32Array(rowIdx.length);
  const rPos = new Int32Array(rowIdx.length);
  const rFill = rowCnt.slice();
  for (let k = 0; k < n; k++) {
    for (let p = colPtr[k]; p < colPtr[k + 1]; p++) {
      const q = rFill[rowIdx[p]]++;
      rCol[q] = k;
      rPos[q] = p;
    }
  }
  const lre = new Float64Array(rowIdx.length);
  const lim = new Float64Array(rowIdx.length);
  const dre = new Float64Array(n);
  const dim = new Float64Array(n);
  const wre = new Float64Array(n);
  const wim = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = aPtr[j]; p < aPtr[j + 1]; p++) {
      wre[aRow[p]] += aRe[p];
      wim[aRow[p]] += aIm[p];
    }
    for (let q = rowCnt[j]; q < rowCnt[j + 1]; q++) {
      const k = rCol[q];
      const p0 = rPos[q];
      // f = L_jk * d_k
      const fr = lre[p0] * dre[k] - lim[p0] * dim[k];
      const fi = lre[p0] * dim[k] + lim[p0] * dre[k];
      wre[j] -= lre[p0] * fr - lim[p0] * fi;
      wim[j] -= lre[p0] * fi + lim[p0] * fr;
      for (let p = p0 + 1; p < colPtr[k + 1]; p++) {
        const i = rowIdx[p];
        wre[i] -= lre[p] * fr - lim[p] * fi;
        wim[i] -= lre[p] * fi + lim[p] * fr;
      }
    }
    const dr = wre[j];
    const di = wim[j];
    const mag2 = dr * dr + di * di;
    if (!(mag2 > 0) || !Number.isFinite(mag2)) throw new SingularPivot(ordering.perm[j]);
    dre[j] = dr;
    dim[j] = di;
    wre[j] = 0;
    wim[j] = 0;
    const ir = dr / mag2;
    const ii = -di / mag2;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowIdx[p];
      lre[p] = wre[i] * ir - wim[i] * ii;
      lim[p] = wre[i] * ii + wim[i] * ir;
      wre[i] = 0;
      wim[i] = 0;
    }
  }
  return { n, ordering, aPtr, aRow, aRe, aIm, lre, lim, dre, dim };
}

/**
 * Solves A x = b in place (b given in original indices, separate re/im arrays), with one step of iterative
 * refinement: without pivoting, a very short branch next to long ones costs digits that the residual step restores.
 * `refine = false` skips it where speed matters more (the sweep's per-device solves on bus-only networks).
 */
export function solveLdlt(f: LdltFactor, bre: Float64Array, bim: Float64Array, refine = true): void {
  const { n, aPtr, aRow, aRe, aIm } = f;
  const { perm } = f.ordering;
  if (!refine) {
    const xr = new Float64Array(n);
    const xi = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      xr[k] = bre[perm[k]];
      xi[k] = bim[perm[k]];
    }
    solvePermuted(f, xr, xi);
    for (let k = 0; k < n; k++) {
      bre[perm[k]] = xr[k];
      bim[perm[k]] = xi[k];
    }
    return;
  }
  const br = new Float64Array(n);
  const bi = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    br[k] = bre[perm[k]];
    bi[k] = bim[perm[k]];
  }
  const xr = br.slice();
  const xi = bi.slice();
  solvePermuted(f, xr, xi);
  // r = b - A x (symmetric, lower storage)
  const rr = br;
  const ri = bi;
  for (let j = 0; j < n; j++) {
    for (let p = aPtr[j]; p < aPtr[j + 1]; p++) {
      const i = aRow[p];
      const ar = aRe[p];
      const ai = aIm[p];
      rr[i] -= ar * xr[j] - ai * xi[j];
      ri[i] -= ar * xi[j] + ai * xr[j];
      if (i !== j) {
        rr[j] -= ar * xr[i] - ai * xi[i];
        ri[j] -= ar * xi[i] + ai * xr[i];
      }
    }
  }
  solvePermuted(f, rr, ri);
  for (let k = 0; k < n; k++) {
    bre[perm[k]] = xr[k] + rr[k];
    bim[perm[k]] = xi[k] + ri[k];
  }
}

/** Forward, diagonal and backward substitution on a right-hand side already in permuted order. */
function solvePermuted(f: LdltFactor, xr: Float64Array, xi: Float64Array): void {
  const { n, lre, lim, dre, dim } = f;
  const { colPtr, rowIdx } = f.ordering;
  for (let k = 0; k < n; k++) {
    const r = xr[k];
    const i = xi[k];
    if (r === 0 && i === 0) continue;
    for (let p = colPtr[k]; p < colPtr[k + 1]; p++) {
      const row = rowIdx[p];
      xr[row] -= lre[p] * r - lim[p] * i;
      xi[row] -= lre[p] * i + lim[p] * r;
    }
  }
  for (let k = 0; k < n; k++) {
    const m = dre[k] * dre[k] + dim[k] * dim[k];
    const r = (xr[k] * dre[k] + xi[k] * dim[k]) / m;
    const i = (xi[k] * dre[k] - xr[k] * dim[k]) / m;
    xr[k] = r;
    xi[k] = i;
  }
  for (let k = n - 1; k >= 0; k--) {
    let r = xr[k];
    let i = xi[k];
    for (let p = colPtr[k]; p < colPtr[k + 1]; p++) {
      const row = rowIdx[p];
      r -= lre[p] * xr[row] - lim[p] * xi[row];
      i -= lre[p] * xi[row] + lim[p] * xr[row];
    }
    xr[k] = r;
    xi[k] = i;
  }
}

/**
 * Solves A X = B for m right-hand sides at once, without refinement, on blocks already in permuted order and laid out
 * row-major: entry (k, c) at k * m + c. Each column goes through exactly the operations of `solveLdlt(.., false)`
 * (same order, same zero skips), so its result is the same to the bit; the block layout makes the scattered row
 * accesses of the substitutions fetch all m columns at once.
 */
export function solveLdltBlock(f: LdltFactor, xr: Float64Array, xi: Float64Array, m: number): void {
  const { n, lre, lim, dre, dim } = f;
  const { colPtr, rowIdx } = f.ordering;
  // Loops run entry-major, column-minor: per column the updates happen in the same order as in solvePermuted.
  for (let k = 0; k < n; k++) {
    const ok = k * m;
    for (let p = colPtr[k]; p < colPtr[k + 1]; p++) {
      const o = rowIdx[p] * m;
      const lr = lre[p];
      const li = lim[p];
      for (let c = 0; c < m; c++) {
        const r = xr[ok + c];
        const i = xi[ok + c];
        if (r === 0 && i === 0) continue;
        xr[o + c] -= lr * r - li * i;
        xi[o + c] -= lr * i + li * r;
      }
    }
  }
  for (let k = 0; k < n; k++) {
    const d2 = dre[k] * dre[k] + dim[k] * dim[k];
    const dr = dre[k];
    const di = dim[k];
    const ok = k * m;
    for (let c = 0; c < m; c++) {
      const a = xr[ok + c];
      const b = xi[ok + c];
      xr[ok + c] = (a * dr + b * di) / d2;
      xi[ok + c] = (b * dr - a * di) / d2;
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const ok = k * m;
    for (let p = colPtr[k]; p < colPtr[k + 1]; p++) {
      const o = rowIdx[p] * m;
      const lr = lre[p];
      const li = lim[p];
      for (let c = 0; c < m; c++) {
        xr[ok + c] -= lr * xr[o + c] - li * xi[o + c];
        xi[ok + c] -= lr * xi[o + c] + li * xr[o + c];
      }
    }
  }
}
