// Re-solves with element ends open, by a low-rank update of the base factorization (src/engine/reopen), against an
// independent computation: a fresh compile of the network with those ends open (compileNetwork's openEnds) and a
// fresh factorization of every sequence network, solved by solveFault. Every reported current must agree to 1e-9 pu.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import "../setup/fastCheckSeed.ts";
import { compileNetwork, createReopenContext, solveFault, solveReopened, sweepDeviceCurrents, sweepReopened, type EndCurrent, type FaultResult, type FaultType, type OpenEnd } from "../../../src/engine/index.ts";
import { generateMeshedNetwork, generateRadialNetwork, GENERATED_SCENARIOS } from "../../../src/model/generateNetwork.ts";
import type { Project } from "../../../src/model/schema.ts";

const TYPES: FaultType[] = ["3ph", "LL", "LG", "LLG"];
const SQRT3 = Math.sqrt(3);

/** Candidate ends: every protective device's location, and every source's terminal. */
function candidateEnds(project: Project): OpenEnd[] {
  const out = new Map<string, OpenEnd>();
  for (const e of project.elements) {
    if (e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker") out.set(`${e.at.element}|${e.at.end}`, { element: e.at.element, end: e.at.end });
    if (e.kind === "grid" || e.kind === "generator" || e.kind === "inverter") out.set(`${e.id}|terminal`, { element: e.id, end: "terminal" });
  }
  return [...out.values()];
}

function busKv(project: Project): Map<string, number> {
  const m = new Map<string, number>();
  for (const e of project.elements) if (e.kind === "bus") m.set(e.id, e.un_kV);
  return m;
}

/** Largest difference of two results in pu of each quantity's own base current. */
function worstPu(a: FaultResult, b: FaultResult, kv: Map<string, number>, baseMVA: number): number {
  const iBase_kA = (un: number) => baseMVA / (SQRT3 * un);
  const rect = (p: { mag: number; ang_deg: number }) => ({ re: p.mag * Math.cos((p.ang_deg * Math.PI) / 180), im: p.mag * Math.sin((p.ang_deg * Math.PI) / 180) });
  const dist = (p: { mag: number; ang_deg: number }, q: { mag: number; ang_deg: number }) => {
    const x = rect(p);
    const y = rect(q);
    return Math.hypot(x.re - y.re, x.im - y.im);
  };
  let worst = 0;
  const fb = a.un_kV > 0 ? iBase_kA(a.un_kV) : 1;
  worst = Math.max(worst, Math.abs(a.ikss_kA - b.ikss_kA) / fb, Math.abs(a.maxPhase_kA - b.maxPhase_kA) / fb);
  for (let s = 0; s < 3; s++) worst = Math.max(worst, dist(a.faultSeq_kA[s], b.faultSeq_kA[s]) / fb);
  const ends = (r: FaultResult) => new Map<string, EndCurrent>([...r.branchEnds, ...r.shunts].map((e) => [`${e.element}|${e.end}`, e]));
  const ea = ends(a);
  const eb = ends(b);
  expect([...eb.keys()].sort()).toEqual([...ea.keys()].sort());
  for (const [key, x] of ea) {
    const y = eb.get(key)!;
    const base_A = iBase_kA(kv.get(x.bus)!) * 1000;
    for (let s = 0; s < 3; s++) worst = Math.max(worst, dist(x.seq_A[s], y.seq_A[s]) / base_A, dist(x.phase_A[s], y.phase_A[s]) / base_A);
  }
  return worst;
}

const networks = [
  { name: "radial", make: (seed: number) => generateRadialNetwork({ buses: 36, devices: 24, seed }) },
  { name: "meshed", make: (seed: number) => generateMeshedNetwork({ buses: 36, devices: 24, seed, ties: 3 }) },
];

describe("re-solve with opened ends by low-rank update", () => {
  for (const net of networks) {
    for (const scenario of [GENERATED_SCENARIOS.gridTied, GENERATED_SCENARIOS.islanded]) {
      it(`agrees with a fresh factorization to 1e-9 pu on every current (${net.name}, ${scenario}, 1-3 opened ends, 3ph/LL/LG/LLG)`, () => {
        const project = net.make(7);
        const options = { scenario, limit: "max" as const };
        const ctx = createReopenContext(project, options);
        const pool = candidateEnds(project);
        const busIds = Object.keys(ctx.base.busNode);
        const kv = busKv(project);
        const lineIds = project.elements.filter((e) => e.kind === "line").map((e) => e.id);
        let checked = 0;
        fc.assert(
          fc.property(
            fc.uniqueArray(fc.integer({ min: 0, max: pool.length - 1 }), { minLength: 1, maxLength: 3 }),
            fc.array(fc.integer({ min: 0, max: busIds.length - 1 }), { minLength: 2, maxLength: 4 }),
            fc.constantFrom("iec" as const, "refined" as const),
            fc.integer({ min: 0, max: lineIds.length - 1 }),
            fc.integer({ min: 1, max: 99 }),
            (picks, busPicks, inverterModel, li, pct) => {
              // A line point too, on an opened line half the time (the fresh path splits and factorizes afresh).
              const lineEnd = pool.find((e) => picks.some((i) => pool[i] === e) && lineIds.includes(e.element));
              const line = lineEnd && li % 2 === 0 ? lineEnd.element : lineIds[li];
              const ends = picks.map((i) => pool[i]);
              const fresh = compileNetwork(project, { ...options, openEnds: ends });
              if (!fresh.ok) throw new Error(fresh.errors.map((e) => e.text).join("; "));
              const locations = [...busPicks.map((bi) => ({ kind: "bus" as const, bus: busIds[bi] })), { kind: "line" as const, line, pct }];
              for (const location of locations)
                for (const type of TYPES) {
                  const ref = solveFault(fresh.network, location, type, { inverterModel });
                  const got = solveReopened(ctx, ends, location, type, { inverterModel });
                  expect(worstPu(ref, got, kv, project.meta.baseMVA)).toBeLessThan(1e-9);
                  checked++;
                }
            },
          ),
          { numRuns: 25 },
        );
        expect(checked).toBeGreaterThan(150);
        // Every fault answered by the update, line points included; none by a fresh compile (no switch, no unit).
        expect(ctx.stats.reference).toBe(0);
      });
    }
  }

  it("sweeps the buses of an opened set like one fault at a time on a fresh factorization (1e-9 pu)", () => {
    const project = generateMeshedNetwork({ buses: 40, devices: 24, seed: 3, ties: 3 });
    const options = { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" as const };
    const ctx = createReopenContext(project, options);
    const pool = candidateEnds(project);
    const kv = busKv(project);
    let checked = 0;
    let nonZero = 0;
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 0, max: pool.length - 1 }), { minLength: 1, maxLength: 2 }), fc.constantFrom("iec" as const, "refined" as const), (picks, inverterModel) => {
        const ends = picks.map((i) => pool[i]);
        const fresh = compileNetwork(project, { ...options, openEnds: ends });
        if (!fresh.ok) throw new Error(fresh.errors.map((e) => e.text).join("; "));
        const sweep = sweepReopened(ctx, ends, { inverterModel });
        for (let b = 0; b < sweep.busIds.length; b += 4)
          sweep.types.forEach((type, t) => {
            const ref = solveFault(fresh.network, { kind: "bus", bus: sweep.busIds[b] }, type, { inverterModel, detail: "devices" });
            const iBase_kA = ref.un_kV > 0 ? project.meta.baseMVA / (SQRT3 * ref.un_kV) : 1;
            expect(Math.abs(sweep.ikss_kA[b * sweep.types.length + t] - ref.ikss_kA) / iBase_kA).toBeLessThan(1e-9);
            expect(Math.abs(sweep.maxPhase_kA[b * sweep.types.length + t] - ref.maxPhase_kA) / iBase_kA).toBeLessThan(1e-9);
            // Peak current on the three-phase basis (IEC 60909-0:2016, 8.1), as solveFault gives it for 3ph.
            if (type === "3ph") expect(Math.abs(sweep.ip_kA[b] - ref.ip_kA) / iBase_kA).toBeLessThan(1e-9);
            const ends2 = new Map([...ref.branchEnds, ...ref.shunts].map((e) => [`${e.element}|${e.end}`, e]));
            sweep.devices.forEach((dev, d) => {
              const e = ends2.get(`${dev.element}|${dev.end}`);
              const got = sweepDeviceCurrents(sweep, d, b, t);
              const base_A = (project.meta.baseMVA * 1000) / (SQRT3 * kv.get(dev.bus)!);
              for (let s = 0; s < 3; s++) {
                const want = e ? { re: e.seq_A[s].mag * Math.cos((e.seq_A[s].ang_deg * Math.PI) / 180), im: e.seq_A[s].mag * Math.sin((e.seq_A[s].ang_deg * Math.PI) / 180) } : { re: 0, im: 0 };
                expect(Math.hypot(got.seq_A[s].re - want.re, got.seq_A[s].im - want.im) / base_A).toBeLessThan(1e-9);
                if (got.phase_A[s].mag > 1) nonZero++;
              }
              checked++;
            });
          });
      }),
      { numRuns: 12 },
    );
    expect(checked).toBeGreaterThan(1000);
    expect(nonZero).toBeGreaterThan(300);
  });
});
