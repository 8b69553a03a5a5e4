import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, generatorKG, FAULT_TYPES } from "../../../src/engine/index.ts";
import { buildProject, bus, type RawElement } from "./helpers/projectBuilder.ts";

const cable = (id: string, a: string, b: string, km: number): RawElement => ({
  kind: "line", id, fromBus: a, toBus: b, length_km: km, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.3, csa_mm2: 95, ampacity_A: 250,
});

describe("a generator-only island", () => {
  // Generator 0.5 MVA, 0.4 kV, x"d 0.15, x2 0.16, x0 0.06, R/X 0.15, cos phi 0.8, solidly earthed; IEC max, LV cmax 1.10.
  // Hand calculation (IEC 60909-0:2016, 6.6.1): KG = cmax / (1 + x"d sin phi) = 1.1 / 1.09;
  //   X"d = 0.15 * 0.16 / 0.5 ohm, Z = KG (0.15 + j) X; I"k3 = c Un / (sqrt3 |Z|);
  //   I"k1 = 3 c Un / (sqrt3 |Z1 + Z2 + Z0|) with each of x"d, x2, x0 scaled the same way.
  const p = buildProject([
    bus("G", 0.4),
    { kind: "generator", id: "GEN", name: "Standby set", bus: "G", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.15, x2_pu: 0.16, x0_pu: 0.06, rx: 0.15, earthing: { kind: "solid" } },
  ]);
  const c = compileNetwork(p, { limit: "max" });
  if (!c.ok) throw new Error("compile");
  const kg = generatorKG(0.4, 0.4, 1.1, 0.15, 0.8);
  const zOf = (x: number) => kg * ((x * 0.16) / 0.5) * Math.hypot(0.15, 1);
  it("gives the hand-calculated three-phase current", () => {
    const r = solveFault(c.network, { kind: "bus", bus: "G" }, "3ph");
    expect(r.ikss_kA).toBeCloseTo((1.1 * 0.4) / (Math.sqrt(3) * zOf(0.15)), 9);
    expect(r.xr).toBeCloseTo(1 / 0.15, 9);
  });
  it("gives the hand-calculated earth-fault current", () => {
    const r = solveFault(c.network, { kind: "bus", bus: "G" }, "LG");
    expect(r.ikss_kA).toBeCloseTo((3 * 1.1 * 0.4) / (Math.sqrt(3) * (zOf(0.15) + zOf(0.16) + zOf(0.06))), 9); // all three share one angle
  });
  it("applies mu to the breaking current of a near-to-generator fault", () => {
    const r = solveFault(c.network, { kind: "bus", bus: "G" }, "3ph");
    // Terminal fault, one generator: Ib = mu I"k (IEC 60909-0:2016, 9.1.1); I"kG/IrG is well above 2.
    const irG_kA = 0.5 / (Math.sqrt(3) * 0.4);
    const x = r.ikss_kA / irG_kA;
    const mu = 0.62 + 0.72 * Math.exp(-0.32 * x); // tmin 0.1 s (reference-checks.md, from memory)
    expect(r.ib_kA).toBeCloseTo(mu * r.ikss_kA, 9);
    expect(r.mu).toBeCloseTo(mu, 9);
  });
});

describe("an island of inverters only", () => {
  // Grid-forming battery 0.5 MVA and grid-following PV 0.2 MVA, both iMax 1.2 pu (schema default), on a short cable.
  const elements: RawElement[] = [
    bus("X", 0.4),
    bus("Y", 0.4),
    cable("C2", "X", "Y", 0.05),
    { kind: "inverter", id: "BESS", name: "Battery", bus: "X", sr_MVA: 0.5, ur_kV: 0.4, control: "grid-forming" },
    { kind: "inverter", id: "PV", name: "Roof PV", bus: "Y", sr_MVA: 0.2, ur_kV: 0.4 },
  ];
  const ratedSum_kA = 0.7 / (Math.sqrt(3) * 0.4);
  for (const model of ["refined", "iec"] as const) {
    it(`gives finite currents of about 1.1-1.5 x rated for a three-phase fault (${model} model used)`, () => {
      const c = compileNetwork(buildProject(elements, { inverterModel: model }), { limit: "max" });
      if (!c.ok) throw new Error("compile");
      for (const b of ["X", "Y"]) {
        const r = solveFault(c.network, { kind: "bus", bus: b }, "3ph");
        expect(Number.isFinite(r.ikss_kA)).toBe(true);
        expect(r.ikss_kA / ratedSum_kA).toBeGreaterThan(0.9); // common practice: converters hold 1.1-1.5 x rated
        expect(r.ikss_kA / ratedSum_kA).toBeLessThanOrEqual(1.2 + 1e-9); // cannot exceed the current limits
        expect(r.inverter).not.toBeNull();
        expect(r.inverter!.iec.ikss_kA).toBeGreaterThan(0);
        expect(r.inverter!.refined.ikss_kA).toBeGreaterThan(0);
        expect(r.inverter!.refined.converged).toBe(true);
        expect(r.messages.some((m) => m.code === "low-fault-current")).toBe(true);
      }
    });
  }
  it("sums the units' limits in the IEC treatment (current sources feeding a bolted fault)", () => {
    // IEC 60909-0:2016 converter superposition with |Zk| -> infinity: I"k -> sum I_kPF = 1.2 x total rated current.
    const c = compileNetwork(buildProject(elements, { inverterModel: "iec" }), { limit: "max" });
    if (!c.ok) throw new Error("compile");
    const r = solveFault(c.network, { kind: "bus", bus: "Y" }, "3ph");
    expect(r.inverter!.iec.ikss_kA).toBeCloseTo(1.2 * ratedSum_kA, 9);
  });
  it("never gives NaN for any fault type and says why an unbalanced fault draws nothing", () => {
    const c = compileNetwork(buildProject(elements, { inverterModel: "iec" }), { limit: "max" });
    if (!c.ok) throw new Error("compile");
    for (const t of FAULT_TYPES) {
      const r = solveFault(c.network, { kind: "bus", bus: "X" }, t);
      expect(Number.isFinite(r.ikss_kA) && Number.isFinite(r.ip_kA) && Number.isFinite(r.ith_kA)).toBe(true);
      for (const e of [...r.branchEnds, ...r.shunts]) for (const ph of e.phase_A) expect(Number.isFinite(ph.mag)).toBe(true);
      // No earthed neutral anywhere: an earth fault cannot drive current (isolated system).
      if (t === "LG") expect(r.ikss_kA).toBe(0);
    }
  });
});

describe("a dead island", () => {
  const p = buildProject(
    [
      bus("HV", 11), bus("LV", 0.4), bus("Z", 0.4),
      { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 100, skMin_MVA: 80 },
      { kind: "transformer", id: "T1", hvBus: "HV", lvBus: "LV", sr_MVA: 0.5, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 4 },
      { kind: "switch", id: "S1", busA: "LV", busB: "Z", closed: true },
      cable("C3", "Z", "LV", 0.1),
      { kind: "motor", id: "M", bus: "Z", pr_kW: 30, ur_kV: 0.4 },
    ],
    {},
    [{ id: "open", name: "Tie open", switchStates: { S1: false }, outOfService: ["C3"] }],
  );
  it("gives zero fault current and a message, not NaN", () => {
    const c = compileNetwork(p, { limit: "max", scenario: "open" });
    if (!c.ok) throw new Error(c.errors.map((e) => e.text).join());
    expect(c.network.messages.some((m) => m.code === "dead-island")).toBe(true);
    for (const t of FAULT_TYPES) {
      const r = solveFault(c.network, { kind: "bus", bus: "Z" }, t);
      expect(r.ikss_kA).toBe(0); // a motor alone is no source
      expect(r.messages.some((m) => m.code === "dead-island")).toBe(true);
      expect(Number.isNaN(r.ip_kA)).toBe(false);
    }
  });
  it("still solves the live part of the same scenario", () => {
    const c = compileNetwork(p, { limit: "max", scenario: "open" });
    if (!c.ok) throw new Error("compile");
    const r = solveFault(c.network, { kind: "bus", bus: "LV" }, "3ph");
    expect(r.ikss_kA).toBeGreaterThan(5); // 0.5 MVA, 4 %: about 0.5/(sqrt3 0.4 0.04) = 18 kA (hand estimate)
    expect(r.buses.find((b) => b.bus === "Z")!.energized).toBe(false);
  });
});

describe("a closed switch merges its buses", () => {
  it("gives the same current on both sides of a closed switch", () => {
    const p = buildProject([
      bus("A", 0.4), bus("B", 0.4),
      { kind: "grid", id: "Q", bus: "A", skMax_MVA: 20, skMin_MVA: 10 },
      { kind: "switch", id: "S", busA: "A", busB: "B" },
    ]);
    const c = compileNetwork(p, { limit: "max" });
    if (!c.ok) throw new Error("compile");
    const a = solveFault(c.network, { kind: "bus", bus: "A" }, "3ph").ikss_kA;
    expect(solveFault(c.network, { kind: "bus", bus: "B" }, "3ph").ikss_kA).toBe(a); // same electrical node
    expect(a).toBeCloseTo(20 / (Math.sqrt(3) * 0.4), 9); // S"k / (sqrt3 Un) by definition of S"k (c cancels)
  });
});
