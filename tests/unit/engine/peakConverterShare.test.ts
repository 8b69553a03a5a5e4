// Peak current ip with full-size converter units: the voltage sources' share carries kappa, the converters' share
// kappa = 1. Hand calculations with the IEC 60909-0:2016 formulas, and the all-bus sweep against single faults.
import { describe, expect, it } from "vitest";
import { compileNetwork, peakFactor, solveFault, sweepFaults } from "../../../src/engine/index.ts";
import { buildProject, bus, type RawElement } from "./helpers/projectBuilder.ts";

const SQRT3 = Math.sqrt(3);
type C = { re: number; im: number };
const add = (a: C, b: C): C => ({ re: a.re + b.re, im: a.im + b.im });
const abs = (a: C) => Math.hypot(a.re, a.im);

// Grid 150 MVA at 11 kV (R/X 0.1), transformer 11/0.4 kV 1.25 MVA uk 6 % ur 1 %, a 300 kVA converter (limit
// 1.2 Ir) on the LV bus, and a short cable from the LV bus to bus F.
const elements: RawElement[] = [
  bus("HV", 11), bus("LV", 0.4), bus("F", 0.4),
  { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 150, skMin_MVA: 100, rx: 0.1 },
  { kind: "transformer", id: "T", hvBus: "HV", lvBus: "LV", sr_MVA: 1.25, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 1 },
  { kind: "line", id: "C", fromBus: "LV", toBus: "F", length_km: 0.1, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.3, csa_mm2: 150, ampacity_A: 300 },
  { kind: "inverter", id: "PV", bus: "LV", sr_MVA: 0.3, ur_kV: 0.4, iMax_pu: 1.2 },
];

/** Hand calculation at LV (ohms at 0.4 kV), IEC 60909-0:2016 at the maximum limit, LV tolerance +10 %. */
function byHand() {
  const cHv = 1.1; // Table 1, above 1 kV, cmax
  const cLv = 1.1; // Table 1, LV with +10 % tolerance, cmax
  // 6.2: ZQ = cQ UnQ^2 / S"kQ, referred to the LV side by the rated ratio squared; XQ from R/X.
  const zQ = ((cHv * 11 * 11) / 150) * (0.4 / 11) ** 2;
  const xQ = zQ / Math.sqrt(1 + 0.1 * 0.1);
  const ZQ = { re: 0.1 * xQ, im: xQ };
  // 6.3.1: ZT = uk UrT^2 / SrT, RT = ur UrT^2 / SrT; 6.3.3: KT = 0.95 cmax / (1 + 0.6 xT).
  const zT = (0.06 * 0.4 * 0.4) / 1.25;
  const rT = (0.01 * 0.4 * 0.4) / 1.25;
  const xT = Math.sqrt(zT * zT - rT * rT);
  const kT = (0.95 * cLv) / (1 + 0.6 * Math.sqrt(0.06 ** 2 - 0.01 ** 2));
  const Zlv = add(ZQ, { re: kT * rT, im: kT * xT });
  const Zc = { re: 0.2 * 0.1, im: 0.08 * 0.1 };
  const Zf = add(Zlv, Zc);
  // Full-size converter: a current source of I_kPF = iMax Ir (from memory, as the engine's IEC model).
  const ikPF_kA = (1.2 * 0.3) / (SQRT3 * 0.4);
  const ikS = (z: C) => (cLv * 0.4) / (SQRT3 * abs(z)); // kA, voltage sources' share c Un / (sqrt3 |Zk|)
  return { Zlv, Zf, ikPF_kA, ikS };
}

describe("peak current with a full-size converter (IEC 60909-0:2016, 8.1, from memory: converter share sqrt(2) I\"kPF)", () => {
  const c = compileNetwork(buildProject(elements, { inverterModel: "iec" }), { limit: "max" });
  if (!c.ok) throw new Error("compile");
  const h = byHand();

  it("at the converter's own bus: ip = kappa sqrt(2) I\"k,S + sqrt(2) I\"kPF", () => {
    const r = solveFault(c.network, { kind: "bus", bus: "LV" }, "3ph");
    const ikS = h.ikS(h.Zlv);
    // I"k = (c Un / sqrt3 + sum |Zij| I_kPFj) / |Zk| (from memory); the unit sits at the fault, Zij = Zk.
    expect(r.ikss_kA).toBeCloseTo(ikS + h.ikPF_kA, 9);
    expect(r.ikssSources_kA).toBeCloseTo(ikS, 9);
    // 8.1.1, single-fed: kappa = 1.02 + 0.98 e^(-3 R/X) from Zk (formula from memory, reference-checks.md).
    const kappa = peakFactor(h.Zlv.re / h.Zlv.im);
    expect(r.peakMethod).toBe("radial-branch-sum");
    expect(r.kappa).toBeCloseTo(kappa, 9);
    const ip = kappa * Math.SQRT2 * ikS + Math.SQRT2 * h.ikPF_kA;
    expect(r.ip_kA).toBeCloseTo(ip, 9);
    // The converter's 0.52 kA would add 0.52 (kappa - 1) sqrt(2) kA if it carried kappa.
    expect(kappa * Math.SQRT2 * r.ikss_kA - r.ip_kA).toBeCloseTo((kappa - 1) * Math.SQRT2 * h.ikPF_kA, 9);
  });

  it("one cable away: the converter's share through Zij / Zk, still without kappa", () => {
    const r = solveFault(c.network, { kind: "bus", bus: "F" }, "3ph");
    const ikS = h.ikS(h.Zf);
    // Radial: Z[F, LV] = Z[LV, LV], so the unit's share at F is |Zlv| / |Zf| I_kPF.
    const ikPF = (abs(h.Zlv) / abs(h.Zf)) * h.ikPF_kA;
    expect(r.ikss_kA).toBeCloseTo(ikS + ikPF, 9);
    const kappa = peakFactor(h.Zf.re / h.Zf.im);
    expect(r.ip_kA).toBeCloseTo(kappa * Math.SQRT2 * ikS + Math.SQRT2 * ikPF, 9);
  });

  it("the all-bus sweep gives the same ip", () => {
    const sw = sweepFaults(c.network);
    sw.busIds.forEach((b, i) => expect(sw.ip_kA[i]).toBeCloseTo(solveFault(c.network, { kind: "bus", bus: b }, "3ph").ip_kA, 9));
  });

  it("without the converter, ip is kappa sqrt(2) I\"k as before", () => {
    const bare = compileNetwork(buildProject(elements.filter((e) => e.kind !== "inverter")), { limit: "max" });
    if (!bare.ok) throw new Error("compile");
    const r = solveFault(bare.network, { kind: "bus", bus: "LV" }, "3ph");
    expect(r.ip_kA).toBeCloseTo(peakFactor(h.Zlv.re / h.Zlv.im) * Math.SQRT2 * h.ikS(h.Zlv), 9); // 8.1.1
  });
});

// A meshed LV network with a generator, a grid-following and a grid-forming unit.
const cable = (id: string, a: string, b: string, km: number): RawElement => ({
  kind: "line", id, fromBus: a, toBus: b, length_km: km, r1_ohmPerKm: 0.15, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.6, x0_ohmPerKm: 0.3, csa_mm2: 120, ampacity_A: 300,
});
const meshed: RawElement[] = [
  bus("HV", 11), bus("LV", 0.4), bus("F1", 0.4), bus("F2", 0.4),
  { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 150, skMin_MVA: 90 },
  { kind: "transformer", id: "T", hvBus: "HV", lvBus: "LV", sr_MVA: 1.25, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 },
  cable("C1", "LV", "F1", 0.12), cable("C2", "F1", "F2", 0.2), cable("C3", "LV", "F2", 0.25),
  { kind: "generator", id: "G", bus: "F2", sr_MVA: 0.4, ur_kV: 0.4, xdss_pu: 0.13, x2_pu: 0.14, x0_pu: 0.05, earthing: { kind: "solid" } },
  { kind: "inverter", id: "PV", bus: "F1", sr_MVA: 0.2, ur_kV: 0.4 },
  { kind: "inverter", id: "B", bus: "LV", sr_MVA: 0.3, ur_kV: 0.4, control: "grid-forming" },
];

describe("the voltage sources' share I\"k,S", () => {
  for (const model of ["iec", "refined"] as const) {
    for (const limit of ["max", "min"] as const) {
      it(`is the fault current with every converter removed, and the sweep's ip equals single faults' (${model}, ${limit})`, () => {
        const c = compileNetwork(buildProject(meshed, { inverterModel: model }), { limit });
        const bare = compileNetwork(buildProject(meshed.filter((e) => e.kind !== "inverter")), { limit });
        if (!c.ok || !bare.ok) throw new Error("compile");
        const sw = sweepFaults(c.network);
        sw.busIds.forEach((b, i) => {
          const r = solveFault(c.network, { kind: "bus", bus: b }, "3ph");
          // Independent path: the same network built without the converters (grid-forming one included).
          for (const type of ["3ph", "LG"] as const) {
            const s = solveFault(c.network, { kind: "bus", bus: b }, type);
            expect(s.ikssSources_kA).toBeCloseTo(solveFault(bare.network, { kind: "bus", bus: b }, type).ikss_kA, 9);
          }
          expect(r.ip_kA).toBeCloseTo(Math.SQRT2 * (r.ikss_kA + (r.kappa - 1) * r.ikssSources_kA), 9);
          // The sweep reaches the network without the grid-forming unit by the Woodbury identity.
          expect(Math.abs(sw.ip_kA[i] - r.ip_kA)).toBeLessThan(1e-9 * r.ip_kA);
        });
      });
    }
  }

  it("is zero in an island of converters alone: ip = sqrt(2) I\"k", () => {
    const island: RawElement[] = [
      bus("A", 0.4), bus("B2", 0.4), cable("L", "A", "B2", 0.1),
      { kind: "inverter", id: "BESS", bus: "A", sr_MVA: 0.3, ur_kV: 0.4, control: "grid-forming" },
      { kind: "inverter", id: "PV", bus: "B2", sr_MVA: 0.2, ur_kV: 0.4 },
    ];
    for (const model of ["iec", "refined"] as const) {
      const c = compileNetwork(buildProject(island, { inverterModel: model }), { limit: "max" });
      if (!c.ok) throw new Error("compile");
      const sw = sweepFaults(c.network);
      sw.busIds.forEach((b, i) => {
        const r = solveFault(c.network, { kind: "bus", bus: b }, "3ph");
        expect(r.ikss_kA).toBeGreaterThan(0);
        expect(r.ikssSources_kA).toBe(0);
        expect(r.ip_kA).toBeCloseTo(Math.SQRT2 * r.ikss_kA, 12); // 8.1 (from memory): converters carry no d.c. component
        expect(sw.ip_kA[i]).toBeCloseTo(r.ip_kA, 9);
      });
    }
  });
});
