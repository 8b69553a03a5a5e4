// Self-checks of the phase-domain reference solver against published worked examples and closed-form
// sequence-network formulas, so that it can be trusted as the yardstick for src/engine.
import { describe, it, expect } from "vitest";
import { abs, add, complex, divide, multiply, subtract, type Complex } from "mathjs";
import { phaseDomainFault, type PhaseFaultType } from "./phaseDomainFault.ts";
import { A_OP, phaseToSequence } from "./symmetricalComponents.ts";
import { miniProject } from "./miniProject.ts";
import { vectorGroups } from "../../../../src/model/schema.ts";

const c = (re: number, im = 0) => complex(re, im);
const cdiv = (x: Complex, y: Complex) => divide(x, y) as Complex;
const cadd = (...xs: Complex[]) => xs.reduce((s, x) => add(s, x) as Complex, c(0));
const cmul = (x: Complex | number, y: Complex) => multiply(x, y) as Complex;
const baseA = (un_kV: number) => (100e3 / (Math.sqrt(3) * un_kV)); // A per pu at 100 MVA
const angDeg = (x: Complex) => (Math.atan2(x.im, x.re) * 180) / Math.PI;
const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;

function expectComplex(actual: Complex, expected: Complex, tol: number) {
  expect(abs(subtract(actual, expected) as Complex) as unknown as number).toBeLessThan(tol);
}

/** A grid feeder whose Z1 and Z0 in pu of 100 MVA are given (pure reactances when rx = 0). */
function gridWith(bus: string, z1_pu: number, z0_pu: number, rx = 0, r0x0 = 0) {
  return { kind: "grid", id: "G", name: "Feeder", bus, skMax_MVA: 100 / z1_pu, skMin_MVA: 100 / z1_pu, rx, z0z1: z0_pu / z1_pu, r0x0 };
}
/** Sequence impedances of gridWith, for the closed-form side. */
const gridZ = (z_pu: number, rx: number) => c((z_pu * rx) / Math.sqrt(1 + rx * rx), z_pu / Math.sqrt(1 + rx * rx));

describe("phase-domain reference: published worked examples", () => {
  // The Electric Power Engineering Handbook, "Power System" volume, fault analysis section, figure 4.8 example:
  // Z1 = Z2 = j0.1422 pu, Z0 = j0.0452 pu; 3ph 7.032 pu; LG I0 = I1 = I2 = -j3.034, Ia = -j9.102 pu.
  const p = miniProject([{ kind: "bus", id: "F", un_kV: 13.8 }, gridWith("F", 0.1422, 0.0452)]);
  it("gives 7.032 pu for the three-phase fault", () => {
    const s = phaseDomainFault(p, { bus: "F", type: "3ph" });
    expect((abs(s.fault_kA[0]) as unknown as number) * 1000 / baseA(13.8)).toBeCloseTo(7.032, 3);
  });
  it("gives Ia = -j9.102 pu and equal sequence currents -j3.034 pu for the line-to-earth fault", () => {
    const s = phaseDomainFault(p, { bus: "F", type: "LG" });
    const ia = cmul(1000 / baseA(13.8), s.fault_kA[0]);
    expect(ia.re).toBeCloseTo(0, 9);
    expect(ia.im).toBeCloseTo(-9.102, 3);
    for (const i of phaseToSequence(s.fault_kA.map((x) => cmul(1000 / baseA(13.8), x)))) expect(i.im).toBeCloseTo(-3.034, 3);
    expect(abs(s.fault_kA[1]) as unknown as number).toBeLessThan(1e-12);
  });

  it("gives 31,374 A at the terminals of a 1500 kVA, 480 V, 5.75 % transformer on an infinite bus (within 0.05 %)", () => {
    // IAEI Magazine 2018, "Short-circuit calculations using transformer and source impedance": 31,374 A.
    const q = miniProject([
      { kind: "bus", id: "HV", un_kV: 13.8 },
      { kind: "bus", id: "LV", un_kV: 0.48 },
      { kind: "grid", id: "G", bus: "HV", skMax_MVA: 1e9, skMin_MVA: 1e9, rx: 0.1 },
      { kind: "transformer", id: "T", hvBus: "HV", lvBus: "LV", sr_MVA: 1.5, urHv_kV: 13.8, urLv_kV: 0.48, uk_pct: 5.75, ur_pct: 0, vectorGroup: "Dyn11" },
    ]);
    const ik_A = (abs(phaseDomainFault(q, { bus: "LV", type: "3ph" }).fault_kA[0]) as unknown as number) * 1000;
    expect(Math.abs(ik_A / 31374 - 1)).toBeLessThan(0.0005);
  });
});

// Closed forms: sequence-network connections for each fault type (Fortescue 1918; the standard textbook derivations,
// e.g. Glover, Sarma, Overbye, "Power System Analysis and Design", chapter on unsymmetrical faults; // from memory).
describe("phase-domain reference: closed-form sequence formulas", () => {
  const Zq1 = gridZ(0.5, 0.1);
  const Zq0 = gridZ(0.8, 0.2);
  const grid = gridWith("A", 0.5, 0.8, 0.1, 0.2);

  it("gives a line-to-line fault sqrt(3)/2 times the three-phase fault when Z1 = Z2", () => {
    // textbook relation I"k2 = (sqrt 3 / 2) I"k3 (IEC 60909-0:2016, I"k2 with Z2 = Z1)
    const p = miniProject([{ kind: "bus", id: "A", un_kV: 11 }, grid]);
    const i3 = abs(phaseDomainFault(p, { bus: "A", type: "3ph" }).fault_kA[0]) as unknown as number;
    const i2 = abs(phaseDomainFault(p, { bus: "A", type: "LL" }).fault_kA[1]) as unknown as number;
    expect(i2 / i3).toBeCloseTo(Math.sqrt(3) / 2, 12);
  });

  it("wires every vector group so that the LV side lags the HV side by clock x 30 degrees", () => {
    // IEC 60076-1:2011, clock-hour notation of vector groups. Yy0 is left out: with both stars floating the
    // zero-sequence mode has no reference without a magnetising branch, which this reference does not model.
    for (const vg of vectorGroups.filter((g) => g !== "Yy0")) {
      const p = miniProject([
        { kind: "bus", id: "A", un_kV: 11 },
        { kind: "bus", id: "B", un_kV: 0.4 },
        grid,
        { kind: "transformer", id: "T", hvBus: "A", lvBus: "B", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, vectorGroup: vg, earthingHv: { kind: "solid" }, earthingLv: { kind: "solid" } },
      ]);
      // A very high-impedance fault leaves the network practically at rest.
      const s = phaseDomainFault(p, { bus: "B", type: "LG", zf_ohm: { re: 1e9, im: 0 } });
      const v1A = phaseToSequence(s.busVoltage_pu.get("A") as Complex[])[1];
      const v1B = phaseToSequence(s.busVoltage_pu.get("B") as Complex[])[1];
      const clock = Number(vg.match(/(\d+)$/)?.[1]);
      expect(wrap(angDeg(v1B) - angDeg(v1A) + 30 * clock), vg).toBeCloseTo(0, 6);
      expect(abs(v1B) as unknown as number, vg).toBeCloseTo(1, 6);
    }
  });

  describe("line-to-earth fault on the LV side of a Dyn11 transformer", () => {
    const p = miniProject([
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "B", un_kV: 0.4 },
      grid,
      { kind: "transformer", id: "T", hvBus: "A", lvBus: "B", sr_MVA: 0.63, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 1.2, vectorGroup: "Dyn11", z0z1: 0.85 },
    ]);
    const s = phaseDomainFault(p, { bus: "B", type: "LG" });
    const zT = c(1.2 / 0.63, Math.sqrt(6 * 6 - 1.2 * 1.2) / 0.63); // pu of 100 MVA
    it("matches I = 3 E / (2 Z1 + Z0) with Z1 = Zq + ZT and Z0 = 0.85 ZT (the delta blocks the grid's zero sequence)", () => {
      // IEC 60909-0:2016, line-to-earth fault: I"k1 = sqrt(3) c Un / |2 Z1 + Z0|, here in pu with c = 1.
      const expected = cdiv(c(3), cadd(cmul(2, cadd(Zq1, zT)), cmul(0.85, zT)));
      expectComplex(cmul(1000 / baseA(0.4), s.fault_kA[0]), expected, 1e-9);
    });
    it("draws the HV current in two lines only, |I| = I_lv (0.4/11)/sqrt(3), with no residual on the delta side", () => {
      // Delta-star transformer: one LV winding carries the fault, its HV winding lies between two lines (winding ratio).
      const hv = s.ends.find((e) => e.element === "T" && e.end === "from")?.phase_A as Complex[];
      const ilv_A = (abs(s.fault_kA[0]) as unknown as number) * 1000;
      expect(abs(hv[2]) as unknown as number).toBeLessThan(1e-9 * ilv_A);
      expect(abs(hv[0]) as unknown as number).toBeCloseTo((ilv_A * (0.4 / 11)) / Math.sqrt(3), 6);
      expect(abs(cadd(...hv)) as unknown as number).toBeLessThan(1e-9 * ilv_A);
    });
  });

  it("adds three times each neutral impedance to the zero sequence of a YNyn0 transformer", () => {
    // Zero-sequence network of YNyn with earthing impedances: Zq0 + 3 Zn_hv + ZT0 + 3 Zn_lv (textbook zero-sequence equivalents of transformer connections; // from memory).
    const p = miniProject([
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "B", un_kV: 0.4 },
      grid,
      { kind: "transformer", id: "T", hvBus: "A", lvBus: "B", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 5, ur_pct: 1, vectorGroup: "YNyn0", z0z1: 0.9, earthingHv: { kind: "resistance", z_ohm: 12 }, earthingLv: { kind: "reactance", z_ohm: 0.01 } },
    ]);
    const zT = c(1, Math.sqrt(24)); // pu of 100 MVA: 5 % on 1 MVA with 1 % resistive part
    const z0 = cadd(Zq0, c((3 * 12) / (11 * 11 / 100)), cmul(0.9, zT), c(0, (3 * 0.01) / (0.4 * 0.4 / 100)));
    const z1 = cadd(Zq1, zT);
    const s = phaseDomainFault(p, { bus: "B", type: "LG" });
    expectComplex(cmul(1000 / baseA(0.4), s.fault_kA[0]), cdiv(c(3), cadd(z1, z1, z0)), 1e-9);
  });

  describe("a generator with Z2 != Z1 earthed through a resistor, faults at its terminals", () => {
    // Sequence impedances in pu of 100 MVA: 2 MVA machine at 11 kV, x"d 0.14, x2 0.17, x0 0.06, R/X 0.07, Rn 30 ohm.
    const p = miniProject([
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "generator", id: "M", bus: "A", sr_MVA: 2, ur_kV: 11, xdss_pu: 0.14, x2_pu: 0.17, x0_pu: 0.06, rx: 0.07, earthing: { kind: "resistance", z_ohm: 30 } },
    ]);
    const k = 100 / 2;
    const rG = 0.07 * 0.14 * k;
    const Z1 = c(rG, 0.14 * k);
    const Z2 = c(rG, 0.17 * k);
    const Z0 = cadd(c(rG, 0.06 * k), c((3 * 30) / (11 * 11 / 100)));
    const a = A_OP;
    const a2 = cmul(a, a);
    const pu = (x: Complex) => cmul(1000 / baseA(11), x);
    const cases: Array<[PhaseFaultType, () => Complex[]]> = [
      ["3ph", () => { const i1 = cdiv(c(1), Z1); return [i1, cmul(a2, i1), cmul(a, i1)]; }],
      ["LL", () => { const i1 = cdiv(c(1), cadd(Z1, Z2)); const ib = cmul(c(0, -Math.sqrt(3)), i1); return [c(0), ib, cmul(-1, ib)]; }],
      ["LG", () => { const i0 = cdiv(c(1), cadd(Z1, Z2, Z0)); return [cmul(3, i0), c(0), c(0)]; }],
      ["LLG", () => {
        const par = cdiv(cmul(Z2, Z0), cadd(Z2, Z0));
        const i1 = cdiv(c(1), cadd(Z1, par));
        const i2 = cmul(-1, cdiv(cmul(i1, Z0), cadd(Z2, Z0)));
        const i0 = cmul(-1, cdiv(cmul(i1, Z2), cadd(Z2, Z0)));
        return [c(0), cadd(i0, cmul(a2, i1), cmul(a, i2)), cadd(i0, cmul(a, i1), cmul(a2, i2))];
      }],
    ];
    for (const [type, expected] of cases) {
      it(`matches the sequence-network solution for a ${type} fault, phase by phase`, () => {
        const s = phaseDomainFault(p, { bus: "A", type });
        expected().forEach((e, k) => expectComplex(pu(s.fault_kA[k]), e, 1e-9));
      });
    }
  });

  it("puts the fault impedance where the textbook does: per phase (3ph), between b and c (LL), to earth (LG, LLG)", () => {
    // Glover, Sarma, Overbye, sections 9.2-9.4: I1 = E/(Z1+Zf); LL I1 = E/(Z1+Z2+Zf); LG I0 = E/(Z1+Z2+Z0+3Zf).
    const p = miniProject([{ kind: "bus", id: "A", un_kV: 11 }, grid]);
    const zf_ohm = { re: 0.6, im: 0.2 };
    const zf = c(0.6 / 1.21, 0.2 / 1.21); // pu of (11 kV)^2 / 100 MVA = 1.21 ohm
    const pu = (x: Complex) => cmul(1000 / baseA(11), x);
    expectComplex(pu(phaseDomainFault(p, { bus: "A", type: "3ph", zf_ohm }).fault_kA[0]), cdiv(c(1), cadd(Zq1, zf)), 1e-9);
    const i1LL = cdiv(c(1), cadd(Zq1, Zq1, zf));
    expectComplex(pu(phaseDomainFault(p, { bus: "A", type: "LL", zf_ohm }).fault_kA[1]), cmul(c(0, -Math.sqrt(3)), i1LL), 1e-9);
    expectComplex(pu(phaseDomainFault(p, { bus: "A", type: "LG", zf_ohm }).fault_kA[0]), cdiv(c(3), cadd(Zq1, Zq1, Zq0, cmul(3, zf))), 1e-9);
    const z0f = cadd(Zq0, cmul(3, zf));
    const i1 = cdiv(c(1), cadd(Zq1, cdiv(cmul(Zq1, z0f), cadd(Zq1, z0f))));
    const i0 = cmul(-1, cdiv(cmul(i1, Zq1), cadd(Zq1, z0f)));
    const s = phaseDomainFault(p, { bus: "A", type: "LLG", zf_ohm });
    expectComplex(pu(cadd(s.fault_kA[1], s.fault_kA[2])), cmul(3, i0), 1e-9);
  });

  it("adds a cable's own Z1 and Z0 (from R1, X1, R0, X0 and length) in series for a fault at its far end", () => {
    const p = miniProject([
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "B", un_kV: 11 },
      grid,
      { kind: "line", id: "L", fromBus: "A", toBus: "B", length_km: 2, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.35, parallel: 2, csa_mm2: 150, ampacity_A: 300 },
    ]);
    const zl1 = c((0.2 * 2) / 2 / 1.21, (0.1 * 2) / 2 / 1.21);
    const zl0 = c((0.8 * 2) / 2 / 1.21, (0.35 * 2) / 2 / 1.21);
    const s = phaseDomainFault(p, { bus: "B", type: "LG" });
    const z1 = cadd(Zq1, zl1);
    expectComplex(cmul(1000 / baseA(11), s.fault_kA[0]), cdiv(c(3), cadd(z1, z1, Zq0, zl0)), 1e-9);
  });

  it("adds a motor's locked-rotor impedance in parallel with the grid for a three-phase fault", () => {
    // IEC 60909-0:2016: ZM = (1/(ILR/IrM)) UrM^2/SrM, SrM = PrM/(eta cos phi).
    const p = miniProject([
      { kind: "bus", id: "A", un_kV: 0.4 },
      gridWith("A", 5, 5, 0.1, 0.1),
      { kind: "motor", id: "M", bus: "A", pr_kW: 200, ur_kV: 0.4, eta: 0.95, cosPhi: 0.85, ilrIr: 6, rx: 0.42 },
    ]);
    const zm = (1 / 6) * (100 / (0.2 / (0.95 * 0.85)));
    const ZM = c((zm * 0.42) / Math.sqrt(1 + 0.42 ** 2), zm / Math.sqrt(1 + 0.42 ** 2));
    const s = phaseDomainFault(p, { bus: "A", type: "3ph" });
    expectComplex(cmul(1000 / baseA(0.4), s.fault_kA[0]), cadd(cdiv(c(1), gridZ(5, 0.1)), cdiv(c(1), ZM)), 1e-9);
  });

  it("satisfies Kirchhoff's current law at every bus of a meshed network with a closed switch", () => {
    // Independent consistency check of the reported element currents (KCL, per phase).
    const p = miniProject([
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "B", un_kV: 11 },
      { kind: "bus", id: "C", un_kV: 11 },
      { kind: "bus", id: "D", un_kV: 11 },
      grid,
      { kind: "line", id: "L1", fromBus: "A", toBus: "B", length_km: 1, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.35, csa_mm2: 150, ampacity_A: 300 },
      { kind: "line", id: "L2", fromBus: "B", toBus: "C", length_km: 1.5, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.35, csa_mm2: 150, ampacity_A: 300 },
      { kind: "line", id: "L3", fromBus: "C", toBus: "A", length_km: 0.7, r1_ohmPerKm: 0.3, x1_ohmPerKm: 0.1, r0_ohmPerKm: 1.2, x0_ohmPerKm: 0.4, csa_mm2: 95, ampacity_A: 250 },
      { kind: "switch", id: "S", busA: "C", busB: "D" },
      { kind: "generator", id: "M", bus: "D", sr_MVA: 2, ur_kV: 11, xdss_pu: 0.14, x2_pu: 0.17, x0_pu: 0.06, earthing: { kind: "solid" } },
    ]);
    for (const type of ["3ph", "LL", "LG", "LLG"] as const) {
      const s = phaseDomainFault(p, { bus: "B", type });
      for (const bus of ["A", "B", "C", "D"]) {
        for (let k = 0; k < 3; k++) {
          let sum = c(0);
          for (const e of s.ends) if (e.bus === bus) sum = cadd(sum, e.phase_A[k]);
          if (bus === "B") sum = cadd(sum, cmul(1000, s.fault_kA[k]));
          expect(abs(sum) as unknown as number, `${type} ${bus} ${k}`).toBeLessThan(1e-6);
        }
      }
    }
  });
});
