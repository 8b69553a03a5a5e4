// Opened element ends on small networks whose answer is known beforehand: a Dyn11 transformer opened at each end,
// a ring opened at one end of a line, and an opening that leaves a section without a source. Each re-solve (low-rank
// update of the base factorization) is checked against a hand calculation (IEC 60909-0:2016, 6.2 and 6.3, with
// complex arithmetic from mathjs) and against a fresh compile with the ends open.
import { describe, expect, it } from "vitest";
import { complex, abs, add, divide, multiply, type Complex as MComplex } from "mathjs";
import { compileNetwork, createReopenContext, solveFault, solveLinePoint, solveReopened, sweepDeviceCurrents, sweepReopened, transformerKT, type FaultResult, type OpenEnd } from "../../../src/engine/index.ts";
import { buildProject, bus, type RawElement } from "./helpers/projectBuilder.ts";

const mag = (z: MComplex) => abs(z) as unknown as number;
/** Network feeder impedance in ohm at un_kV: Z = c Un^2 / S"k with the given R/X (IEC 60909-0:2016, 6.2). */
const feeder = (c: number, un_kV: number, sk_MVA: number, rx: number): MComplex => {
  const z = (c * un_kV * un_kV) / sk_MVA;
  const x = z / Math.sqrt(1 + rx * rx);
  return complex(rx * x, x);
};
const end = (r: FaultResult, element: string, e: "from" | "to" | "terminal") => [...r.branchEnds, ...r.shunts].find((x) => x.element === element && x.end === e);

describe("a Dyn11 transformer opened at each end, with a second infeed on its LV side", () => {
  // Grid 11 kV 250 MVA at HV; an LV infeed of 20 MVA with no zero-sequence path (z0z1 0); transformer 1 MVA
  // 11/0.4 kV, uk 6 %, ur 1 %, Dyn11, LV star solidly earthed. IEC max: c = 1.10 at LV (+10 % tolerance band).
  const p = buildProject([
    bus("HV", 11),
    bus("LV", 0.4),
    { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 250, skMin_MVA: 150, rx: 0.1 },
    { kind: "grid", id: "Q2", bus: "LV", skMax_MVA: 20, skMin_MVA: 10, rx: 0.1, z0z1: 0 },
    { kind: "transformer", id: "T1", hvBus: "HV", lvBus: "LV", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 1, vectorGroup: "Dyn11" },
  ]);
  const options = { limit: "max" as const };
  const ctx = createReopenContext(p, options);
  // Hand calculation referred to 0.4 kV: ZQ2 from S"k; ZT = uk Ur^2 / Sr with RT = ur Ur^2 / Sr, corrected by
  // KT = 0.95 cmax / (1 + 0.6 xT); Z0 of the transformer seen from LV = KT ZT (z0z1 1, delta on HV, solid earth).
  const ZQ2 = feeder(1.1, 0.4, 20, 0.1);
  const zt = (0.06 * 0.16) / 1;
  const rt = (0.01 * 0.16) / 1;
  const kt = transformerKT(Math.sqrt(0.06 ** 2 - 0.01 ** 2), 1.1);
  const ZT = complex(rt * kt, Math.sqrt(zt * zt - rt * rt) * kt);
  const fresh = (ends: OpenEnd[]) => {
    const r = compileNetwork(p, { ...options, openEnds: ends });
    if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
    return r.network;
  };

  it("opened at its HV (delta) end keeps its LV earth: an LV earth fault returns through its star point", () => {
    const ends: OpenEnd[] = [{ element: "T1", end: "from" }];
    const r = solveReopened(ctx, ends, { kind: "bus", bus: "LV" }, "LG");
    // I"k1 = 3 c Un / (sqrt3 |Z1 + Z2 + Z0|) with Z1 = Z2 = ZQ2 (the grid's path is open) and Z0 = KT ZT.
    const i1 = (3 * 1.1 * 0.4) / (Math.sqrt(3) * mag(add(multiply(2, ZQ2), ZT) as MComplex));
    expect(r.ikss_kA).toBeCloseTo(i1, 9);
    // The whole zero-sequence current flows into the transformer at its LV end (the LV infeed has no earth).
    expect(end(r, "T1", "to")!.seq_A[0].mag).toBeCloseTo((r.ikss_kA * 1000) / 3, 6);
    // The opened HV end carries nothing, in any sequence.
    for (const x of end(r, "T1", "from")!.seq_A) expect(x.mag).toBe(0);
    // Same as a fresh compile with that end open.
    expect(solveFault(fresh(ends), { kind: "bus", bus: "LV" }, "LG").ikss_kA).toBeCloseTo(r.ikss_kA, 12);
  });

  it("opened at its LV end takes its earth with it: no earth-fault current at LV", () => {
    const ends: OpenEnd[] = [{ element: "T1", end: "to" }];
    const lg = solveReopened(ctx, ends, { kind: "bus", bus: "LV" }, "LG");
    // No zero-sequence path at LV any more (the delta blocks the grid's, the LV infeed has none).
    expect(lg.earth_kA).toBe(0);
    expect(lg.ikss_kA).toBe(0);
    for (const e of ["from", "to"] as const) for (const x of end(lg, "T1", e)!.seq_A) expect(x.mag).toBeLessThan(1e-9);
    // The three-phase current comes from the LV infeed alone: c Un / (sqrt3 |ZQ2|).
    const k3 = solveReopened(ctx, ends, { kind: "bus", bus: "LV" }, "3ph");
    expect(k3.ikss_kA).toBeCloseTo((1.1 * 0.4) / (Math.sqrt(3) * mag(ZQ2)), 9);
    expect(solveFault(fresh(ends), { kind: "bus", bus: "LV" }, "3ph").ikss_kA).toBeCloseTo(k3.ikss_kA, 12);
  });

  it("with both its ends closed, the earth fault at LV sees the same Z0 and the grid in parallel (base network unchanged)", () => {
    // Z1 = Z2 = ZQ2 || (ZQ + ZT), both referred to 0.4 kV (ZQ from 250 MVA at 11 kV, scaled by (0.4/11)^2).
    const ZQ = multiply(feeder(1.1, 11, 250, 0.1), (0.4 / 11) ** 2) as MComplex;
    const zs = add(ZQ, ZT) as MComplex;
    const z1 = divide(multiply(ZQ2, zs) as MComplex, add(ZQ2, zs) as MComplex) as MComplex;
    const i1 = (3 * 1.1 * 0.4) / (Math.sqrt(3) * mag(add(multiply(2, z1), ZT) as MComplex));
    expect(solveReopened(ctx, [], { kind: "bus", bus: "LV" }, "LG").ikss_kA).toBeCloseTo(i1, 9);
  });
});

const cable = (id: string, a: string, b: string, km: number): RawElement => ({
  kind: "line",
  id,
  fromBus: a,
  toBus: b,
  length_km: km,
  r1_ohmPerKm: 0.2,
  x1_ohmPerKm: 0.08,
  r0_ohmPerKm: 0.8,
  x0_ohmPerKm: 0.3,
  csa_mm2: 95,
  ampacity_A: 250,
});
const zLine = (km: number) => complex(0.2 * km, 0.08 * km);
const z0Line = (km: number) => complex(0.8 * km, 0.3 * km);

describe("a ring opened at one end of a line", () => {
  // Grid 11 kV, 250 MVA, R/X 0.1, z0z1 1, R0/X0 0.1 at A; cables A-B 2 km, B-C 3 km, C-A 1.5 km (L3 from C to A).
  const p = buildProject([bus("A", 11), bus("B", 11), bus("C", 11), { kind: "grid", id: "Q", bus: "A", skMax_MVA: 250, skMin_MVA: 150, rx: 0.1 }, cable("L1", "A", "B", 2), cable("L2", "B", "C", 3), cable("L3", "C", "A", 1.5)]);
  const ctx = createReopenContext(p, { limit: "max" });
  const ends: OpenEnd[] = [{ element: "L3", end: "to" }];
  const ZQ = feeder(1.1, 11, 250, 0.1);
  // Zero sequence of the feeder: |Z0| = z0z1 |Z1| with R0/X0 0.1.
  const Z0Q = feeder(1.1, 11, 250, 0.1);
  const zPath = add(ZQ, add(zLine(2), zLine(3))) as MComplex;

  it("feeds a fault at C along the remaining path only (hand calculation)", () => {
    const r = solveReopened(ctx, ends, { kind: "bus", bus: "C" }, "3ph");
    // I"k3 = c Un / (sqrt3 |ZQ + ZL1 + ZL2|), c = 1.10 (MV, max).
    const i3 = (1.1 * 11) / (Math.sqrt(3) * mag(zPath));
    expect(r.ikss_kA).toBeCloseTo(i3, 9);
    // The opened cable carries nothing at either end (a series impedance keeps nothing once one end opens).
    for (const e of ["from", "to"] as const) for (const x of end(r, "L3", e)!.seq_A) expect(x.mag).toBe(0);
    expect(end(r, "L2", "to")!.phase_A[0].mag).toBeCloseTo(i3 * 1000, 6);
    // LG: I"k1 = 3 c Un / (sqrt3 |2 (ZQ + ZL1 + ZL2) + Z0Q + Z0L1 + Z0L2|).
    const lg = solveReopened(ctx, ends, { kind: "bus", bus: "C" }, "LG");
    const z0 = add(Z0Q, add(z0Line(2), z0Line(3))) as MComplex;
    expect(lg.ikss_kA).toBeCloseTo((3 * 1.1 * 11) / (Math.sqrt(3) * mag(add(multiply(2, zPath), z0) as MComplex)), 9);
  });

  it("feeds a point along the opened cable from its closed end only", () => {
    // 40 % of L3 from C: I"k3 = c Un / (sqrt3 |ZQ + ZL1 + ZL2 + 0.4 ZL3|); the half towards A is open at A.
    const r = solveReopened(ctx, ends, { kind: "line", line: "L3", pct: 40 }, "3ph");
    const z = add(zPath, zLine(0.4 * 1.5)) as MComplex;
    expect(r.ikss_kA).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * mag(z)), 9);
    for (const x of end(r, "L3", "to")!.seq_A) expect(x.mag).toBe(0);
    expect(end(r, "L3", "from")!.phase_A[0].mag).toBeCloseTo(r.ikss_kA * 1000, 6);
  });

  it("places a line point on any network by bordering, as solveFault's split and fresh factorization do", () => {
    // The closed ring: solveLinePoint against solveFault (which splits the line and factorizes the split network).
    for (const pct of [10, 40, 75])
      for (const type of ["3ph", "LL", "LG", "LLG"] as const) {
        const want = solveFault(ctx.base, { kind: "line", line: "L3", pct }, type);
        const got = solveLinePoint(ctx.base, { kind: "line", line: "L3", pct }, type, {});
        expect(got.ikss_kA).toBeCloseTo(want.ikss_kA, 12);
        for (const e of want.branchEnds) for (let s = 0; s < 3; s++) expect(end(got, e.element, e.end)!.seq_A[s].mag).toBeCloseTo(e.seq_A[s].mag, 7);
      }
  });

  it("opens a switch by a fresh compile and says so", () => {
    // A coupler S between A and A2, the ring's L1 moved to A2: opening S is a fresh compile (a closed switch is one node).
    const q = buildProject([bus("A", 11), bus("A2", 11), bus("B", 11), bus("C", 11), { kind: "grid", id: "Q", bus: "A", skMax_MVA: 250, skMin_MVA: 150, rx: 0.1 }, { kind: "switch", id: "S", busA: "A", busB: "A2" }, cable("L1", "A2", "B", 2), cable("L2", "B", "C", 3), cable("L3", "C", "A", 1.5)]);
    const qctx = createReopenContext(q, { limit: "max" });
    const r = solveReopened(qctx, [{ element: "S", end: "from" }], { kind: "bus", bus: "B" }, "3ph");
    // With S open, B is fed through L3 and L2: c Un / (sqrt3 |ZQ + ZL3 + ZL2|).
    expect(r.ikss_kA).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * mag(add(ZQ, add(zLine(1.5), zLine(3))) as MComplex)), 9);
    expect(r.messages.some((m) => m.code === "reopen-fresh-compile" && m.text.includes("switch S"))).toBe(true);
    expect(qctx.stats.reference).toBe(1);
    // The opened-set sweep of that set is the sweep of the fresh compile.
    const sweep = sweepReopened(qctx, [{ element: "S", end: "from" }], { types: ["3ph"] });
    expect(sweep.ikss_kA[sweep.busIds.indexOf("B")]).toBeCloseTo(r.ikss_kA, 12);
    expect(sweep.messages.some((m) => m.code === "reopen-fresh-compile")).toBe(true);
  });

  it("gives the same answers with caches bounded to one opened set and two base columns", () => {
    // Eviction must never change a value: every re-solve against a fresh compile with the same ends open.
    const small = createReopenContext(p, { limit: "max" }, ctx.base, { maxSets: 1, maxColumns: 2 });
    const sets: OpenEnd[][] = [[{ element: "L3", end: "to" }], [{ element: "L1", end: "from" }], [{ element: "L2", end: "to" }, { element: "L3", end: "from" }]];
    for (let round = 0; round < 2; round++)
      for (const s of sets) {
        const f = compileNetwork(p, { limit: "max", openEnds: s });
        if (!f.ok) throw new Error("compile");
        for (const b of ["A", "B", "C"]) expect(solveReopened(small, s, { kind: "bus", bus: b }, "LG").ikss_kA).toBeCloseTo(solveFault(f.network, { kind: "bus", bus: b }, "LG").ikss_kA, 12);
      }
    expect(small.sets.size).toBe(1);
    expect(small.columns.size).toBeLessThanOrEqual(2);
  });

  it("gives the same currents in the opened-set sweep", () => {
    const sweep = sweepReopened(ctx, ends, { types: ["3ph", "LG"] });
    const c = sweep.busIds.indexOf("C");
    expect(sweep.ikss_kA[c * 2]).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * mag(zPath)), 9);
    const d = sweep.devices.findIndex((x) => x.element === "L3");
    expect(d).toBe(-1); // no protective device in this project: the sweep lists none
    const withDevices = sweepReopened(ctx, ends, { types: ["3ph"], devices: [{ element: "L3", end: "from" }, { element: "L2", end: "to" }] });
    expect(sweepDeviceCurrents(withDevices, 0, c, 0).phase_A[0].mag).toBe(0);
    expect(sweepDeviceCurrents(withDevices, 1, c, 0).phase_A[0].mag).toBeCloseTo(withDevices.ikss_kA[c] * 1000, 6);
  });
});

describe("an opened set that leaves a section without a source", () => {
  // Grid at A; cables A-B and B-C. Opening L1 at A leaves B and C without any source.
  const elements: RawElement[] = [bus("A", 11), bus("B", 11), bus("C", 11), { kind: "grid", id: "Q", bus: "A", skMax_MVA: 250, skMin_MVA: 150, rx: 0.1 }, cable("L1", "A", "B", 2), cable("L2", "B", "C", 3)];
  const p = buildProject(elements);
  const ctx = createReopenContext(p, { limit: "max" });
  const ends: OpenEnd[] = [{ element: "L1", end: "from" }];

  it("carries no fault current in the dead section, and the live part sees the grid alone", () => {
    for (const b of ["B", "C"])
      for (const type of ["3ph", "LL", "LG", "LLG"] as const) {
        const r = solveReopened(ctx, ends, { kind: "bus", bus: b }, type);
        expect(r.ikss_kA).toBe(0);
        expect(r.messages.some((m) => m.code === "dead-island")).toBe(true);
      }
    const a = solveReopened(ctx, ends, { kind: "bus", bus: "A" }, "3ph");
    expect(a.ikss_kA).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * mag(feeder(1.1, 11, 250, 0.1))), 9); // c Un / (sqrt3 |ZQ|)
    for (const e of ["from", "to"] as const) for (const x of end(a, "L2", e)!.seq_A) expect(x.mag).toBe(0);
    const sweep = sweepReopened(ctx, ends, { devices: [{ element: "L2", end: "from" }, { element: "L1", end: "to" }] });
    for (let b = 0; b < 3; b++) for (let t = 0; t < 4; t++) for (let d = 0; d < 2; d++) expect(sweepDeviceCurrents(sweep, d, b, t).phase_A[0].mag).toBeLessThan(1e-9);
    expect(sweep.ikss_kA[sweep.busIds.indexOf("C") * 4]).toBe(0);
  });

  it("solves an island left with a converter only as a fresh factorization does", () => {
    // The same feeder with a grid-following converter at C: opening L1 leaves B-C fed by current sources only.
    const q = buildProject([...elements, { kind: "inverter", id: "PV", bus: "C", sr_MVA: 0.5, ur_kV: 11, iMax_pu: 1.1, control: "grid-following" }]);
    const qctx = createReopenContext(q, { limit: "max" });
    const fresh = compileNetwork(q, { limit: "max", openEnds: ends });
    if (!fresh.ok) throw new Error("compile");
    for (const b of ["B", "C"])
      for (const type of ["3ph", "LL", "LG", "LLG"] as const)
        for (const inverterModel of ["iec", "refined"] as const) {
          const want = solveFault(fresh.network, { kind: "bus", bus: b }, type, { inverterModel });
          const got = solveReopened(qctx, ends, { kind: "bus", bus: b }, type, { inverterModel });
          expect(got.ikss_kA).toBeCloseTo(want.ikss_kA, 12);
          for (const e of want.branchEnds) expect(end(got, e.element, e.end)!.phase_A[0].mag).toBeCloseTo(e.phase_A[0].mag, 6);
        }
    // A three-phase fault at C: the converter alone feeds it, IEC 60909 full-size converter current iMax Ir.
    const r = solveReopened(qctx, ends, { kind: "bus", bus: "C" }, "3ph", { inverterModel: "iec" });
    expect(r.ikss_kA).toBeCloseTo((1.1 * 0.5) / (Math.sqrt(3) * 11), 9); // I = iMax Sr / (sqrt3 Ur)
  });

  it("opening the only source's terminal leaves every bus dead", () => {
    const opened: OpenEnd[] = [{ element: "Q", end: "terminal" }];
    const r = solveReopened(ctx, opened, { kind: "bus", bus: "A" }, "3ph");
    expect(r.ikss_kA).toBe(0);
    expect(r.messages.some((m) => m.code === "dead-island")).toBe(true);
    const sweep = sweepReopened(ctx, opened, { types: ["3ph"], devices: [{ element: "Q", end: "terminal" }] });
    for (let b = 0; b < 3; b++) {
      expect(sweep.ikss_kA[b]).toBe(0);
      expect(sweepDeviceCurrents(sweep, 0, b, 0).phase_A[0].mag).toBe(0);
    }
  });

  it("refuses an end that does not fit its element, naming it", () => {
    expect(() => solveReopened(ctx, [{ element: "L1", end: "terminal" }], { kind: "bus", bus: "A" }, "3ph")).toThrow(/L1/);
    expect(() => solveReopened(ctx, [{ element: "nope", end: "from" }], { kind: "bus", bus: "A" }, "3ph")).toThrow(/nope/);
    const bad = compileNetwork(p, { limit: "max", openEnds: [{ element: "Q", end: "from" }] });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors[0]).toMatchObject({ element: "Q", text: expect.stringMatching(/Grid feeder Q.*: end must be "terminal"/) });
    const busEnd = compileNetwork(p, { limit: "max", openEnds: [{ element: "B", end: "from" }] });
    expect(!busEnd.ok && busEnd.errors[0].text).toMatch(/Bus B.*: a bus has no end/);
    expect(() => solveReopened(ctx, [{ element: "Q", end: "to" }], { kind: "bus", bus: "A" }, "3ph")).toThrow(/Grid feeder Q.*: end must be "terminal" for a grid/);
  });
});

describe("a power station unit with an opened end", () => {
  // Generator 10 MVA 11 kV on G, unit transformer YNd11 34.5/11 kV to Q, a 500 MVA grid at Q, and a cable from Q
  // to a load bus F (data as in powerStationUnit.test.ts). A fault at G is solved with the unit's own factors
  // (IEC 60909-0:2016, 6.7), which the update of the outside model cannot give: a fresh compile answers it.
  const p = buildProject([
    bus("Q", 33),
    bus("G", 11),
    bus("F", 33),
    { kind: "generator", id: "G1", bus: "G", sr_MVA: 10, ur_kV: 11, cosPhi: 0.8, xdss_pu: 0.15, x2_pu: 0.15, x0_pu: 0.1, rx: 0.05, unit: { transformer: "T1" } },
    { kind: "transformer", id: "T1", hvBus: "Q", lvBus: "G", sr_MVA: 10, urHv_kV: 34.5, urLv_kV: 11, uk_pct: 10, ur_pct: 0.6, vectorGroup: "YNd11", earthingHv: { kind: "solid" } },
    { kind: "grid", id: "NET", bus: "Q", skMax_MVA: 500, skMin_MVA: 400, rx: 0.1 },
    cable("L1", "Q", "F", 4),
  ]);
  const ctx = createReopenContext(p, { limit: "max" });
  const ends: OpenEnd[] = [{ element: "L1", end: "from" }];
  const fresh = compileNetwork(p, { limit: "max", openEnds: ends });
  if (!fresh.ok) throw new Error("compile");

  it("answers a fault inside the unit by a fresh compile, and one outside it by the update, both as the fresh compile does", () => {
    for (const type of ["3ph", "LG"] as const) {
      const inside = solveReopened(ctx, ends, { kind: "bus", bus: "G" }, type);
      expect(inside.messages.some((m) => m.code === "reopen-fresh-compile" && m.text.includes("power station unit"))).toBe(true);
      expect(inside.ikss_kA).toBeCloseTo(solveFault(fresh.network, { kind: "bus", bus: "G" }, type).ikss_kA, 12);
      const outside = solveReopened(ctx, ends, { kind: "bus", bus: "Q" }, type);
      expect(outside.messages.some((m) => m.code === "reopen-fresh-compile")).toBe(false);
      expect(outside.ikss_kA).toBeCloseTo(solveFault(fresh.network, { kind: "bus", bus: "Q" }, type).ikss_kA, 12);
    }
    expect(ctx.stats.reference).toBe(2);
    expect(ctx.stats.fast).toBe(2);
    const sweep = sweepReopened(ctx, ends, { types: ["3ph"] });
    const g = sweep.busIds.indexOf("G");
    expect(sweep.ikss_kA[g]).toBeCloseTo(solveFault(fresh.network, { kind: "bus", bus: "G" }, "3ph").ikss_kA, 12);
    expect(sweep.ikss_kA[sweep.busIds.indexOf("F")]).toBe(0); // the opened cable leaves F without a source
  });
});

describe("the peak factor of a ring opened at one end", () => {
  it("takes the opened ring as radial (branch-sum method), as the same feeder built radial does", () => {
    // IEC 60909-0:2016, 8.1: the branch-sum method applies to a radial network; a ring opened at one cable end is one.
    // Reference: the same buses and cables without the opened cable at all, solved fresh.
    const els: RawElement[] = [bus("A", 11), bus("B", 11), bus("C", 11), { kind: "grid", id: "Q", bus: "A", skMax_MVA: 250, skMin_MVA: 150, rx: 0.1 }, cable("L1", "A", "B", 2), cable("L2", "B", "C", 3)];
    const ring = buildProject([...els, cable("L3", "C", "A", 1.5)]);
    const radial = compileNetwork(buildProject(els), { limit: "max" });
    if (!radial.ok) throw new Error("compile");
    const ctx = createReopenContext(ring, { limit: "max" });
    const r = solveReopened(ctx, [{ element: "L3", end: "to" }], { kind: "bus", bus: "C" }, "3ph");
    const want = solveFault(radial.network, { kind: "bus", bus: "C" }, "3ph");
    expect(r.peakMethod).toBe("radial-branch-sum");
    expect(r.ip_kA).toBeCloseTo(want.ip_kA, 9);
    expect(solveReopened(ctx, [], { kind: "bus", bus: "C" }, "3ph").peakMethod).toBe("meshed-method-b");
  });
});

describe("an LV board whose coupler breaker carries a trip unit", () => {
  // Sections A and B at 0.4 kV, a 20 MVA infeed on A and a 15 MVA one on B (R/X 0.1, z0z1 1), coupled by breaker S
  // with an LV trip unit: the engine keeps S as a branch of its own, so opening it is an update like any branch end.
  const p = buildProject([
    bus("A", 0.4),
    bus("B", 0.4),
    { kind: "grid", id: "QA", bus: "A", skMax_MVA: 20, skMin_MVA: 10, rx: 0.1 },
    { kind: "grid", id: "QB", bus: "B", skMax_MVA: 15, skMin_MVA: 8, rx: 0.1 },
    { kind: "switch", id: "S", busA: "A", busB: "B", device: "breaker" },
    { kind: "lvbreaker", id: "Q-S", at: { element: "S", end: "from" }, in_A: 1600, longTime: { ir_x: 1, tr_s: 10 }, shortTime: { isd_x: 4, tsd_s: 0.2 } },
  ]);
  const ctx = createReopenContext(p, { limit: "max" });

  it("with converters on both sections, agrees with a fresh compile to 1e-9 pu (both converter models, bus faults and the sweep)", () => {
    // A grid-following PV unit on A and a grid-forming battery on B: their unit columns come from the stiff update.
    const q = buildProject([
      ...p.elements,
      { kind: "inverter", id: "PV", bus: "A", sr_MVA: 0.5, ur_kV: 0.4, iMax_pu: 1.1, control: "grid-following" },
      { kind: "inverter", id: "BESS", bus: "B", sr_MVA: 0.8, ur_kV: 0.4, iMax_pu: 1.5, control: "grid-forming" },
    ] as RawElement[]);
    const qctx = createReopenContext(q, { limit: "max" });
    const ends: OpenEnd[] = [{ element: "S", end: "to" }];
    const fresh = compileNetwork(q, { limit: "max", openEnds: ends });
    if (!fresh.ok) throw new Error("compile");
    const base_A = 100e3 / (Math.sqrt(3) * 0.4);
    for (const inverterModel of ["iec", "refined"] as const) {
      const sweep = sweepReopened(qctx, ends, { inverterModel, devices: [{ element: "S", end: "from" }, { element: "PV", end: "terminal" }, { element: "BESS", end: "terminal" }] });
      sweep.busIds.forEach((b, bi) =>
        sweep.types.forEach((type, t) => {
          const want = solveFault(fresh.network, { kind: "bus", bus: b }, type, { inverterModel });
          const got = solveReopened(qctx, ends, { kind: "bus", bus: b }, type, { inverterModel });
          expect(Math.abs(got.ikss_kA - want.ikss_kA) / (base_A / 1000)).toBeLessThan(1e-9);
          expect(Math.abs(sweep.ikss_kA[bi * sweep.types.length + t] - want.ikss_kA) / (base_A / 1000)).toBeLessThan(1e-9);
          for (const e of [...want.branchEnds, ...want.shunts]) for (let s = 0; s < 3; s++) expect(Math.abs(end(got, e.element, e.end)!.seq_A[s].mag - e.seq_A[s].mag) / base_A).toBeLessThan(1e-9);
          sweep.devices.forEach((dev, d) => {
            const e = end(want, dev.element, dev.end)!;
            const g = sweepDeviceCurrents(sweep, d, bi, t);
            for (let s = 0; s < 3; s++) expect(Math.abs(Math.hypot(g.seq_A[s].re, g.seq_A[s].im) - e.seq_A[s].mag) / base_A).toBeLessThan(1e-9);
          });
        }),
      );
    }
  });

  for (const side of ["from", "to"] as const)
    it(`opened at its ${side} end, leaves each section to its own infeed (on the update, as a fresh compile)`, () => {
      const ends: OpenEnd[] = [{ element: "S", end: side }];
      const fresh = compileNetwork(p, { limit: "max", openEnds: ends });
      if (!fresh.ok) throw new Error("compile");
      for (const [b, sk] of [["A", 20], ["B", 15]] as const) {
        const r = solveReopened(ctx, ends, { kind: "bus", bus: b }, "3ph");
        // c Un / (sqrt3 |ZQ|) with ZQ = c Un^2 / S"k: I"k = S"k / (sqrt3 Un), c = 1.10 at LV; to 1e-9 pu of the
        // 144 kA base current (the breaker's 1e-5 pu against 5.5 pu of infeed costs the update some ten digits).
        expect(Math.abs(r.ikss_kA - (1.1 * 0.4) / (Math.sqrt(3) * mag(feeder(1.1, 0.4, sk, 0.1)))) / (100 / (Math.sqrt(3) * 0.4))).toBeLessThan(1e-9);
        expect(r.messages.some((m) => m.code === "reopen-fresh-compile")).toBe(false);
        for (const x of end(r, "S", side)!.seq_A) expect(x.mag).toBe(0);
        for (const type of ["LG", "LL", "LLG"] as const) {
          const want = solveFault(fresh.network, { kind: "bus", bus: b }, type);
          const got = solveReopened(ctx, ends, { kind: "bus", bus: b }, type);
          const base_A = 100e3 / (Math.sqrt(3) * 0.4);
          expect(Math.abs(got.ikss_kA - want.ikss_kA) / (base_A / 1000)).toBeLessThan(1e-9);
          for (const e of [...want.branchEnds, ...want.shunts]) for (let s = 0; s < 3; s++) expect(Math.abs(end(got, e.element, e.end)!.seq_A[s].mag - e.seq_A[s].mag) / base_A).toBeLessThan(1e-9);
        }
      }
      expect(ctx.stats.reference).toBe(0);
    });

  it("closed, carries the current the B infeed sends to a fault on A (the breaker as a branch)", () => {
    const r = solveReopened(ctx, [], { kind: "bus", bus: "A" }, "3ph");
    // From the B side: c Un / (sqrt3 |ZQB + j 1e-5 pu|) ~ S"kB / (sqrt3 Un); the breaker's 1e-5 pu changes it by
    // under 1e-4 (it is ZQB in pu, 1.1 * 100 / 15 = 7.3 pu, that matters).
    expect(end(r, "S", "from")!.phase_A[0].mag / 1000).toBeCloseTo((1.1 * 0.4) / (Math.sqrt(3) * mag(feeder(1.1, 0.4, 15, 0.1))), 3);
  });
});
