import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { complex, inv, matrix, type Complex as MComplex, type Matrix } from "mathjs";
import { minimumDegree } from "../../../src/engine/sparse/minimumDegree.ts";
import { factorLdlt, solveLdlt, solveLdltBlock, type SymmetricTriplets } from "../../../src/engine/sparse/ldlt.ts";

/** A random connected network admittance matrix: a tree of fourth-quadrant branches, extra meshes, one shunt. */
function randomNetwork(n: number, vals: number[]): { t: SymmetricTriplets; nb: number[][]; dense: MComplex[][] } {
  const t: SymmetricTriplets = { n, row: [], col: [], re: [], im: [] };
  const nb: number[][] = Array.from({ length: n }, () => []);
  const dense: MComplex[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => complex(0, 0)));
  let v = 0;
  const next = () => vals[v++ % vals.length];
  const stamp = (i: number, j: number, yr: number, yi: number) => {
    dense[i][j] = complex(dense[i][j].re + yr, dense[i][j].im + yi);
  };
  const branch = (i: number, j: number) => {
    const r = 0.01 + next();
    const x = 0.05 + next();
    const m = r * r + x * x;
    const yr = r / m;
    const yi = -x / m;
    t.row.push(i, j, j);
    t.col.push(i, j, i);
    t.re.push(yr, yr, -yr);
    t.im.push(yi, yi, -yi);
    nb[i].push(j);
    nb[j].push(i);
    stamp(i, i, yr, yi);
    stamp(j, j, yr, yi);
    stamp(i, j, -yr, -yi);
    stamp(j, i, -yr, -yi);
  };
  for (let i = 1; i < n; i++) branch(i, Math.floor(next() * i));
  for (let e = 0; e < n / 4; e++) {
    const a = Math.floor(next() * n);
    const b = Math.floor(next() * n);
    if (a !== b) branch(a, b);
  }
  t.row.push(0);
  t.col.push(0);
  t.re.push(0.5);
  t.im.push(-5);
  stamp(0, 0, 0.5, -5);
  return { t, nb, dense };
}

describe("block solve of several right-hand sides on one LDL^T factor", () => {
  it("gives each column exactly the single-vector solve, which matches a dense mathjs inverse", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 30 }),
        fc.integer({ min: 1, max: 9 }),
        fc.array(fc.double({ min: 0, max: 0.999, noNaN: true }), { minLength: 5, maxLength: 40 }),
        (n, m, vals) => {
          const { t, nb, dense } = randomNetwork(n, vals);
          const ordering = minimumDegree(n, nb);
          const f = factorLdlt(t, ordering);
          const zDense = inv(matrix(dense)) as Matrix; // independent computation: mathjs dense inverse
          // Column c: a device-like combination y (e_a - e_b) with a = c mod n, b = (3c + 1) mod n, plus a zero column.
          const xr = new Float64Array(n * m);
          const xi = new Float64Array(n * m);
          const rhs: { a: number; b: number; yr: number; yi: number }[] = [];
          for (let c = 0; c < m; c++) {
            const a = c % n;
            const b = (3 * c + 1) % n;
            const yr = c === m - 1 && m > 1 ? 0 : 1 + c;
            const yi = c === m - 1 && m > 1 ? 0 : -2 - c;
            rhs.push({ a, b, yr, yi });
            xr[ordering.inv[a] * m + c] += yr;
            xi[ordering.inv[a] * m + c] += yi;
            xr[ordering.inv[b] * m + c] -= yr;
            xi[ordering.inv[b] * m + c] -= yi;
          }
          solveLdltBlock(f, xr, xi, m);
          rhs.forEach(({ a, b, yr, yi }, c) => {
            const sr = new Float64Array(n);
            const si = new Float64Array(n);
            sr[a] += yr;
            si[a] += yi;
            sr[b] -= yr;
            si[b] -= yi;
            solveLdlt(f, sr, si, false);
            for (let i = 0; i < n; i++) {
              const o = ordering.inv[i] * m + c;
              // the same operations in the same order: equal to the bit (up to the sign of an exact zero)
              expect(xr[o] === sr[i]).toBe(true);
              expect(xi[o] === si[i]).toBe(true);
              // Z (y e_a - y e_b) from the dense inverse
              const za = zDense.get([i, a]) as MComplex;
              const zb = zDense.get([i, b]) as MComplex;
              const er = (za.re - zb.re) * yr - (za.im - zb.im) * yi;
              const ei = (za.re - zb.re) * yi + (za.im - zb.im) * yr;
              expect(Math.abs(xr[o] - er)).toBeLessThan(1e-8 * (1 + Math.abs(er)));
              expect(Math.abs(xi[o] - ei)).toBeLessThan(1e-8 * (1 + Math.abs(ei)));
            }
          });
        },
      ),
      { numRuns: 60 },
    );
  });
});
