import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, sweepFaults, type CompiledNetwork } from "../../../src/engine/index.ts";
import { unitGeneratorK, unitKS, unitKSO, unitTransformerK } from "../../../src/engine/iec60909/factors.ts";
import type { Model } from "../../../src/engine/network/model.ts";
import { buildProject, bus, type RawElement } from "./helpers/projectBuilder.ts";

// A 10 MVA power station unit: generator 10 MVA, 11 kV, x"d 0.15, R/X 0.05, cos phi 0.8 (sin 0.6), on bus G
// (11 kV); unit transformer 10 MVA, 34.5/11 kV, uk 10 %, uR 0.6 %, YNd11, HV star solidly earthed, on bus Q (33 kV).
// IEC method, maximum currents, cmax 1.1 on both levels. Hand calculation (IEC 60909-0:2016, 6.7.1, eqs. (21), (22)):
//   xT  = sqrt(10^2 - 0.6^2) / 100 = 0.0998198
//   K_S = (33^2/11^2) (11^2/34.5^2) 1.1 / (1 + |0.15 - 0.0998198| 0.6) = 0.977011
//   Z_G = (0.05 + j) 0.15 * 11^2 / 10 = 0.09075 + j1.815 ohm;  t_r = 34.5/11
//   Z_THV = (0.006 + j0.0998198) 34.5^2 / 10 = 0.71415 + j11.88096 ohm
//   Z_S = K_S (t_r^2 Z_G + Z_THV) = 1.56990 + j29.05124 ohm
//   I"k (3ph at Q) = 1.1 * 33 / (sqrt3 |Z_S|) = 0.720358 kA
const SIN = 0.6;
const XT = Math.sqrt(10 * 10 - 0.6 * 0.6) / 100;
const TR = 34.5 / 11;
const ZG = { re: 0.05 * 0.15 * 121 / 10, im: (0.15 * 121) / 10 };
const ZTHV = { re: (0.006 * 34.5 * 34.5) / 10, im: (XT * 34.5 * 34.5) / 10 };
const KS = ((33 * 33) / (11 * 11)) * ((11 * 11) / (34.5 * 34.5)) * (1.1 / (1 + Math.abs(0.15 - XT) * SIN));
const ZS = { re: KS * (TR * TR * ZG.re + ZTHV.re), im: KS * (TR * TR * ZG.im + ZTHV.im) };
const mag = (z: { re: number; im: number }) => Math.hypot(z.re, z.im);

function unitElements(unit: Record<string, unknown> | undefined, tap_pct = 0): RawElement[] {
  return [
    bus("Q", 33),
    bus("G", 11),
    { kind: "generator", id: "G1", name: "Unit 1", bus: "G", sr_MVA: 10, ur_kV: 11, cosPhi: 0.8, xdss_pu: 0.15, x2_pu: 0.15, x0_pu: 0.1, rx: 0.05, ...(unit ? { unit } : {}) },
    {
      kind: "transformer", id: "T1", name: "Unit transformer", hvBus: "Q", lvBus: "G", sr_MVA: 10, urHv_kV: 34.5, urLv_kV: 11, uk_pct: 10, ur_pct: 0.6,
      vectorGroup: "YNd11", earthingHv: { kind: "solid" }, tap_pct,
    },
  ];
}

function compiled(elements: RawElement[], study: Record<string, unknown> = {}): CompiledNetwork {
  const r = compileNetwork(buildProject(elements, study), { limit: "max" });
  if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
  return r.network;
}

describe("power station unit factors", () => {
  it("K_S matches the hand calculation", () => {
    expect(unitKS(33, 11, 11, 34.5, 1.1, 0.15, XT, 0.8)).toBeCloseTo(0.977011, 6); // hand calculation above, eq. (22)
    expect(KS).toBeCloseTo(0.977011, 6);
  });
  it("K_SO carries 1 / (1 + p_G) and (1 + p_T)", () => {
    // IEC 60909-0:2016, 6.7.2 (eq. (24) of the 2001 edition, from memory), p_G 5 %, off-load tap +2.5 %:
    // K_SO = (33 / (11 * 1.05)) (11 / 34.5) (1.025) 1.1 / (1 + 0.15 * 0.6) = 0.942314
    expect(unitKSO(33, 11, 11, 34.5, 1.1, 0.15, 0.8, 0.05, 0.025)).toBeCloseTo(0.942314, 6);
  });
  it("in-unit factors: K_G,S = cmax / (1 + x\"d sin phi), K_T,S = cmax / (1 - xT sin phi), both over (1 + p_G) without OLTC", () => {
    // IEC 60909-0:2016, 6.7.1 / 6.7.2 (from memory): 1.1 / 1.09 = 1.009174; 1.1 / (1 - 0.0998198 * 0.6) = 1.170078
    expect(unitGeneratorK(1.1, 0.15, 0.8, 0)).toBeCloseTo(1.009174, 6);
    expect(unitTransformerK(1.1, XT, 0.8, 0)).toBeCloseTo(1.170078, 6);
    expect(unitGeneratorK(1.1, 0.15, 0.8, 0.05)).toBeCloseTo(1.009174 / 1.05, 6);
    expect(unitTransformerK(1.1, XT, 0.8, 0.05)).toBeCloseTo(1.170078 / 1.05, 6);
  });
});

describe("a 10 MVA unit with on-load tap changer", () => {
  const net = compiled(unitElements({ transformer: "T1" }));
  it("feeds a three-phase fault at its HV bus with c Un / (sqrt3 |Z_S|)", () => {
    const r = solveFault(net, { kind: "bus", bus: "Q" }, "3ph");
    expect(mag(ZS)).toBeCloseTo(29.09363, 4); // hand calculation above
    expect(r.ikss_kA).toBeCloseTo((1.1 * 33) / (Math.sqrt(3) * mag(ZS)), 9); // 0.720358 kA
    expect(r.ikss_kA).toBeCloseTo(0.720358, 6);
    expect(r.zk_ohm.re).toBeCloseTo(ZS.re, 6);
    expect(r.zk_ohm.im).toBeCloseTo(ZS.im, 6);
  });
  it("corrects the zero sequence with K_S too: I\"k1 = sqrt3 c Un / |2 Z_S + K_S Z_(0)THV|", () => {
    // Generator x2 = x"d gives Z_(2)S = Z_S; YNd11 with the HV star solidly earthed, Z_(0)T = Z_T (z0z1 1), so the
    // unit's zero sequence at Q is K_S Z_THV (IEC 60909-0:2016, 6.7.1: K_S also for the zero sequence, from memory).
    // Hand: |2 (1.56990 + j29.05124) + 0.977011 (0.71415 + j11.88096)| = 69.9106 ohm; I"k1 = 0.900560 kA.
    const r = solveFault(net, { kind: "bus", bus: "Q" }, "LG");
    const z = { re: 2 * ZS.re + KS * ZTHV.re, im: 2 * ZS.im + KS * ZTHV.im };
    expect(r.ikss_kA).toBeCloseTo((Math.sqrt(3) * 1.1 * 33) / mag(z), 9);
    expect(r.ikss_kA).toBeCloseTo(0.90056, 5);
  });
  it("drops the off-load tap of a transformer with on-load tap changer (rated ratio), with a message", () => {
    const tapped = compiled(unitElements({ transformer: "T1" }, 5));
    expect(solveFault(tapped, { kind: "bus", bus: "Q" }, "3ph").ikss_kA).toBeCloseTo(0.720358, 6); // same as untapped
    expect(tapped.messages.some((m) => m.code === "unit-tap" && m.element === "T1" && /tap_pct 5 is not used/.test(m.text))).toBe(true);
  });
  it("differs from KG and KT applied apart", () => {
    // The same two elements without the unit field: KG = 1.1/1.09 on the generator, KT = 0.95*1.1/(1+0.6 xT) on the
    // transformer (IEC 60909-0:2016, 6.6.1 and 6.3.3); referred to Q through the rated ratio: t_r^2 KG Z_G + KT Z_THV.
    const apart = compiled(unitElements(undefined));
    const kg = 1.1 / 1.09;
    const kt = (0.95 * 1.1) / (1 + 0.6 * XT);
    const z = { re: TR * TR * kg * ZG.re + kt * ZTHV.re, im: TR * TR * kg * ZG.im + kt * ZTHV.im };
    const r = solveFault(apart, { kind: "bus", bus: "Q" }, "3ph");
    expect(r.ikss_kA).toBeCloseTo((1.1 * 33) / (Math.sqrt(3) * mag(z)), 9);
    expect(Math.abs(r.ikss_kA - 0.720358)).toBeGreaterThan(0.01); // the unit correction matters here
  });
});

describe("a 10 MVA unit without on-load tap changer", () => {
  // p_G 5 %, off-load tap +2.5 % on the HV side. Z_SO = K_SO (t_r^2 Z_G + Z_THV) with the rated t_r
  // (IEC 60909-0:2016, 6.7.2): K_SO = 0.942314, Z_SO = 1.51415 + j28.01952 ohm, I"k = 0.746882 kA.
  const net = compiled(unitElements({ transformer: "T1", onLoadTap: false, pG_pct: 5 }, 2.5));
  it("feeds a three-phase fault at its HV bus with c Un / (sqrt3 |Z_SO|)", () => {
    const kso = (33 / (11 * 1.05)) * (11 / 34.5) * 1.025 * (1.1 / (1 + 0.15 * SIN));
    const zso = { re: kso * (TR * TR * ZG.re + ZTHV.re), im: kso * (TR * TR * ZG.im + ZTHV.im) };
    const r = solveFault(net, { kind: "bus", bus: "Q" }, "3ph");
    expect(r.ikss_kA).toBeCloseTo((1.1 * 33) / (Math.sqrt(3) * mag(zso)), 9);
    expect(r.ikss_kA).toBeCloseTo(0.746882, 6);
  });
});

describe("a unit beside a 500 MVA network feeder", () => {
  // Grid feeder at Q: S"k 500 MVA, R/X 0.1, Z_Q = 1.1 * 33^2 / 500 ohm (IEC 60909-0:2016, 6.2).
  const grid: RawElement = { kind: "grid", id: "NET", bus: "Q", skMax_MVA: 500, skMin_MVA: 400, rx: 0.1 };
  const net = compiled([...unitElements({ transformer: "T1" }), grid]);
  const zq = (1.1 * 33 * 33) / 500;
  const ZQ = { re: (0.1 * zq) / Math.hypot(0.1, 1), im: zq / Math.hypot(0.1, 1) };
  const inv = (z: { re: number; im: number }) => ({ re: z.re / (z.re ** 2 + z.im ** 2), im: -z.im / (z.re ** 2 + z.im ** 2) });

  it("adds the unit's K_S infeed to the network's at the HV bus", () => {
    // I"k = c Un / sqrt3 * |1/Z_Q + 1/Z_S| = 9.46739 kA (hand calculation)
    const y = { re: inv(ZQ).re + inv(ZS).re, im: inv(ZQ).im + inv(ZS).im };
    const r = solveFault(net, { kind: "bus", bus: "Q" }, "3ph");
    expect(r.ikss_kA).toBeCloseTo(((1.1 * 33) / Math.sqrt(3)) * mag(y), 9);
    expect(r.ikss_kA).toBeCloseTo(9.46739, 4);
  });

  it("solves a fault between generator and transformer with the in-unit factors", () => {
    // Fault at G (IEC 60909-0:2016, 6.7.1, from memory): generator share Z_G,S = K_G,S Z_G with K_G,S = 1.1/1.09
    // (Un = U_rG = 11 kV), network share through the transformer K_T,S Z_TLV + Z_Q / t_r^2 with
    // K_T,S = 1.1 / (1 - 0.0998198 * 0.6) = 1.170078, Z_TLV = (0.006 + j0.0998198) 11^2 / 10.
    // I"kG = 3.80925 kA, I"kT = 4.21046 kA, I"k = 1.1 * 11 / sqrt3 * |1/Z_G,S + 1/Z_T| = 8.01946 kA.
    const internal = net.internal as { model: Model };
    const lv = internal.model.busNode.get("G")!;
    const unit = internal.model.inUnit?.get(lv);
    expect(unit).toBeDefined();
    const kgs = 1.1 / (1 + 0.15 * SIN);
    const kts = 1.1 / (1 - XT * SIN);
    const zgs = { re: kgs * ZG.re, im: kgs * ZG.im };
    const a = (11 / 34.5) ** 2;
    const zt = { re: (kts * 0.006 * 121) / 10 + a * ZQ.re, im: (kts * XT * 121) / 10 + a * ZQ.im };
    const y = { re: inv(zgs).re + inv(zt).re, im: inv(zgs).im + inv(zt).im };
    const r = solveFault(net, { kind: "bus", bus: "G" }, "3ph");
    expect(r.ikss_kA).toBeCloseTo(((1.1 * 11) / Math.sqrt(3)) * mag(y), 9);
    expect(r.ikss_kA).toBeCloseTo(8.01946, 4);
    const g = r.shunts.find((s) => s.element === "G1")!;
    expect(g.seq_A[1].mag / 1000).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * mag(zgs)), 9); // I"kG = 3.80925 kA
    const t = r.branchEnds.find((e) => e.element === "T1" && e.end === "to")!;
    expect(t.seq_A[1].mag / 1000).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * mag(zt)), 9); // I"kT = 4.21046 kA
    // The all-bus sweep solves that node the same way.
    const sw = sweepFaults(net, { types: ["3ph"] });
    expect(sw.ikss_kA[sw.busIds.indexOf("G")]).toBeCloseTo(8.01946, 4);
    // Faults outside the unit keep K_S: the variant is only for the LV node.
    expect(solveFault(net, { kind: "bus", bus: "Q" }, "3ph").ikss_kA).toBeCloseTo(9.46739, 4);
  });

  it("uses no correction with the classic method", () => {
    const classic = compiled([...unitElements({ transformer: "T1" }), grid], { method: "classic", prefault_pu: 1 });
    expect((classic.internal as { model: Model }).model.inUnit).toBeUndefined();
    // Classic: Z_Q = 33^2/500 (c = 1), the unit uncorrected t_r^2 Z_G + Z_THV, hand calculation.
    const zq1 = (33 * 33) / 500;
    const zQ = { re: (0.1 * zq1) / Math.hypot(0.1, 1), im: zq1 / Math.hypot(0.1, 1) };
    const zu = { re: TR * TR * ZG.re + ZTHV.re, im: TR * TR * ZG.im + ZTHV.im };
    const y = { re: inv(zQ).re + inv(zu).re, im: inv(zQ).im + inv(zu).im };
    expect(solveFault(classic, { kind: "bus", bus: "Q" }, "3ph").ikss_kA).toBeCloseTo((33 / Math.sqrt(3)) * mag(y), 9);
  });
});

describe("units the engine refuses or leaves apart", () => {
  const errorsOf = (elements: RawElement[]) => {
    const r = compileNetwork(buildProject(elements), { limit: "max" });
    return r.ok ? [] : r.errors;
  };
  it("names the generator and field when the unit transformer does not exist", () => {
    const els = unitElements({ transformer: "T9" });
    expect(errorsOf(els)).toContainEqual(expect.objectContaining({ element: "G1", text: 'Generator G1 "Unit 1": unit.transformer "T9" names no element in the project' }));
  });
  it("refuses another source on the unit's LV side", () => {
    const els = [...unitElements({ transformer: "T1" }), { kind: "inverter", id: "PV", name: "Roof PV", bus: "G", sr_MVA: 1, ur_kV: 11 }];
    const [e] = errorsOf(els);
    expect(e.element).toBe("G1");
    expect(e.text).toMatch(/^Generator G1 "Unit 1": unit.transformer Transformer T1 "Unit transformer": Inverter PV "Roof PV" also feeds the unit's LV side/);
  });
  it("refuses a second path from the LV side to the HV bus", () => {
    const line: RawElement = { kind: "line", id: "L1", fromBus: "G", toBus: "X", length_km: 1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.3, x0_ohmPerKm: 0.3, csa_mm2: 95, ampacity_A: 300 };
    const t2: RawElement = { kind: "transformer", id: "T2", hvBus: "Q", lvBus: "X", sr_MVA: 5, urHv_kV: 33, urLv_kV: 11, uk_pct: 8 };
    const [e] = errorsOf([...unitElements({ transformer: "T1" }), bus("X", 11), line, t2]);
    expect(e.text).toMatch(/reaches the HV side through (L1|T2) as well as through the unit transformer/);
  });
  it("accepts auxiliary motors behind an auxiliary transformer, which then feed HV faults too", () => {
    const aux: RawElement[] = [
      bus("A", 0.4),
      { kind: "transformer", id: "TA", hvBus: "G", lvBus: "A", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 },
      { kind: "motor", id: "M1", bus: "A", pr_kW: 200, ur_kV: 0.4, polePairs: 2 },
    ];
    const r = compileNetwork(buildProject([...unitElements({ transformer: "T1" }), ...aux]), { limit: "max" });
    expect(r.ok).toBe(true);
    if (r.ok) expect(solveFault(r.network, { kind: "bus", bus: "Q" }, "3ph").ikss_kA).toBeGreaterThan(0.720358); // unit plus motor
  });
  it("corrects the generator with KG alone when its unit transformer is out of service", () => {
    const p = buildProject(unitElements({ transformer: "T1" }), {}, [{ id: "S1", name: "Transformer out", outOfService: ["T1"] }]);
    const r = compileNetwork(p, { limit: "max", scenario: "S1" });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.network.messages.some((m) => m.code === "unit-incomplete" && m.element === "G1")).toBe(true);
    // Generator alone at G: KG = 1.1/1.09 (Un = UrG), I"k = 1.1 * 11 / (sqrt3 KG |Z_G|) (IEC 60909-0:2016, 6.6.1).
    expect(solveFault(r.network, { kind: "bus", bus: "G" }, "3ph").ikss_kA).toBeCloseTo((1.1 * 11) / (Math.sqrt(3) * (1.1 / 1.09) * mag(ZG)), 9);
  });
});
