import { describe, expect, it } from "vitest";
import { runLoadFlow, loadCurrents } from "../../../src/engine/index.ts";
import { buildProject, bus } from "./helpers/projectBuilder.ts";

// Two-bus case: a grid feeder holds bus A at 1.0 pu; a cable of impedance Z feeds a constant-power load S at bus B.
// Analytic solution (two-bus voltage-drop equation): with V = |V_B|, a = P R + Q X (per unit),
//   V^4 + (2a - 1) V^2 + |Z|^2 |S|^2 = 0  =>  V^2 = ((1 - 2a) + sqrt((1 - 2a)^2 - 4 |Z|^2 |S|^2)) / 2,
// and the line current is |S| / V in per unit.
const un = 0.4;
const baseMVA = 1;
const zBase = (un * un) / baseMVA;
const km = 0.3;
const r_ohm = 0.2 * km;
const x_ohm = 0.08 * km;
const P_kW = 150;
const Q_kvar = 60;
const project = buildProject(
  [
    bus("A", un),
    bus("B", un),
    { kind: "grid", id: "Q", bus: "A", skMax_MVA: 50, skMin_MVA: 30 },
    { kind: "line", id: "C1", fromBus: "A", toBus: "B", length_km: km, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.3, csa_mm2: 185, ampacity_A: 400 },
    { kind: "load", id: "LD", bus: "B", p_kW: P_kW, q_kvar: Q_kvar },
  ],
  {},
  [],
  baseMVA,
);

describe("balanced load flow on two buses", () => {
  const R = r_ohm / zBase;
  const X = x_ohm / zBase;
  const P = P_kW / 1000 / baseMVA;
  const Q = Q_kvar / 1000 / baseMVA;
  const a = P * R + Q * X;
  const z2s2 = (R * R + X * X) * (P * P + Q * Q);
  const v = Math.sqrt(((1 - 2 * a) + Math.sqrt((1 - 2 * a) ** 2 - 4 * z2s2)) / 2);
  const r = runLoadFlow(project);

  it("converges and matches the analytic receiving-end voltage", () => {
    expect(r.converged).toBe(true);
    expect(r.buses.find((b) => b.bus === "A")!.v_pu).toBeCloseTo(1, 12);
    expect(r.buses.find((b) => b.bus === "B")!.v_pu).toBeCloseTo(v, 9); // analytic two-bus solution above
  });
  it("gives the analytic current at both cable ends, the load and the feeder", () => {
    const i_A = ((Math.hypot(P, Q) / v) * baseMVA * 1000) / (Math.sqrt(3) * un);
    const c = r.branches.find((b) => b.element === "C1")!;
    expect(c.from.i_A).toBeCloseTo(i_A, 6);
    expect(c.to.i_A).toBeCloseTo(i_A, 6);
    expect(c.loading_pct).toBeCloseTo((100 * i_A) / 400, 6);
    const at = loadCurrents(r);
    expect(at.find((x) => x.element === "LD")!.i_A).toBeCloseTo(i_A, 6);
    expect(at.find((x) => x.element === "Q")!.i_A).toBeCloseTo(i_A, 6);
  });
  it("balances power: feeder output = load + line losses", () => {
    const feeder = r.shunts.find((s) => s.element === "Q")!;
    const i2 = (Math.hypot(P, Q) / v) ** 2;
    expect(-feeder.p_MW).toBeCloseTo((P + i2 * R) * baseMVA, 9); // losses I^2 R (per unit)
    expect(-feeder.q_Mvar).toBeCloseTo((Q + i2 * X) * baseMVA, 9);
    expect(r.slack).toMatch(/Grid feeder Q/);
  });
});

describe("load flow of an island without a grid", () => {
  it("takes the largest grid-forming source as the slack and holds generators at 1.0 pu", () => {
    const p = buildProject([
      bus("G", 0.4), bus("H", 0.4),
      { kind: "generator", id: "GEN", bus: "G", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.15, x2_pu: 0.15, x0_pu: 0.05 },
      { kind: "inverter", id: "BESS", bus: "H", sr_MVA: 0.8, ur_kV: 0.4, control: "grid-forming" },
      { kind: "line", id: "C", fromBus: "G", toBus: "H", length_km: 0.1, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.3, csa_mm2: 95, ampacity_A: 250 },
      { kind: "load", id: "L", bus: "G", p_kW: 300, q_kvar: 100 },
    ]);
    const r = runLoadFlow(p);
    expect(r.converged).toBe(true);
    expect(r.slack).toMatch(/BESS/);
    expect(r.buses.find((b) => b.bus === "G")!.v_pu).toBeCloseTo(1, 9); // PV set-point
    // Active power balance: slack + generator = load + losses (>= load).
    const out = r.shunts.filter((s) => s.element !== "L").reduce((s, x) => s - x.p_MW, 0);
    expect(out).toBeGreaterThanOrEqual(0.3 - 1e-12);
    expect(out).toBeLessThan(0.31); // short cable: small losses (hand estimate)
  });
});
