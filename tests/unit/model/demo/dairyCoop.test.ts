// The demo project: committed file is canonical and current, loads cleanly, has the scenario's parts,
// and its data and settings are plausible as an engineer's first pass (sources beside each check).
import { describe, it, expect } from "vitest";
import { readFileSync } from "node:fs";
import { dairyCoopProject } from "../../../../src/model/demo/dairyCoop.ts";
import { loadProject, serializeProject } from "../../../../src/model/projectFile.ts";
import { validateProject } from "../../../../src/model/validate.ts";
import { findIslands } from "../../../../src/model/topology.ts";
import { ratedCurrent_A, apparentPower_kVA, motorInput_kVA } from "../../../../src/model/units.ts";
import type { Element, Line, LvBreaker, Relay, Transformer } from "../../../../src/model/schema.ts";

const committed = readFileSync(new URL("../../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8");
const project = dairyCoopProject();
const byId = new Map(project.elements.map((e) => [e.id, e]));
const get = <T extends Element>(id: string) => {
  const e = byId.get(id);
  if (!e) throw new Error(`demo has no ${id}`);
  return e as T;
};
const ofKind = <K extends Element["kind"]>(kind: K) => project.elements.filter((e): e is Extract<Element, { kind: K }> => e.kind === kind);

describe("the committed demo file", () => {
  it("equals a fresh serialization of the demo module (run node tests/tools/gen-demo.mjs after editing it)", () => {
    expect(committed).toBe(serializeProject(project));
  });

  it("loads with no errors and no warnings", () => {
    const r = loadProject(committed);
    expect(r.ok && r.warnings).toEqual([]);
    expect(validateProject(project)).toEqual([]);
  });
});

describe("the demo's network", () => {
  it("has an 11 kV utility tie with S\"k 150 MVA max, 80 MVA min and R/X 0.1", () => {
    expect(ofKind("grid")).toMatchObject([{ skMax_MVA: 150, skMin_MVA: 80, rx: 0.1 }]);
    expect(get<Element & { un_kV: number }>("MV-POC").un_kV).toBe(11);
  });

  it("has two 11/0.4 kV Dyn11 transformers of 1.6 MVA (uk 6 %) and 1 MVA (uk 5 %), and a 500 kVA village transformer", () => {
    const t = ofKind("transformer");
    expect(t.map((x) => [x.sr_MVA, x.uk_pct, x.vectorGroup, x.urHv_kV, x.urLv_kV])).toEqual([
      [1.6, 6, "Dyn11", 11, 0.4],
      [1, 5, "Dyn11", 11, 0.4],
      [0.5, 4.5, "Dyn11", 11, 0.4],
    ]);
  });

  it("has the LV board in two sections joined by a normally closed coupler", () => {
    expect(ofKind("switch")).toMatchObject([{ busA: "LV-A", busB: "LV-B", closed: true }]);
  });

  it("has a 1.25 MVA genset with x\"d 0.12-0.16, x2 close to x\"d and x0 near 0.06", () => {
    // typical salient-pole genset ranges (from memory)
    const [g] = ofKind("generator");
    expect(g.sr_MVA).toBe(1.25);
    expect(g.xdss_pu).toBeGreaterThanOrEqual(0.12);
    expect(g.xdss_pu).toBeLessThanOrEqual(0.16);
    expect(Math.abs(g.x2_pu - g.xdss_pu) / g.xdss_pu).toBeLessThan(0.15);
    expect(g.x0_pu).toBeCloseTo(0.06, 2);
  });

  it("has a grid-following PV inverter and a grid-forming battery inverter with plausible current limits", () => {
    // grid-following inverters deliver about 1.1-1.5 x rated current in a fault (common practice)
    expect(get("INV-PV")).toMatchObject({ control: "grid-following", source: "pv" });
    const pv = get<Element & { sr_MVA: number; iMax_pu: number }>("INV-PV");
    expect(pv.sr_MVA).toBeGreaterThanOrEqual(0.8);
    expect(pv.sr_MVA).toBeLessThanOrEqual(0.9);
    expect(pv.iMax_pu).toBeGreaterThanOrEqual(1.1);
    expect(pv.iMax_pu).toBeLessThanOrEqual(1.2);
    expect(get("INV-BESS")).toMatchObject({ control: "grid-forming", source: "battery", sr_MVA: 0.6, iMax_pu: 1.5 });
  });

  it("has a 90 kW compressor and a 55 kW pump motor", () => {
    expect(ofKind("motor").map((m) => m.pr_kW).sort((a, b) => a - b)).toEqual([55, 90]);
  });

  it("has five to seven LV feeder cables of 30-400 m", () => {
    const lvCables = ofKind("line").filter((l) => (get<Element & { un_kV: number }>(l.fromBus)).un_kV === 0.4);
    expect(lvCables.length).toBeGreaterThanOrEqual(5);
    expect(lvCables.length).toBeLessThanOrEqual(7);
    for (const c of lvCables) {
      expect(c.length_km, c.id).toBeGreaterThanOrEqual(0.03);
      expect(c.length_km, c.id).toBeLessThanOrEqual(0.4);
    }
  });

  it("uses conductor resistances of the standard sizes", () => {
    // from memory: IEC 60228, Table 2, maximum DC resistance at 20 C of class 2 conductors (ohm/km)
    const table: Record<string, number> = { "Cu 35": 0.524, "Cu 50": 0.387, "Cu 95": 0.193, "Cu 120": 0.153, "Cu 185": 0.0991, "Cu 240": 0.0754, "Al 70": 0.443, "Al 95": 0.32, "Al 240": 0.125 };
    for (const c of ofKind("line")) expect(c.r1_ohmPerKm, c.id).toBe(table[`${c.material} ${c.csa_mm2}`]);
  });

  it("feeds the village through an 11 kV cable to its own 11/0.4 kV transformer and load", () => {
    expect(get<Line>("C-VIL")).toMatchObject({ fromBus: "MV-MAIN", toBus: "MV-VIL" });
    expect(get<Transformer>("T-VIL")).toMatchObject({ hvBus: "MV-VIL", lvBus: "LV-VIL" });
    expect(ofKind("load").some((l) => l.bus === "LV-VIL")).toBe(true);
  });

  it("gives every element a layout position, reading top-down from the tie to the feeders", () => {
    for (const e of project.elements) expect(project.layout[e.id], e.id).toBeDefined();
    const y = (id: string) => project.layout[id].y;
    expect(y("GRID")).toBeLessThan(y("MV-MAIN"));
    expect(y("MV-MAIN")).toBeLessThan(y("T1"));
    expect(y("T1")).toBeLessThan(y("LV-A"));
    expect(y("LV-A")).toBe(y("LV-B"));
    expect(project.layout["LV-A"].x).toBeLessThan(project.layout["LV-B"].x);
    for (const l of ofKind("load")) expect(y(l.id), l.id).toBeGreaterThan(y("LV-A"));
  });
});

describe("the demo's scenarios", () => {
  it("are the four operating modes", () => {
    expect(project.scenarios.map((s) => [s.name, [...s.outOfService].sort()])).toEqual([
      ["Grid-tied, all sources", []],
      ["Grid-tied, no PV or battery", ["INV-BESS", "INV-PV"]],
      ["Islanded: genset, battery and PV", ["GRID"]],
      ["Islanded: battery and PV only (inverter-only)", ["GEN1", "GRID"]],
    ]);
  });

  it("leave the whole site energised in every mode, fed only by inverters in the inverter-only island", () => {
    for (const s of project.scenarios) {
      const islands = findIslands(project, s);
      expect(islands, s.id).toHaveLength(1);
      if (s.id === "island-inverters") expect(islands[0].sources.sort()).toEqual(["INV-BESS", "INV-PV"]);
    }
  });
});

describe("the demo's protection as a first pass", () => {
  const lvBreakers = ofKind("lvbreaker");

  it("puts relays with 51, 50 and 51N on the 11 kV side: utility tie, both transformer HV sides, village feeder", () => {
    const relays = ofKind("relay");
    expect(relays.map((r) => `${r.at.element}/${r.at.end}`)).toEqual(["C-INC/from", "T1/from", "T2/from", "C-VIL/from"]);
    for (const r of relays) expect(r.functions.map((f) => f.ansi)).toEqual(["51", "50", "51N"]);
  });

  it("sets feeder breakers so that load current <= Ir <= cable ampacity", () => {
    // IEC 60364-4-43, clause 433.1: IB <= In <= IZ (from memory)
    const feederLoads: Record<string, string> = { "Q-MS": "L-MS", "Q-PH": "L-PH", "Q-CS": "L-CS", "Q-WS": "L-WS" };
    for (const [qId, loadId] of Object.entries(feederLoads)) {
      const q = get<LvBreaker>(qId);
      const cable = get<Line>(q.at.element);
      const load = get<Element & { p_kW: number; q_kvar: number }>(loadId);
      const ib_A = apparentPower_kVA(load.p_kW, load.q_kvar) / (Math.sqrt(3) * 0.4);
      const ir_A = q.longTime.ir_x * q.in_A;
      expect(ib_A, qId).toBeLessThanOrEqual(ir_A);
      expect(ir_A, qId).toBeLessThanOrEqual(cable.ampacity_A * cable.parallel);
    }
  });

  it("sets source and incomer breakers at or above the rated current of what they protect", () => {
    // long-time pickup at or above rated current so that full load does not trip (common practice)
    const rated: Record<string, number> = {
      "Q-T1": ratedCurrent_A(1.6, 0.4),
      "Q-T2": ratedCurrent_A(1, 0.4),
      "Q-GEN": ratedCurrent_A(1.25, 0.4),
      "Q-PV": ratedCurrent_A(0.9, 0.4),
      "Q-BESS": ratedCurrent_A(0.6, 0.4),
    };
    for (const [id, ir] of Object.entries(rated)) {
      const q = lvBreakers.find((b) => b.id === id)!;
      expect(q.longTime.ir_x * q.in_A, id).toBeGreaterThanOrEqual(ir);
    }
  });

  it("sets fuses on final circuits at or above the circuit current and within the cable rating", () => {
    // IEC 60364-4-43: IB <= In <= IZ (from memory); motor current Ir = Pr / (eta cos phi sqrt(3) Ur)
    const circuits: [string, number][] = [
      ["F-OF", apparentPower_kVA(40, get<Element & { q_kvar: number }>("L-OF").q_kvar) / (Math.sqrt(3) * 0.4)],
      ["F-PMP", motorInput_kVA(55, 0.94, 0.86) / (Math.sqrt(3) * 0.4)],
      ["F-CMP", motorInput_kVA(90, 0.95, 0.87) / (Math.sqrt(3) * 0.4)],
    ];
    for (const [id, ib_A] of circuits) {
      const f = get<Element & { rating_A: number; at: { element: string } }>(id);
      expect(f.rating_A, id).toBeGreaterThanOrEqual(ib_A);
      expect(f.rating_A, id).toBeLessThanOrEqual(get<Line>(f.at.element).ampacity_A);
    }
  });

  it("sets transformer HV relays above rated current and inrush, and their 50 above the LV through-fault", () => {
    // phase pickup 1.25-1.5 x rated (common practice); inrush about 12 x rated for 0.1 s (common practice);
    // maximum LV through-fault seen at HV about cmax * Ir / uk with cmax 1.1 (IEC 60909-0, Table 1) on a stiff source
    for (const [relayId, tId] of [["R-T1", "T1"], ["R-T2", "T2"], ["R-VIL", "T-VIL"]]) {
      const r = get<Relay>(relayId);
      const t = get<Transformer>(tId);
      const ir_A = ratedCurrent_A(t.sr_MVA, t.urHv_kV);
      const f51 = r.functions.find((f) => f.ansi === "51")!;
      const f50 = r.functions.find((f) => f.ansi === "50")!;
      expect(f51.pickup_A / ir_A, relayId).toBeGreaterThanOrEqual(1.25);
      expect(f50.pickup_A, relayId).toBeGreaterThan(12 * ir_A);
      expect(f50.pickup_A, relayId).toBeGreaterThan((1.1 * ir_A) / (t.uk_pct / 100));
    }
  });
});
