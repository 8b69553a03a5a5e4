import { describe, it, expect } from "vitest";
import { fieldsOfKind, labelOf, unitOf } from "../../../renderer/inspector/fieldModel.ts";
import { vectorGroups, curveNames } from "../../../src/model/schema.ts";

describe("inspector fields derived from the schema", () => {
  it("reads units from the field-name suffix", () => {
    expect(unitOf("un_kV")).toBe("kV");
    expect(unitOf("r1_ohmPerKm")).toBe("Ω/km");
    expect(unitOf("uk_pct")).toBe("%");
    expect(unitOf("csa_mm2")).toBe("mm²");
    expect(unitOf("parallel")).toBe("");
  });

  it("labels a field from its description without the trailing unit phrase", () => {
    expect(labelOf("un_kV", "Nominal line-to-line voltage in kV")).toBe("Nominal line-to-line voltage");
    expect(labelOf("multiplier", "Time multiplier (IEC TMS) or time dial (IEEE TD)")).toBe("Time multiplier or time dial");
    expect(labelOf("skMin_MVA", undefined)).toBe("Sk min");
  });

  it("offers a transformer's vector groups exactly as the schema lists them", () => {
    const vg = fieldsOfKind("transformer").find((f) => f.key === "vectorGroup");
    expect(vg?.type === "choice" && vg.options).toEqual([...vectorGroups]);
  });

  it("edits bus references with a bus chooser and a device's place with a location field", () => {
    expect(fieldsOfKind("line").filter((f) => f.type === "busRef").map((f) => f.key)).toEqual(["fromBus", "toBus"]);
    expect(fieldsOfKind("fuse").find((f) => f.key === "at")?.type).toBe("location");
  });

  it("edits a power station unit's transformer with a chooser of transformers", () => {
    const unit = fieldsOfKind("generator").find((f) => f.key === "unit");
    const tr = unit?.type === "group" ? unit.fields.find((f) => f.key === "transformer") : undefined;
    expect(tr?.type === "elementRef" && tr.kind).toBe("transformer");
  });

  it("shows a relay's functions as a list with the curve names of the schema", () => {
    const list = fieldsOfKind("relay").find((f) => f.key === "functions");
    expect(list?.type).toBe("list");
    const curve = list?.type === "list" ? list.item.find((f) => f.key === "curve") : undefined;
    expect(curve?.type === "choice" && curve.options).toEqual([...curveNames]);
  });

  it("shows the CT secondary as a choice of 1 A or 5 A", () => {
    const ct = fieldsOfKind("relay").find((f) => f.key === "ctSecondary_A");
    expect(ct?.type === "choice" && ct.options).toEqual([1, 5]);
  });
});
