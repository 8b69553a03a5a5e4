import { describe, it, expect } from "vitest";
import { defaultDeviceSettings, ratedCurrentAt, ctPrimaryFor, withRatedDefaults } from "../../../src/protection/defaultSettings.ts";
import { checkLvOverload, deviceOverloadCurrents } from "../../../src/protection/lvOverload.ts";
import { elementSchema, type Element, type LvBreaker, type Project, type Relay } from "../../../src/model/schema.ts";
import { newProject } from "../../../src/model/projectFile.ts";

function site(): Project {
  const p = newProject("defaults");
  const add = (e: Record<string, unknown>) => p.elements.push(elementSchema.parse(e) as Element);
  add({ kind: "bus", id: "HV", un_kV: 11 });
  add({ kind: "bus", id: "LV", un_kV: 0.4 });
  add({ kind: "bus", id: "SUB", un_kV: 0.4 });
  add({ kind: "transformer", id: "T1", hvBus: "HV", lvBus: "LV", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 });
  add({ kind: "line", id: "C1", fromBus: "LV", toBus: "SUB", length_km: 0.1, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.32, csa_mm2: 120, ampacity_A: 280 });
  add({ kind: "motor", id: "M1", bus: "SUB", pr_kW: 55, ur_kV: 0.4, eta: 0.94, cosPhi: 0.86 });
  add({ kind: "grid", id: "N1", bus: "HV", skMax_MVA: 250, skMin_MVA: 150 });
  return p;
}

describe("starting settings from the protected element's rating", () => {
  it("a transformer's full-load current is Sr / (sqrt 3 Ur) at the device's winding", () => {
    // IEC 60076-1:2011, 3.4.7 (rated current from rated power and voltage): 1 MVA / (sqrt 3 x 11 kV) = 52.49 A
    expect(ratedCurrentAt(site(), { element: "T1", end: "from" })?.i_A).toBeCloseTo(52.486, 3);
    // at the 0.4 kV side: 1443.4 A
    expect(ratedCurrentAt(site(), { element: "T1", end: "to" })?.i_A).toBeCloseTo(1443.4, 1);
  });

  it("a new relay on the 11 kV side of a 1 MVA transformer picks up near 1.25 x 52 A, not 200 A, on a 75/1 CT", () => {
    const d = defaultDeviceSettings("relay", site(), { element: "T1", end: "from" });
    const f = (d?.fields.functions as { pickup_A: number }[])[0];
    expect(f.pickup_A).toBe(66); // 1.25 x 52.49 = 65.6, rounded up to a whole ampere // common practice
    expect(d?.fields.ctPrimary_A).toBe(75); // IEC 61869-2 standard value above 1.2 x 52.5 and the pickup // from memory
    expect(d?.basis).toMatch(/52\.5 A/);
  });

  it("a new LV breaker on a 280 A cable gets In 250 A: IB <= In <= IZ and I2 = 325 A <= 1.45 x 280 A", () => {
    const d = defaultDeviceSettings("lvbreaker", site(), { element: "C1", end: "from" });
    expect(d?.fields).toMatchObject({ in_A: 250, longTime: { ir_x: 1 } });
    const { device } = withRatedDefaults(elementSchema.parse({ kind: "lvbreaker", id: "CB1", at: { element: "C1", end: "from" }, in_A: 400, longTime: { ir_x: 1, tr_s: 10 } }) as LvBreaker, site());
    expect(checkLvOverload({ ...deviceOverloadCurrents(device), ampacity_A: 280 }).ok).toBe(true);
  });

  it("a breaker for a motor carries its rated current: 55 kW / (sqrt 3 x 0.4 kV x 0.94 x 0.86) = 98.2 A -> In 100 A, Ir 1.0", () => {
    const d = defaultDeviceSettings("lvbreaker", site(), { element: "M1", end: "terminal" });
    expect(ratedCurrentAt(site(), { element: "M1", end: "terminal" })?.i_A).toBeCloseTo(98.2, 1); // P = sqrt 3 U I eta cos phi
    expect(d?.fields).toMatchObject({ in_A: 100, longTime: { ir_x: 1 } });
  });

  it("a fuse on the 280 A cable: 250 A, the largest rating with 1.6 In <= 1.45 IZ (406 A)", () => {
    expect(defaultDeviceSettings("fuse", site(), { element: "C1", end: "to" })?.fields).toEqual({ rating_A: 250 });
  });

  it("no rating to go by (a grid feeder) leaves the generic starting values", () => {
    expect(defaultDeviceSettings("relay", site(), { element: "N1", end: "terminal" })).toBeNull();
    const relay = elementSchema.parse({ kind: "relay", id: "R1", at: { element: "N1", end: "terminal" }, ctPrimary_A: 200, functions: [{ id: "f1", ansi: "51", quantity: "phase", pickup_A: 200 }] }) as Relay;
    expect(withRatedDefaults(relay, site())).toEqual({ device: relay, basis: null });
  });

  it("a 2 MVA transformer's relay: 1.25 x 104.97 A = 131.2 A, set at 135 A on a 150/1 CT", () => {
    const p = site();
    const t = p.elements.find((e) => e.id === "T1");
    if (t?.kind === "transformer") t.sr_MVA = 2;
    const d = defaultDeviceSettings("relay", p, { element: "T1", end: "from" });
    expect((d?.fields.functions as { pickup_A: number }[])[0].pickup_A).toBe(135);
    expect(d?.fields.ctPrimary_A).toBe(150);
  });

  it("standard CT primaries come from the 10-12.5-15-20-25-30-40-50-60-75 series", () => {
    expect([9, 10, 11, 63, 76, 1201].map(ctPrimaryFor)).toEqual([10, 10, 12.5, 75, 100, 1250]);
  });
});
