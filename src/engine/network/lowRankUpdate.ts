// A sequence network changed at a few nodes G (element ends opened, reference shunts of parts left floating):
// A' = A + E D E^T with D small (m x m, complex symmetric, possibly singular). By the Woodbury identity
//   Z' = Z - W H W^T,   W = Z E (n x m),   H = (I + D W_G)^-1 D,   W_G = E^T Z E,
// so Z' b costs one solve with the unchanged factor of A plus O(n m). I + D W_G is regular exactly when A' is
// (det A' = det A det(I + D W_G)); the caller keeps A' regular the way a fresh factorization would (a 1 pu reference
// shunt in every part with no shunt path).

/** The correction Z' = Z - W H W^T kept with a sequence system. */
export interface LowRankUpdate {
  /** m: the number of nodes where the matrix changed. */
  rank: number;
  /** Those nodes (original indices). */
  nodes: Int32Array;
  /** W = Z E: column h at [h * n + i], real and imaginary parts. */
  wre: Float64Array;
  wim: Float64Array;
  /** H, [(a * m + b) * 2 + re/im]. */
  h: Float64Array;
  /**
   * D itself (same layout) when the result is refined: opening a very stiff element (a protected breaker's 1e-5 pu)
   * leaves Z' as the difference of nearly equal base columns, so each solve gets residual steps on A' = A + E D E^T.
   */
  refineWith?: Float64Array;
}

/** Refinement steps for a stiff update (each: a residual on A', a solve and the correction). */
const REFINE_STEPS = 2;

/**
 * x <- x + Z'(b - A' x), REFINE_STEPS times, where `solve` applies Z' (the base solve and the update) and A' is the
 * factor's own matrix (lower storage, permuted) plus E D E^T.
 */
export function refineLowRank(
  u: LowRankUpdate,
  f: { n: number; aPtr: Int32Array; aRow: Int32Array; aRe: Float64Array; aIm: Float64Array; ordering: { perm: Int32Array } },
  bre: Float64Array,
  bim: Float64Array,
  xre: Float64Array,
  xim: Float64Array,
  solve: (rre: Float64Array, rim: Float64Array) => { re: Float64Array; im: Float64Array },
): void {
  const d = u.refineWith;
  if (!d) return;
  const { n, aPtr, aRow, aRe, aIm } = f;
  const perm = f.ordering.perm;
  const m = u.rank;
  const pr = new Float64Array(n);
  const pi = new Float64Array(n);
  const rr = new Float64Array(n);
  const ri = new Float64Array(n);
  for (let step = 0; step < REFINE_STEPS; step++) {
    for (let k = 0; k < n; k++) {
      pr[k] = xre[perm[k]];
      pi[k] = xim[perm[k]];
      rr[k] = bre[perm[k]];
      ri[k] = bim[perm[k]];
    }
    for (let j = 0; j < n; j++)
      for (let p = aPtr[j]; p < aPtr[j + 1]; p++) {
        const i = aRow[p];
        const ar = aRe[p];
        const ai = aIm[p];
        rr[i] -= ar * pr[j] - ai * pi[j];
        ri[i] -= ar * pi[j] + ai * pr[j];
        if (i !== j) {
          rr[j] -= ar * pr[i] - ai * pi[i];
          ri[j] -= ar * pi[i] + ai * pr[i];
        }
      }
    // back to original order, then the E D E^T part at the nodes G
    const or = new Float64Array(n);
    const oi = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      or[perm[k]] = rr[k];
      oi[perm[k]] = ri[k];
    }
    for (let a = 0; a < m; a++)
      for (let b = 0; b < m; b++) {
        const dr = d[(a * m + b) * 2];
        const di = d[(a * m + b) * 2 + 1];
        if (dr === 0 && di === 0) continue;
        const xr = xre[u.nodes[b]];
        const xi = xim[u.nodes[b]];
        or[u.nodes[a]] -= dr * xr - di * xi;
        oi[u.nodes[a]] -= dr * xi + di * xr;
      }
    const dx = solve(or, oi);
    for (let i = 0; i < n; i++) {
      xre[i] += dx.re[i];
      xim[i] += dx.im[i];
    }
  }
}

/** x <- x - W H W^T b, for x = Z b already computed (b given separately). */
export function applyLowRank(u: LowRankUpdate, bre: Float64Array, bim: Float64Array, xre: Float64Array, xim: Float64Array): void {
  const m = u.rank;
  const n = xre.length;
  const yr = new Float64Array(m);
  const yi = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    const o = a * n;
    let sr = 0;
    let si = 0;
    for (let i = 0; i < n; i++) {
      const br = bre[i];
      const bi = bim[i];
      if (br === 0 && bi === 0) continue;
      const wr = u.wre[o + i];
      const wi = u.wim[o + i];
      sr += wr * br - wi * bi;
      si += wr * bi + wi * br;
    }
    yr[a] = sr;
    yi[a] = si;
  }
  subtractW(u, yr, yi, xre, xim);
}

/** x <- x - W H W[k, :]^T: the correction of column k of Z (W^T e_k is row k of W). */
export function applyLowRankColumn(u: LowRankUpdate, k: number, xre: Float64Array, xim: Float64Array): void {
  const m = u.rank;
  const n = xre.length;
  const yr = new Float64Array(m);
  const yi = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    yr[a] = u.wre[a * n + k];
    yi[a] = u.wim[a * n + k];
  }
  subtractW(u, yr, yi, xre, xim);
}

function subtractW(u: LowRankUpdate, yr: Float64Array, yi: Float64Array, xre: Float64Array, xim: Float64Array): void {
  const m = u.rank;
  const n = xre.length;
  for (let a = 0; a < m; a++) {
    let zr = 0;
    let zi = 0;
    for (let b = 0; b < m; b++) {
      const hr = u.h[(a * m + b) * 2];
      const hi = u.h[(a * m + b) * 2 + 1];
      zr += hr * yr[b] - hi * yi[b];
      zi += hr * yi[b] + hi * yr[b];
    }
    if (zr === 0 && zi === 0) continue;
    const o = a * n;
    for (let i = 0; i < n; i++) {
      const wr = u.wre[o + i];
      const wi = u.wim[o + i];
      xre[i] -= wr * zr - wi * zi;
      xim[i] -= wr * zi + wi * zr;
    }
  }
}

/** Inverse of a small complex matrix [(a * m + b) * 2 + re/im] (Gauss-Jordan, partial pivoting); null when singular. */
export function smallComplexInverse(mat: Float64Array, m: number): Float64Array | null {
  const a = mat.slice();
  const r = new Float64Array(m * m * 2);
  for (let i = 0; i < m; i++) r[(i * m + i) * 2] = 1;
  const at = (i: number, j: number) => (i * m + j) * 2;
  for (let col = 0; col < m; col++) {
    let piv = col;
    let best = -1;
    for (let i = col; i < m; i++) {
      const v = Math.hypot(a[at(i, col)], a[at(i, col) + 1]);
      if (v > best) {
        best = v;
        piv = i;
      }
    }
    if (!(best > 0)) return null;
    if (piv !== col)
      for (const x of [a, r])
        for (let j = 0; j < m; j++)
          for (let t = 0; t < 2; t++) {
            const tmp = x[at(col, j) + t];
            x[at(col, j) + t] = x[at(piv, j) + t];
            x[at(piv, j) + t] = tmp;
          }
    const pr = a[at(col, col)];
    const pi = a[at(col, col) + 1];
    const p2 = pr * pr + pi * pi;
    const ir = pr / p2;
    const ii = -pi / p2;
    for (const x of [a, r])
      for (let j = 0; j < m; j++) {
        const o = at(col, j);
        const vr = x[o];
        const vi = x[o + 1];
        x[o] = vr * ir - vi * ii;
        x[o + 1] = vr * ii + vi * ir;
      }
    for (let i = 0; i < m; i++) {
      if (i === col) continue;
      const fr = a[at(i, col)];
      const fi = a[at(i, col) + 1];
      if (fr === 0 && fi === 0) continue;
      for (const x of [a, r])
        for (let j = 0; j < m; j++) {
          const o = at(i, j);
          const q = at(col, j);
          x[o] -= fr * x[q] - fi * x[q + 1];
          x[o + 1] -= fr * x[q + 1] + fi * x[q];
        }
    }
  }
  return r;
}
