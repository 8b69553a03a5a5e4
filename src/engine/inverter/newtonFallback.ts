// Fallback for the inverter iteration when the damped fixed point stalls: Newton's method on F(z) = T(z) - z over
// the real and imaginary parts of every unit's injections (4J unknowns, a small dense system), with a numerical
// Jacobian and a backtracking line search on the largest residual.

/** Dense real solve A x = b by Gaussian elimination with partial pivoting; null when singular. */
export function denseSolve(a: Float64Array, b: Float64Array, m: number): Float64Array | null {
  const A = a.slice();
  const x = b.slice();
  for (let c = 0; c < m; c++) {
    let p = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(A[r * m + c]) > Math.abs(A[p * m + c])) p = r;
    if (!(Math.abs(A[p * m + c]) > 1e-300)) return null;
    if (p !== c) {
      for (let k = 0; k < m; k++) [A[c * m + k], A[p * m + k]] = [A[p * m + k], A[c * m + k]];
      [x[c], x[p]] = [x[p], x[c]];
    }
    for (let r = c + 1; r < m; r++) {
      const f = A[r * m + c] / A[c * m + c];
      if (f === 0) continue;
      for (let k = c; k < m; k++) A[r * m + k] -= f * A[c * m + k];
      x[r] -= f * x[c];
    }
  }
  for (let c = m - 1; c >= 0; c--) {
    let s = x[c];
    for (let k = c + 1; k < m; k++) s -= A[c * m + k] * x[k];
    x[c] = s / A[c * m + c];
  }
  return x;
}

/**
 * Newton iterations from z0. `residual(z)` returns F(z) (length m) and `norm(F)` the convergence measure.
 * `scale[i]` sets the finite-difference step of unknown i. Returns the best point found.
 */
export function newtonSolve(
  z0: Float64Array,
  residual: (z: Float64Array) => Float64Array,
  norm: (f: Float64Array) => number,
  scale: Float64Array,
  tolerance: number,
  maxSteps = 60,
): { z: Float64Array; norm: number; steps: number } {
  const m = z0.length;
  let z = z0.slice();
  let f = residual(z);
  let nf = norm(f);
  let steps = 0;
  for (; steps < maxSteps && nf >= tolerance; steps++) {
    const jac = new Float64Array(m * m);
    for (let c = 0; c < m; c++) {
      const h = 1e-7 * scale[c];
      const zc = z.slice();
      zc[c] += h;
      const fc = residual(zc);
      for (let r = 0; r < m; r++) jac[r * m + c] = (fc[r] - f[r]) / h;
    }
    const rhs = f.map((v) => -v);
    const dz = denseSolve(jac, rhs, m);
    if (!dz) break;
    let step = 1;
    let improved = false;
    for (let k = 0; k < 30; k++) {
      const zt = z.map((v, i) => v + step * dz[i]);
      const ft = residual(zt);
      const nt = norm(ft);
      if (nt < nf) {
        z = zt;
        f = ft;
        nf = nt;
        improved = true;
        break;
      }
      step /= 2;
    }
    if (!improved) break;
  }
  return { z, norm: nf, steps };
}
