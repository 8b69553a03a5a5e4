import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, FAULT_TYPES, type CompiledNetwork, type FaultLocation } from "../../../src/engine/index.ts";
import { buildProject, bus, toRect, type RawElement } from "./helpers/projectBuilder.ts";

// Kirchhoff's current law at every bus during every fault type: with currents counted from the bus into each
// element, the element currents at a bus sum to minus the current drawn by the fault there, and to zero elsewhere.
const line = (id: string, a: string, b: string, km: number): RawElement => ({
  kind: "line", id, fromBus: a, toBus: b, length_km: km, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.09, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.35, csa_mm2: 95, ampacity_A: 250,
});

const networks: [string, RawElement[], Record<string, unknown>][] = [
  [
    "grid, Dyn11 transformer, LV cable, generator and motor",
    [
      bus("HV", 11), bus("LV", 0.4), bus("LV2", 0.4),
      { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 200, skMin_MVA: 100 },
      { kind: "transformer", id: "T1", hvBus: "HV", lvBus: "LV", sr_MVA: 0.8, urHv_kV: 11, urLv_kV: 0.42, uk_pct: 5, ur_pct: 1.2, tap_pct: 2.5 },
      line("C1", "LV", "LV2", 0.15),
      { kind: "generator", id: "G1", bus: "LV2", sr_MVA: 0.3, ur_kV: 0.4, xdss_pu: 0.14, x2_pu: 0.15, x0_pu: 0.06, earthing: { kind: "resistance", z_ohm: 0.5 } },
      { kind: "motor", id: "M1", bus: "LV", pr_kW: 90, ur_kV: 0.4 },
    ],
    {},
  ],
  [
    "meshed MV ring with YNyn and YNd transformers and inverters (refined)",
    [
      bus("A", 20), bus("B", 20), bus("C", 20), bus("D", 0.4), bus("E", 6.6),
      { kind: "grid", id: "Q", bus: "A", skMax_MVA: 400, skMin_MVA: 200, rx: 0.15 },
      line("L1", "A", "B", 3), line("L2", "B", "C", 2), line("L3", "C", "A", 4),
      { kind: "transformer", id: "T2", hvBus: "B", lvBus: "D", sr_MVA: 0.63, urHv_kV: 20, urLv_kV: 0.4, uk_pct: 4, vectorGroup: "YNyn0", earthingHv: { kind: "solid" }, earthingLv: { kind: "reactance", z_ohm: 0.05 } },
      { kind: "transformer", id: "T3", hvBus: "C", lvBus: "E", sr_MVA: 5, urHv_kV: 20, urLv_kV: 6.6, uk_pct: 8, vectorGroup: "YNd11", earthingHv: { kind: "solid" } },
      { kind: "inverter", id: "PV", bus: "D", sr_MVA: 0.25, ur_kV: 0.4, negSeq: { mode: "k-factor", k2: 2 } },
      { kind: "inverter", id: "BESS", bus: "E", sr_MVA: 2, ur_kV: 6.6, control: "grid-forming" },
    ],
    { inverterModel: "refined" },
  ],
  [
    "inverter-only island (IEC treatment)",
    [
      bus("X", 0.4), bus("Y", 0.4),
      line("C2", "X", "Y", 0.2),
      { kind: "inverter", id: "GFM", bus: "X", sr_MVA: 0.5, ur_kV: 0.4, control: "grid-forming" },
      { kind: "inverter", id: "GFL", bus: "Y", sr_MVA: 0.2, ur_kV: 0.4 },
    ],
    { inverterModel: "iec" },
  ],
];

function checkKcl(net: CompiledNetwork, location: FaultLocation, faultBus: string | null) {
  for (const type of FAULT_TYPES) {
    const r = solveFault(net, location, type);
    const sums = new Map<string, { re: number; im: number }[]>();
    const addAt = (bus: string, ph: { mag: number; ang_deg: number }[]) => {
      const s = sums.get(bus) ?? [0, 1, 2].map(() => ({ re: 0, im: 0 }));
      ph.forEach((p, i) => {
        const z = toRect(p);
        s[i].re += z.re;
        s[i].im += z.im;
      });
      sums.set(bus, s);
    };
    for (const e of [...r.branchEnds, ...r.shunts]) addAt(e.bus, e.phase_A);
    for (const b of r.buses) {
      const s = sums.get(b.bus) ?? [0, 1, 2].map(() => ({ re: 0, im: 0 }));
      const scale = Math.max(1, ...[...r.branchEnds, ...r.shunts].filter((e) => e.bus === b.bus).flatMap((e) => e.phase_A.map((p) => p.mag)));
      for (let ph = 0; ph < 3; ph++) {
        let er = s[ph].re;
        let ei = s[ph].im;
        if (b.bus === faultBus) {
          const f = toRect(r.faultPhase_kA[ph]);
          er += f.re * 1000;
          ei += f.im * 1000;
        }
        expect(Math.hypot(er, ei) / scale, `${type} at ${JSON.stringify(location)}: bus ${b.bus} phase ${ph}`).toBeLessThan(1e-9);
      }
    }
    expect(Number.isFinite(r.ikss_kA)).toBe(true);
  }
}

describe("Kirchhoff's current law during faults", () => {
  for (const [label, elements, study] of networks) {
    it(`holds at every bus for every fault type: ${label}`, () => {
      const p = buildProject(elements, study);
      const c = compileNetwork(p, { limit: "max" });
      if (!c.ok) throw new Error(c.errors.map((e) => e.text).join("; "));
      for (const b of p.elements.filter((e) => e.kind === "bus")) checkKcl(c.network, { kind: "bus", bus: b.id }, b.id);
    });
  }
  it("holds at the buses for a fault part-way along a line (the fault point is not a bus)", () => {
    const [, elements, study] = networks[1];
    const c = compileNetwork(buildProject(elements, study), { limit: "max" });
    if (!c.ok) throw new Error("compile");
    checkKcl(c.network, { kind: "line", line: "L2", pct: 35 }, null);
  });
});
