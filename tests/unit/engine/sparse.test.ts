import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { complex, inv, matrix, multiply, type Complex as MComplex, type Matrix } from "mathjs";
import { minimumDegree } from "../../../src/engine/sparse/minimumDegree.ts";
import { factorLdlt, solveLdlt, type SymmetricTriplets } from "../../../src/engine/sparse/ldlt.ts";
import { inverseSubset } from "../../../src/engine/sparse/takahashi.ts";

/** A random connected network's admittance matrix (branches in the fourth quadrant plus a shunt). */
function randomNetwork(n: number, extra: number[], seedVals: number[]): { t: SymmetricTriplets; nb: number[][]; dense: MComplex[][] } {
  const t: SymmetricTriplets = { n, row: [], col: [], re: [], im: [] };
  const nb: number[][] = Array.from({ length: n }, () => []);
  const dense: MComplex[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => complex(0, 0)));
  let v = 0;
  const next = () => seedVals[v++ % seedVals.length];
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
    dense[i][i] = complex(dense[i][i].re + yr, dense[i][i].im + yi);
    dense[j][j] = complex(dense[j][j].re + yr, dense[j][j].im + yi);
    dense[i][j] = complex(dense[i][j].re - yr, dense[i][j].im - yi);
    dense[j][i] = complex(dense[j][i].re - yr, dense[j][i].im - yi);
  };
  for (let i = 1; i < n; i++) branch(i, Math.floor(next() * i));
  for (let e = 0; e + 1 < extra.length; e += 2) {
    const a = Math.floor(extra[e] * n);
    const b = Math.floor(extra[e + 1] * n);
    if (a !== b) branch(a, b);
  }
  t.row.push(0);
  t.col.push(0);
  t.re.push(0.5);
  t.im.push(-5);
  dense[0][0] = complex(dense[0][0].re + 0.5, dense[0][0].im - 5);
  return { t, nb, dense };
}

describe("sparse complex LDL^T with minimum-degree ordering", () => {
  it("solves random network matrices like a dense mathjs inverse", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 25 }),
        fc.array(fc.double({ min: 0, max: 0.999, noNaN: true }), { minLength: 0, maxLength: 20 }),
        fc.array(fc.double({ min: 0, max: 0.999, noNaN: true }), { minLength: 5, maxLength: 40 }),
        (n, extra, vals) => {
          const { t, nb, dense } = randomNetwork(n, extra, vals);
          const f = factorLdlt(t, minimumDegree(n, nb));
          const zDense = inv(matrix(dense)) as Matrix; // independent computation: mathjs dense inverse
          const k = n - 1;
          const re = new Float64Array(n);
          const im = new Float64Array(n);
          re[k] = 1;
          solveLdlt(f, re, im);
          const col = multiply(zDense, matrix(Array.from({ length: n }, (_, i) => complex(i === k ? 1 : 0, 0)))) as Matrix;
          for (let i = 0; i < n; i++) {
            const z = col.get([i]) as MComplex;
            expect(Math.abs(re[i] - z.re)).toBeLessThan(1e-9 * (1 + Math.abs(z.re)));
            expect(Math.abs(im[i] - z.im)).toBeLessThan(1e-9 * (1 + Math.abs(z.im)));
          }
          // Takahashi's subset: every diagonal entry and every branch pair.
          const sub = inverseSubset(f);
          for (let i = 0; i < n; i++) {
            const z = zDense.get([i, i]) as MComplex;
            expect(Math.abs(sub.re[i] - z.re)).toBeLessThan(1e-9 * (1 + Math.abs(z.re)));
            expect(Math.abs(sub.im[i] - z.im)).toBeLessThan(1e-9 * (1 + Math.abs(z.im)));
            for (const j of nb[i]) {
              const e = sub.entry(i, j);
              const zij = zDense.get([i, j]) as MComplex;
              expect(e).not.toBeNull();
              expect(Math.abs(e!.re - zij.re)).toBeLessThan(1e-9 * (1 + Math.abs(zij.re)));
              expect(Math.abs(e!.im - zij.im)).toBeLessThan(1e-9 * (1 + Math.abs(zij.im)));
            }
          }
        },
      ),
      { numRuns: 60, seed: 42 },
    );
  });

  it("creates no fill on a tree", () => {
    // A path graph ordered by minimum degree eliminates leaves first: nnz(L) = n - 1 (graph theory of elimination).
    const n = 50;
    const nb = Array.from({ length: n }, (_, i) => [i - 1, i + 1].filter((j) => j >= 0 && j < n));
    expect(minimumDegree(n, nb).rowIdx.length).toBe(n - 1);
  });

  it("reports a vanishing pivot instead of returning NaN", () => {
    const t: SymmetricTriplets = { n: 2, row: [0, 1, 1], col: [0, 1, 0], re: [1, 1, -1], im: [0, 0, 0] };
    expect(() => factorLdlt(t, minimumDegree(2, [[1], [0]]))).toThrow(/singular/); // [[1,-1],[-1,1]] is singular
  });
});
