import { describe, it, expect } from "vitest";
import { validateProject } from "../../../src/model/validate.ts";
import { projectSchema } from "../../../src/model/schema.ts";
import { smallDoc, elementById } from "./fixtures/smallProject.ts";

// The fixture's genset GEN sits on LV, the LV side of T1 (11/0.4 kV): a unit as far as the references go.
const errors = (doc: unknown) => validateProject(doc).filter((m) => m.severity === "error");

describe("generator unit field (IEC 60909-0:2016, 6.7 power station unit)", () => {
  it("is optional, and defaults to an on-load tap changer and p_G 0", () => {
    const doc = smallDoc();
    elementById(doc, "GEN").unit = { transformer: "T1" };
    const p = projectSchema.parse(doc);
    const g = p.elements.find((e) => e.id === "GEN");
    expect(g?.kind === "generator" && g.unit).toEqual({ transformer: "T1", onLoadTap: true, pG_pct: 0 });
    expect(errors(doc)).toEqual([]);
  });

  it("names the generator and field for a dangling transformer id", () => {
    const doc = smallDoc();
    elementById(doc, "GEN").unit = { transformer: "T7" };
    expect(errors(doc)).toEqual([
      { severity: "error", elementId: "GEN", field: "unit.transformer", text: 'Generator GEN "Genset": unit.transformer "T7" names no element in the project (dangling reference)' },
    ]);
  });

  it("refuses an element that is not a transformer", () => {
    const doc = smallDoc();
    elementById(doc, "GEN").unit = { transformer: "C12" };
    expect(errors(doc).map((m) => m.text)).toEqual(['Generator GEN "Genset": unit.transformer "C12" names a line, not a transformer']);
  });

  it("refuses a transformer whose HV side is the generator's bus", () => {
    const doc = smallDoc();
    Object.assign(elementById(doc, "GEN"), { bus: "MV", ur_kV: 11, unit: { transformer: "T1" } });
    expect(errors(doc).map((m) => m.text)).toEqual(['Generator GEN "Genset": unit.transformer "T1" does not step up from the generator\'s bus "MV": the generator is on its HV bus "MV"']);
  });

  it("accepts a generator breaker between the generator's bus and the transformer's LV bus", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "bus", id: "GT", name: "Generator terminals", un_kV: 0.4 }, { kind: "switch", id: "QG", busA: "GT", busB: "LV", closed: false });
    Object.assign(elementById(doc, "GEN"), { bus: "GT", unit: { transformer: "T1" } });
    expect(errors(doc)).toEqual([]);
  });

  it("refuses a second generator on the same unit transformer", () => {
    const doc = smallDoc();
    elementById(doc, "GEN").unit = { transformer: "T1" };
    doc.elements.push({ kind: "generator", id: "GEN2", name: "Second set", bus: "LV", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.14, x2_pu: 0.14, x0_pu: 0.06, unit: { transformer: "T1" } });
    expect(errors(doc)).toContainEqual({
      severity: "error",
      elementId: "GEN2",
      field: "unit.transformer",
      text: 'Generator GEN2 "Second set": unit.transformer "T1" is already the unit transformer of Generator GEN "Genset"; a power station unit has one generator',
    });
  });

  it("takes pole pairs on a motor as a whole number of at least 1", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "motor", id: "M1", name: "Pump", bus: "LV", pr_kW: 50, ur_kV: 0.4, polePairs: 1.5 });
    expect(errors(doc).map((m) => m.field)).toEqual(["polePairs"]);
    elementById(doc, "M1").polePairs = 2;
    expect(errors(doc)).toEqual([]);
  });
});
