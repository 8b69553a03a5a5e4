import { describe, expect, it } from "vitest";
import { compileNetwork, FAULT_TYPES } from "../../../src/engine/index.ts";
import { generateRadialNetwork, GENERATED_SCENARIOS } from "../../../src/model/generateNetwork.ts";
import type { EngineInternal } from "../../../src/engine/fault/solveFault.ts";
import { sequenceSystem, zColumn } from "../../../src/engine/network/sequenceSystem.ts";
import { solveLinearFault, type ComplexVec } from "../../../src/engine/fault/solveLinearFault.ts";
import { compactResponse, compactUnits, unitColumns, type CompactFaultInput } from "../../../src/engine/fault/compactFault.ts";
import { DenseResponse, type AffineMap } from "../../../src/engine/inverter/unitResponse.ts";
import { InjectionWork, iterateInjections } from "../../../src/engine/inverter/refinedIteration.ts";
import type { FaultType } from "../../../src/engine/types.ts";

// The sweep's closed-form response at the converter nodes (V = a + Z_UU x - z G z^T x, unitResponse.ts) against
// the full sparse solution of the three sequence networks with the fault equations (solveLinearFault): an
// independent computation of the same voltages, node by node. Then the Anderson-accelerated iteration's injections
// against the same model solved on the dense map sampled from full network solutions.

const project = generateRadialNetwork({ buses: 120, devices: 20, seed: 77 });
const compiled = compileNetwork(project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
if (!compiled.ok) throw new Error("compile");
const { model, cache } = compiled.network.internal as EngineInternal;
const hasGfm = model.shunts.some((s) => s.refinedOnly);
const variant = hasGfm ? "refined" : "iec";
const sys = [0, 1, 2].map((s) => sequenceSystem(model, cache, s as 0 | 1 | 2, variant)) as Parameters<typeof solveLinearFault>[0]["systems"];
const n = model.nodes.length;
const unitIdx = model.inverters.map((_, g) => g);
const J = unitIdx.length;
const colU = unitColumns(model, cache, variant);
const c = 1.1; // IEC 60909-0:2016, Table 1: cmax above 1 kV

function setup(k: number, type: FaultType) {
  const zk = [0, 1, 2].map((s) => zColumn(sys[s], k)) as [ComplexVec, ComplexVec, ComplexVec];
  const zf = { re: 0, im: 0 };
  const vpre = new Float64Array(n).fill(c);
  const live = new Uint8Array(n).fill(1);
  const full = (inj1: ComplexVec, inj2: ComplexVec) => solveLinearFault({ systems: sys, k, type, zf, vpre, live, zk, inj: [null, inj1, inj2] });
  const cin: CompactFaultInput = {
    model,
    unitIdx,
    colU,
    k,
    type,
    zf,
    c,
    zeroView: { floating: false, e: { re: 0, im: 0 }, z: { re: zk[0].re[k], im: zk[0].im[k] } },
    z1kk: { re: zk[1].re[k], im: zk[1].im[k] },
    z2kk: { re: zk[2].re[k], im: zk[2].im[k] },
  };
  return { full, cin };
}

/** Unit-node voltages of the full solution for per-unit injections x (compact order). */
function fullVoltages(full: ReturnType<typeof setup>["full"], x1: ComplexVec, x2: ComplexVec) {
  const i1 = { re: new Float64Array(n), im: new Float64Array(n) };
  const i2 = { re: new Float64Array(n), im: new Float64Array(n) };
  unitIdx.forEach((g, j) => {
    const nd = model.inverters[g].node;
    i1.re[nd] += x1.re[j];
    i1.im[nd] += x1.im[j];
    i2.re[nd] += x2.re[j];
    i2.im[nd] += x2.im[j];
  });
  const f = full(i1, i2);
  const pick = (v: ComplexVec) => ({ re: Float64Array.from(unitIdx, (g) => v.re[model.inverters[g].node]), im: Float64Array.from(unitIdx, (g) => v.im[model.inverters[g].node]) });
  return { v1: pick(f.v[1]), v2: pick(f.v[2]) };
}

const buses = [3, 40, 77, 119].map((i) => model.busNode.get(`bus-${i}`)!);

describe("closed-form converter response of a bus fault", () => {
  it("has converter units to test with", () => {
    expect(J).toBeGreaterThan(1);
  });
  for (const type of FAULT_TYPES) {
    it(`gives the unit voltages of the full network solution to 1e-12 pu (${type})`, () => {
      let seed = 12345;
      const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31) * 2 - 1;
      for (const k of buses) {
        const { full, cin } = setup(k, type);
        const resp = compactResponse(cin);
        const x1 = { re: Float64Array.from({ length: J }, rnd), im: Float64Array.from({ length: J }, rnd) };
        const x2 = { re: Float64Array.from({ length: J }, rnd), im: Float64Array.from({ length: J }, rnd) };
        const out = { v1r: new Float64Array(J), v1i: new Float64Array(J), v2r: new Float64Array(J), v2i: new Float64Array(J) };
        resp.evaluate(out, x1.re, x1.im, x2.re, x2.im);
        const ref = fullVoltages(full, x1, x2);
        for (let j = 0; j < J; j++) {
          expect(Math.abs(out.v1r[j] - ref.v1.re[j])).toBeLessThan(1e-12);
          expect(Math.abs(out.v1i[j] - ref.v1.im[j])).toBeLessThan(1e-12);
          expect(Math.abs(out.v2r[j] - ref.v2.re[j])).toBeLessThan(1e-12);
          expect(Math.abs(out.v2i[j] - ref.v2.im[j])).toBeLessThan(1e-12);
        }
      }
    });
  }

  it("iterates (Anderson-accelerated) to the injections the map sampled from full solutions gives", () => {
    const units = compactUnits(model, unitIdx);
    const vpre = new Float64Array(J).fill(c);
    for (const type of FAULT_TYPES) {
      for (const k of buses) {
        const { full, cin } = setup(k, type);
        const w = new InjectionWork(J);
        const report = iterateInjections(units, compactResponse(cin), vpre, w);
        expect(report.converged).toBe(true);
        // The dense map from 2J + 1 full solutions: a = V(0), column q = V(e_q) - V(0).
        const zero = { re: new Float64Array(J), im: new Float64Array(J) };
        const base = fullVoltages(full, zero, zero);
        const map: AffineMap = {
          a1r: base.v1.re,
          a1i: base.v1.im,
          a2r: base.v2.re,
          a2i: base.v2.im,
          M1r: new Float64Array(2 * J * J),
          M1i: new Float64Array(2 * J * J),
          M2r: new Float64Array(2 * J * J),
          M2i: new Float64Array(2 * J * J),
        };
        for (let q = 0; q < 2 * J; q++) {
          const e1 = { re: new Float64Array(J), im: new Float64Array(J) };
          const e2 = { re: new Float64Array(J), im: new Float64Array(J) };
          (q < J ? e1 : e2).re[q % J] = 1;
          const v = fullVoltages(full, e1, e2);
          for (let j = 0; j < J; j++) {
            map.M1r[q * J + j] = v.v1.re[j] - base.v1.re[j];
            map.M1i[q * J + j] = v.v1.im[j] - base.v1.im[j];
            map.M2r[q * J + j] = v.v2.re[j] - base.v2.re[j];
            map.M2i[q * J + j] = v.v2.im[j] - base.v2.im[j];
          }
        }
        // The same model solved on that sampled map must land on the same injections.
        const check = new InjectionWork(J);
        const r2 = iterateInjections(units, new DenseResponse(map), vpre, check);
        expect(r2.converged).toBe(true);
        for (let i = 0; i < 4 * J; i++) expect(Math.abs(check.x[i] - w.x[i])).toBeLessThan(1e-9);
      }
    }
  });
});
