// Migration 0 -> 1: the draft format's field names and layout, as defined in
// src/model/migrations/v1ElementsArray.ts; the expected documents below are written out by hand.
import { describe, it, expect } from "vitest";
import { v1ElementsArray } from "../../../../src/model/migrations/v1ElementsArray.ts";
import { loadProject } from "../../../../src/model/projectFile.ts";

const draft = () => ({
  format: "islet-project",
  version: 0,
  project: { name: "Draft site", base: 10, frequency: 60, client: "kept" },
  elements: {
    B1: { kind: "bus", name: "MV", un: 11 },
    B2: { kind: "bus", name: "LV", un: 0.4 },
    G: { kind: "grid", bus: "B1", skMax: 100, skMin: 50 },
    T: { kind: "transformer", hvBus: "B1", lvBus: "B2", sr: 1, urHv: 11, urLv: 0.4, uk: 6, ur: 1.1 },
    C: { kind: "line", name: "Yard cable", fromBus: "B2", toBus: "B2x", length: 0.05, r1: 0.2, x1: 0.08, r0: 0.8, x0: 0.3, csa: 95, ampacity: 280 },
    B2x: { kind: "bus", un: 0.4 },
    L: { kind: "load", bus: "B2x", p: 20, q: 5, colour: "red" },
    R: {
      kind: "relay",
      at: { element: "T", end: "from" },
      ctPrimary: 100,
      functions: [{ id: "a", ansi: "51", quantity: "phase", pickup: 60, tMin: 0.05 }],
    },
    Q: { kind: "lvbreaker", at: { element: "C", end: "from" }, in: 250, longTime: { ir: 0.8, tr: 5 }, instantaneous: { ii: 10 } },
  },
  scenarios: [{ id: "S", name: "Normal" }],
  layout: { B1: { x: 0, y: 0 } },
});

describe("migration 1 (draft format 0 to formatVersion 1)", () => {
  it("has id 1", () => {
    expect(v1ElementsArray.id).toBe(1);
  });

  it("turns elements keyed by id into an array with ids, and adds unit suffixes", () => {
    const out = v1ElementsArray.up(draft());
    expect(out.formatVersion).toBe(1);
    expect(out).not.toHaveProperty("version");
    expect(out).not.toHaveProperty("project");
    expect(out.meta).toEqual({ name: "Draft site", baseMVA: 10, frequency_Hz: 60, client: "kept" });
    const els = out.elements as Record<string, unknown>[];
    expect(els.map((e) => e.id)).toEqual(["B1", "B2", "G", "T", "C", "B2x", "L", "R", "Q"]);
    expect(els[0]).toEqual({ kind: "bus", id: "B1", name: "MV", un_kV: 11 });
    expect(els[3]).toEqual({ kind: "transformer", id: "T", hvBus: "B1", lvBus: "B2", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 1.1 });
    expect(els[4]).toMatchObject({ length_km: 0.05, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.3, csa_mm2: 95, ampacity_A: 280 });
    expect(els[6]).toEqual({ kind: "load", id: "L", bus: "B2x", p_kW: 20, q_kvar: 5, colour: "red" });
    expect(els[7]).toMatchObject({ ctPrimary_A: 100, functions: [{ id: "a", ansi: "51", quantity: "phase", pickup_A: 60, tMin_s: 0.05 }] });
    expect(els[8]).toMatchObject({ in_A: 250, longTime: { ir_x: 0.8, tr_s: 5 }, instantaneous: { ii_x: 10 } });
    expect(out.scenarios).toEqual([{ id: "S", name: "Normal" }]);
    expect(out.layout).toEqual({ B1: { x: 0, y: 0 } });
  });

  it("does not mutate its input", () => {
    const input = draft();
    const before = JSON.stringify(input);
    v1ElementsArray.up(input);
    expect(JSON.stringify(input)).toBe(before);
  });

  it("refuses a record that holds both the old and the new name of a field", () => {
    const input = draft();
    (input.elements.B1 as Record<string, unknown>).un_kV = 10;
    expect(() => v1ElementsArray.up(input)).toThrow('Element B1 "MV": has both "un" and "un_kV"; cannot tell which to keep');
  });

  it("refuses an id field that disagrees with the key", () => {
    const input = draft();
    (input.elements.G as Record<string, unknown>).id = "GRID";
    expect(() => v1ElementsArray.up(input)).toThrow('Element G: its "id" field says "GRID", but it is stored under key "G"');
  });

  it("is what loadProject runs on a version 0 file, with a note in the warnings", () => {
    const r = loadProject(JSON.stringify(draft()));
    if (!r.ok) throw new Error(r.error.messages.join("; "));
    expect(r.project.formatVersion).toBe(1);
    expect(r.project.elements).toHaveLength(9);
    expect(r.warnings[0]).toBe("Project file: brought from formatVersion 0 to 1; saving writes formatVersion 1");
  });

  it("reports a draft it cannot carry over as migrationFailed, naming the element", () => {
    const input = draft();
    (input.elements as Record<string, unknown>).X = 42;
    const r = loadProject(JSON.stringify(input));
    expect(r).toEqual({
      ok: false,
      error: {
        kind: "migrationFailed",
        messages: [
          "Project file: could not be brought from formatVersion 0 to 1: step to formatVersion 1 (elements from an object keyed by id to an array; unit suffixes on every quantity; `project` becomes `meta`): Element X: expected an object in \"elements\", got number",
        ],
      },
    });
  });
});
