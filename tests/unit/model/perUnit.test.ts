// Per-unit conversions, checked against mathjs unit arithmetic (an independent computation)
// and against a published worked example.
import { describe, it, expect } from "vitest";
import { evaluate, type Unit } from "mathjs";
import { zBase_ohm, iBase_kA, ohmToPu, puToOhm, changeBase, percentOnRatingToPu, busVoltageBases_kV, ohm, pu } from "../../../src/model/perUnit.ts";
import { skToIk_kA, ikToSk_MVA, ratedCurrent_A, apparentPower_kVA, motorInput_kVA } from "../../../src/model/units.ts";
import { dairyCoopProject } from "../../../src/model/demo/dairyCoop.ts";

const mj = (expr: string, unit: string) => (evaluate(`${expr} to ${unit}`) as Unit).toNumber(unit);

describe("per-unit bases", () => {
  it.each([
    [11, 100],
    [0.4, 10],
    [0.4, 1],
    [33, 250],
  ])("Zb and Ib at %s kV on %s MVA match Ub^2/Sb and Sb/(sqrt(3) Ub)", (u_kV, s_MVA) => {
    // independent computation: mathjs unit arithmetic
    expect(zBase_ohm(u_kV, s_MVA)).toBeCloseTo(mj(`(${u_kV} kV)^2 / (${s_MVA} MVA)`, "ohm"), 12);
    expect(iBase_kA(u_kV, s_MVA)).toBeCloseTo(mj(`${s_MVA} MVA / (sqrt(3) * ${u_kV} kV)`, "kA"), 12);
  });

  it("gives 1.21 ohm and 5.2486 kA at 11 kV on 100 MVA", () => {
    expect(zBase_ohm(11, 100)).toBeCloseTo(1.21, 12); // 11^2/100, hand arithmetic
    expect(iBase_kA(11, 100)).toBeCloseTo(5.248639, 6); // 100/(sqrt(3)*11), hand arithmetic
  });

  it("refuses a zero or negative base", () => {
    expect(() => zBase_ohm(0, 100)).toThrow(RangeError);
    expect(() => iBase_kA(11, -1)).toThrow(RangeError);
  });
});

describe("ohm and per-unit conversions", () => {
  it("round-trip ohm -> pu -> ohm", () => {
    const z = ohm(0.0342);
    expect(puToOhm(ohmToPu(z, 0.4, 10), 0.4, 10)).toBeCloseTo(0.0342, 14);
  });

  it("convert a 0.4 kV cable of 0.0193 ohm to 1.20625 pu on 10 MVA", () => {
    // 0.0193 / (0.4^2 / 10) = 0.0193 / 0.016 = 1.20625 (hand arithmetic)
    expect(ohmToPu(ohm(0.0193), 0.4, 10)).toBeCloseTo(1.20625, 12);
  });

  it("re-express an impedance on a new base as z * (S2/S1) * (U1/U2)^2", () => {
    // a 1.6 MVA transformer with uk 6 % on 100 MVA: 0.06 * 100/1.6 = 3.75 pu (hand arithmetic)
    expect(percentOnRatingToPu(6, { u_kV: 11, s_MVA: 1.6 }, { u_kV: 11, s_MVA: 100 })).toBeCloseTo(3.75, 12);
    // same ohms seen from both bases: mathjs computes the ohm value on each side independently
    const z1 = pu(0.2);
    const z2 = changeBase(z1, { u_kV: 11, s_MVA: 10 }, { u_kV: 10.5, s_MVA: 100 });
    const ohms = mj("0.2 * (11 kV)^2 / (10 MVA)", "ohm");
    expect(z2).toBeCloseTo(ohms / mj("(10.5 kV)^2 / (100 MVA)", "ohm"), 12);
  });

  it("take the voltage base of each bus from its nominal voltage", () => {
    const bases = busVoltageBases_kV(dairyCoopProject());
    expect(bases.get("MV-MAIN")).toBe(11);
    expect(bases.get("LV-A")).toBe(0.4);
    expect(bases.has("T1")).toBe(false);
  });
});

describe("three-phase unit conversions", () => {
  it("turn S\"k 150 MVA at 11 kV into 7.873 kA and back", () => {
    // 150 / (sqrt(3) * 11) = 7.8730 kA (independent: mathjs)
    expect(skToIk_kA(150, 11)).toBeCloseTo(mj("150 MVA / (sqrt(3) * 11 kV)", "kA"), 12);
    expect(ikToSk_MVA(skToIk_kA(150, 11), 11)).toBeCloseTo(150, 12);
  });

  it("reproduce the infinite-bus transformer example: 1500 kVA, 480 V, 5.75 % gives 31,377 A", () => {
    // IAEI Magazine, "Short-circuit calculations using transformer and source impedance" (2018): 31,374 A;
    // exact arithmetic gives 31,377 A, so allow 0.05 %
    const isc_A = ratedCurrent_A(1.5, 0.48) / 0.0575;
    expect(Math.abs(isc_A - 31374) / 31374).toBeLessThan(0.0005);
    expect(isc_A).toBeCloseTo(mj("1500 kVA / (sqrt(3) * 480 V) / 0.0575", "A"), 8);
  });

  it("give apparent power and motor input", () => {
    expect(apparentPower_kVA(300, 400)).toBe(500); // 3-4-5 triangle
    expect(motorInput_kVA(90, 0.95, 0.87)).toBeCloseTo(90 / (0.95 * 0.87), 12); // Sr = Pr/(eta cos phi), IEC 60909-0 motor rating
  });
});
