import { describe, expect, it } from "vitest";
import { projectSchema } from "../../../src/model/schema.ts";
import { compileNetwork, solveFault } from "../../../src/engine/index.ts";
import { buildProject, bus } from "./helpers/projectBuilder.ts";

describe("bad input", () => {
  it("names the element and the field of a negative cable length", () => {
    const p = buildProject([bus("A", 0.4), bus("B", 0.4), { kind: "grid", id: "Q", bus: "A", skMax_MVA: 10, skMin_MVA: 5 }]);
    // Bypass the schema to reach the engine with a value the loader would refuse (engine must still guard).
    p.elements.push({ ...projectSchema.shape.elements.element.parse({ kind: "line", id: "C12", name: "Dock feeder", fromBus: "A", toBus: "B", length_km: 1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.1, x0_ohmPerKm: 0.1, csa_mm2: 50, ampacity_A: 100 }), length_km: -3 } as never);
    const r = compileNetwork(p, { limit: "max" });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.errors.map((e) => e.text)).toContain('Cable C12 "Dock feeder": length_km must be > 0 (got -3)');
  });
  it("refuses a line between different voltage levels", () => {
    const p = buildProject([
      bus("A", 11), bus("B", 0.4),
      { kind: "grid", id: "Q", bus: "A", skMax_MVA: 10, skMin_MVA: 5 },
      { kind: "line", id: "L", fromBus: "A", toBus: "B", length_km: 1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.1, x0_ohmPerKm: 0.1, csa_mm2: 50, ampacity_A: 100 },
    ]);
    const r = compileNetwork(p, { limit: "max" });
    expect(!r.ok && r.errors[0].text).toMatch(/Cable L: fromBus and toBus have different un_kV/);
  });
  it("refuses ur above uk naming the transformer", () => {
    const p = buildProject([
      bus("A", 11), bus("B", 0.4),
      { kind: "grid", id: "Q", bus: "A", skMax_MVA: 10, skMin_MVA: 5 },
      { kind: "transformer", id: "T9", name: "Barn", hvBus: "A", lvBus: "B", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 4, ur_pct: 5 },
    ]);
    const r = compileNetwork(p, { limit: "max" });
    expect(!r.ok && r.errors[0].text).toBe('Transformer T9 "Barn": ur_pct must not exceed uk_pct (got 5 > 4)');
  });
  it("handles a 1 m cable and a 0 % ur transformer without trouble", () => {
    const p = buildProject([
      bus("A", 11), bus("B", 0.4), bus("C", 0.4),
      { kind: "grid", id: "Q", bus: "A", skMax_MVA: 100, skMin_MVA: 50 },
      { kind: "transformer", id: "T", hvBus: "A", lvBus: "B", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 0 },
      { kind: "line", id: "L", fromBus: "B", toBus: "C", length_km: 0.001, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.4, x0_ohmPerKm: 0.3, csa_mm2: 240, ampacity_A: 500 },
    ]);
    const c = compileNetwork(p, { limit: "max" });
    if (!c.ok) throw new Error("compile");
    const b = solveFault(c.network, { kind: "bus", bus: "B" }, "LG").ikss_kA;
    const cc = solveFault(c.network, { kind: "bus", bus: "C" }, "LG").ikss_kA;
    expect(cc).toBeLessThan(b); // a metre of cable lowers the current a little (physics)
    expect(cc / b).toBeGreaterThan(0.97); // hand estimate: 1 m adds about 0.6 mohm to an earth-fault loop of about 30 mohm
    const r = solveFault(c.network, { kind: "bus", bus: "B" }, "3ph");
    expect(r.messages.some((m) => m.code === "xr-range")).toBe(true); // R = 0 in the transformer: X/R very large
  });
  it("records the method, the limit and the options on every result", () => {
    const p = buildProject([bus("A", 0.4), { kind: "grid", id: "Q", bus: "A", skMax_MVA: 10, skMin_MVA: 5 }], { method: "classic", prefault_pu: 1.05, faultR_ohm: 0.01 });
    const c = compileNetwork(p, { limit: "min" });
    if (!c.ok) throw new Error("compile");
    const r = solveFault(c.network, { kind: "bus", bus: "A" }, "3ph", { faultR_ohm: 0.002 });
    expect(r.options).toMatchObject({ method: "classic", limit: "min", prefault_pu: 1.05 });
    expect(r.options.faultR_ohm).toBeCloseTo(0.002, 12);
    expect(r.c).toBe(1.05);
  });
});
