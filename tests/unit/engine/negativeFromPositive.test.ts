import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { complex, inv, matrix, type Complex as MComplex, type Matrix } from "mathjs";
import { minimumDegree } from "../../../src/engine/sparse/minimumDegree.ts";
import { factorLdlt, solveLdltBlock, type SymmetricTriplets } from "../../../src/engine/sparse/ldlt.ts";
import { negativeAlpha, negativeCorrection, MAX_NEGATIVE_RANK } from "../../../src/engine/fault/negativeFromPositive.ts";
import type { Combination } from "../../../src/engine/fault/deviceCombination.ts";

/** A random connected network (tree plus meshes, fourth-quadrant branches) with a shunt at each node in `shunts`. */
function network(n: number, vals: number[], shunts: Map<number, [number, number]>): { t: SymmetricTriplets; nb: number[][]; dense: MComplex[][] } {
  const t: SymmetricTriplets = { n, row: [], col: [], re: [], im: [] };
  const nb: number[][] = Array.from({ length: n }, () => []);
  const dense: MComplex[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => complex(0, 0)));
  let v = 0;
  const next = () => vals[v++ % vals.length];
  const stamp = (i: number, j: number, yr: number, yi: number) => (dense[i][j] = complex(dense[i][j].re + yr, dense[i][j].im + yi));
  const branch = (i: number, j: number) => {
    const r = 0.01 + next();
    const x = 0.05 + next();
    const m = r * r + x * x;
    t.row.push(i, j, j);
    t.col.push(i, j, i);
    t.re.push(r / m, r / m, -r / m);
    t.im.push(-x / m, -x / m, x / m);
    nb[i].push(j);
    nb[j].push(i);
    stamp(i, i, r / m, -x / m);
    stamp(j, j, r / m, -x / m);
    stamp(i, j, -r / m, x / m);
    stamp(j, i, -r / m, x / m);
  };
  for (let i = 1; i < n; i++) branch(i, Math.floor(next() * i));
  for (let e = 0; e < n / 4; e++) {
    const a = Math.floor(next() * n);
    const b = Math.floor(next() * n);
    if (a !== b) branch(a, b);
  }
  for (const [node, [yr, yi]] of shunts) {
    t.row.push(node);
    t.col.push(node);
    t.re.push(yr);
    t.im.push(yi);
    stamp(node, node, yr, yi);
  }
  return { t, nb, dense };
}

const term = (nodes: number[], re: number[], im: number[]) => ({ nodes, re, im });

describe("negative-sequence responses from the positive-sequence factor (Woodbury identity)", () => {
  it("equal Z2 c2 from a dense mathjs inverse of the negative-sequence matrix", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 25 }),
        fc.integer({ min: 1, max: MAX_NEGATIVE_RANK }),
        fc.array(fc.double({ min: 0, max: 0.999, noNaN: true }), { minLength: 6, maxLength: 40 }),
        (n, k, vals) => {
          // Positive: machine admittances 1/(j X"d) at k nodes; negative: 1/(j X2) there instead (X2 != X"d).
          const nodes = Array.from({ length: k }, (_, h) => (h * 7 + 1) % n).filter((x, i, a) => a.indexOf(x) === i);
          const s1 = new Map(nodes.map((x, h) => [x, [0.2, -5 - h] as [number, number]]));
          const s2 = new Map(nodes.map((x, h) => [x, [0.25, -4 - 0.5 * h] as [number, number]]));
          const p1 = network(n, vals, s1);
          const p2 = network(n, vals, s2);
          const ordering = minimumDegree(n, p1.nb);
          const f1 = factorLdlt(p1.t, ordering);
          const f2 = factorLdlt(p2.t, ordering);
          // Devices: a branch-like combination (same in both sequences), and a machine terminal (its own admittance
          // differs between the sequences at its node).
          const a = n - 1;
          const b = (n - 1) >> 1;
          const g = nodes[0];
          const combos: Combination[] = [
            { node: a, bus: "", unit: -1, terms: [term([], [], []), term([a, b], [2, -2], [-3, 3]), term([a, b], [2, -2], [-3, 3])] },
            { node: g, bus: "", unit: -1, terms: [term([], [], []), term([g], [0.2], [-5]), term([g], [0.25], [-4])] },
          ];
          const nc = negativeCorrection(f1, f2, combos);
          expect(nc?.rank).toBe(nodes.length);
          if (!nc) return;
          const z2 = inv(matrix(p2.dense)) as Matrix; // independent computation: mathjs dense inverse
          combos.forEach((combo, d) => {
            // X1 = Z1 c1 on the factor, then X2 = X1 - W alpha
            const xr = new Float64Array(n);
            const xi = new Float64Array(n);
            combo.terms[1].nodes.forEach((node, q) => {
              xr[ordering.inv[node]] += combo.terms[1].re[q];
              xi[ordering.inv[node]] += combo.terms[1].im[q];
            });
            solveLdltBlock(f1, xr, xi, 1);
            const alpha = new Float64Array(2 * nc.rank);
            negativeAlpha(nc, xr, xi, 1, 0, nc.dc[d], alpha, 0);
            for (let i = 0; i < n; i++) {
              const row = ordering.inv[i];
              let vr = xr[row];
              let vi = xi[row];
              for (let h = 0; h < nc.rank; h++) {
                const wr = nc.w[(row * nc.rank + h) * 2];
                const wi = nc.w[(row * nc.rank + h) * 2 + 1];
                vr -= wr * alpha[2 * h] - wi * alpha[2 * h + 1];
                vi -= wr * alpha[2 * h + 1] + wi * alpha[2 * h];
              }
              let er = 0;
              let ei = 0;
              combo.terms[2].nodes.forEach((node, q) => {
                const zz = z2.get([i, node]) as MComplex;
                er += zz.re * combo.terms[2].re[q] - zz.im * combo.terms[2].im[q];
                ei += zz.re * combo.terms[2].im[q] + zz.im * combo.terms[2].re[q];
              });
              const scale = 1 + Math.hypot(er, ei);
              expect(Math.abs(vr - er) / scale).toBeLessThan(1e-9);
              expect(Math.abs(vi - ei) / scale).toBeLessThan(1e-9);
            }
          });
        },
      ),
      { numRuns: 60 },
    );
  });

  it("declines when the networks differ off the diagonal or at too many nodes", () => {
    const vals = [0.3, 0.7, 0.1, 0.5, 0.9, 0.2];
    const n = 12;
    const base = network(n, vals, new Map([[0, [0.2, -5]]]));
    const ordering = minimumDegree(n, base.nb);
    const f1 = factorLdlt(base.t, ordering);
    // A branch with a different negative-sequence admittance: an off-diagonal change.
    const t2 = { ...base.t, re: [...base.t.re], im: [...base.t.im] };
    t2.re[2] *= 1.5;
    expect(negativeCorrection(f1, factorLdlt(t2, ordering), [])).toBeNull();
    // Shunts changed at more nodes than MAX_NEGATIVE_RANK.
    const many = new Map(Array.from({ length: MAX_NEGATIVE_RANK + 1 }, (_, h) => [h, [0.2, -5] as [number, number]]));
    const manyNeg = new Map(Array.from({ length: MAX_NEGATIVE_RANK + 1 }, (_, h) => [h, [0.3, -4] as [number, number]]));
    const a = network(n, vals, many);
    const b = network(n, vals, manyNeg);
    const o = minimumDegree(n, a.nb);
    expect(negativeCorrection(factorLdlt(a.t, o), factorLdlt(b.t, o), [])).toBeNull();
    // Identical networks: rank 0, X2 = X1.
    expect(negativeCorrection(f1, factorLdlt(base.t, ordering), [])?.rank).toBe(0);
  });
});
