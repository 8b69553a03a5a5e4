// The engine's conventions where IEC 60909-0:2016 leaves a choice (src/engine/conventions.ts), each checked against a
// hand calculation with the standard's formulas.
import { describe, expect, it } from "vitest";
import { compileNetwork, engineConventions, solveFault, type FaultType } from "../../../src/engine/index.ts";
import { buildProject, bus, type RawElement } from "./helpers/projectBuilder.ts";

const SQRT3 = Math.sqrt(3);
type C = { re: number; im: number };
const add = (...zs: C[]): C => zs.reduce((a, b) => ({ re: a.re + b.re, im: a.im + b.im }), { re: 0, im: 0 });
const scale = (z: C, k: number): C => ({ re: z.re * k, im: z.im * k });
const abs = (a: C) => Math.hypot(a.re, a.im);
const fromRx = (zMag: number, rx: number): C => {
  const x = zMag / Math.sqrt(1 + rx * rx);
  return { re: rx * x, im: x };
};

const fault = (elements: RawElement[], at: string, type: FaultType, limit: "max" | "min", study: Record<string, unknown> = {}) => {
  const c = compileNetwork(buildProject(elements, study), { limit });
  if (!c.ok) throw new Error(c.errors.map((e) => e.text).join("; "));
  return solveFault(c.network, { kind: "bus", bus: at }, type);
};

const grid = { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 150, skMin_MVA: 100, rx: 0.1 };
const transformer = (tap_pct = 0) => ({ kind: "transformer", id: "T", hvBus: "HV", lvBus: "LV", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 1, tap_pct });
/** Transformer of 1 MVA, uk 6 %, ur 1 %, in ohms at 0.4 kV (IEC 60909-0:2016, 6.3.1). */
const zT = (() => {
  const z = (0.06 * 0.16) / 1;
  const r = (0.01 * 0.16) / 1;
  return { re: r, im: Math.sqrt(z * z - r * r) };
})();
const kT = (cmax: number) => (0.95 * cmax) / (1 + 0.6 * Math.sqrt(0.06 ** 2 - 0.01 ** 2)); // 6.3.3

describe("engine conventions", () => {
  it("generator: rx gives the resistance of x(2) and x(0), and KG scales them (6.6.1)", () => {
    const els: RawElement[] = [bus("G1", 0.4), { kind: "generator", id: "G", bus: "G1", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.12, x2_pu: 0.14, x0_pu: 0.05, rx: 0.15, cosPhi: 0.8, earthing: { kind: "solid" } }];
    const cmax = 1.1; // Table 1, LV +10 %
    const kG = cmax / (1 + 0.12 * 0.6); // KG = (Un/UrG) cmax / (1 + x"d sin phi), Un = UrG
    const zb = 0.16 / 0.5;
    const z = (x: number): C => ({ re: 0.15 * x * zb * kG, im: x * zb * kG });
    // Line-to-line: I"k2 = c Un / |Z(1) + Z(2)| (IEC 60909-0:2016, 7.2 form, from memory)
    expect(fault(els, "G1", "LL", "max").ikss_kA).toBeCloseTo((cmax * 0.4) / abs(add(z(0.12), z(0.14))), 9);
    // Line-to-earth: I"k1 = sqrt3 c Un / |Z(1) + Z(2) + Z(0)|
    expect(fault(els, "G1", "LG", "max").ikss_kA).toBeCloseTo((SQRT3 * cmax * 0.4) / abs(add(z(0.12), z(0.14), z(0.05))), 9);
  });

  const fed: RawElement[] = [bus("HV", 11), bus("LV", 0.4), grid, transformer()];

  it("correction factors at the minimum limit: KT with cmax; cmin only in the source and ZQ", () => {
    const cminLv = 0.95; // Table 1
    const zQ = fromRx(((1.0 * 11 * 11) / 100) * (0.4 / 11) ** 2, 0.1); // ZQ = cQmin UnQ^2 / S"kQmin, cQmin 1.0 above 1 kV
    const zk = add(zQ, scale(zT, kT(1.1)));
    expect(fault(fed, "LV", "3ph", "min").ikss_kA).toBeCloseTo((cminLv * 0.4) / (SQRT3 * abs(zk)), 9);
  });

  it("tap: ideal ratio on the HV side, impedance on the LV side unchanged by the tap", () => {
    const t = 1.05; // tap +5 % on an 11 kV winding in an 11 kV network
    const zQ = fromRx(((1.1 * 11 * 11) / 150) * (0.4 / 11) ** 2 / (t * t), 0.1);
    const zk = add(zQ, scale(zT, kT(1.1)));
    const els = [bus("HV", 11), bus("LV", 0.4), grid, transformer(5)];
    expect(fault(els, "LV", "3ph", "max").ikss_kA).toBeCloseTo((1.1 * 0.4) / (SQRT3 * abs(zk)), 9);
  });

  it("conductor temperature: R = R20 (1 + 0.004/K (theta_e - 20)) at the minimum limit only", () => {
    const cable = { kind: "line", id: "C", fromBus: "LV", toBus: "F", length_km: 0.2, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.3, csa_mm2: 150, ampacity_A: 300 };
    const els = [...fed, bus("F", 0.4), cable];
    const zQmin = fromRx(((1.0 * 11 * 11) / 100) * (0.4 / 11) ** 2, 0.1);
    const zQmax = fromRx(((1.1 * 11 * 11) / 150) * (0.4 / 11) ** 2, 0.1);
    const rf = 1 + 0.004 * (160 - 20); // IEC 60909-0:2016, 6.5 (RL at theta_e), end temperature 160 C
    const zCmin = { re: 0.2 * 0.2 * rf, im: 0.08 * 0.2 };
    const zCmax = { re: 0.2 * 0.2, im: 0.08 * 0.2 };
    expect(fault(els, "F", "3ph", "min", { conductorEndTemp_C: 160 }).ikss_kA).toBeCloseTo((0.95 * 0.4) / (SQRT3 * abs(add(zQmin, scale(zT, kT(1.1)), zCmin))), 9);
    expect(fault(els, "F", "3ph", "max", { conductorEndTemp_C: 160 }).ikss_kA).toBeCloseTo((1.1 * 0.4) / (SQRT3 * abs(add(zQmax, scale(zT, kT(1.1)), zCmax))), 9);
  });

  it("motors are left out at the minimum limit and kept at the maximum", () => {
    const motor = { kind: "motor", id: "M", bus: "LV", pr_kW: 200, ur_kV: 0.4, ilrIr: 6, eta: 0.95, cosPhi: 0.86 };
    const withMotor = [...fed, motor];
    expect(fault(withMotor, "LV", "3ph", "min").ikss_kA).toBeCloseTo(fault(fed, "LV", "3ph", "min").ikss_kA, 12);
    // At the maximum the motor adds its I"kM = c Un / (sqrt3 |ZM|) roughly in phase: clearly more current.
    expect(fault(withMotor, "LV", "3ph", "max").ikss_kA - fault(fed, "LV", "3ph", "max").ikss_kA).toBeGreaterThan(1);
  });

  it("converters feed the minimum currents as the maximum ones (IEC model: I_kPF = iMax Ir at both limits)", () => {
    const els = [...fed, { kind: "inverter", id: "PV", bus: "LV", sr_MVA: 0.3, ur_kV: 0.4, iMax_pu: 1.2 }];
    const ikPF = (1.2 * 0.3) / (SQRT3 * 0.4); // kA; at its own bus Zij = Zk, so the share is I_kPF itself
    for (const limit of ["max", "min"] as const) {
      const r = fault(els, "LV", "3ph", limit, { inverterModel: "iec" });
      expect(r.ikss_kA - r.ikssSources_kA).toBeCloseTo(ikPF, 9);
    }
  });

  it("states every convention, and the classic method's differences", () => {
    const iec = engineConventions("iec60909");
    expect(iec.map((c) => c.topic)).toEqual([
      "Peak current with converters",
      "Generator negative and zero sequence",
      "Motors at the minimum limit",
      "Converters at the minimum limit",
      "Correction factors at the minimum limit",
      "Transformer tap",
      "Conductor temperature",
    ]);
    expect(iec.find((c) => c.topic === "Conductor temperature")!.text).toContain("0.004/K");
    expect(iec.find((c) => c.topic === "Correction factors at the minimum limit")!.text).toContain("cmax at both limits");
    expect(engineConventions("classic").find((c) => c.topic === "Motors at the minimum limit")!.text).toContain("keeps motors at both limits");
  });
});
