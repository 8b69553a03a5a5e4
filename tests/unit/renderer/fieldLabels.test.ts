import { describe, it, expect } from "vitest";
import { fieldsOfKind, fieldApplies, type FieldSpec } from "../../../renderer/inspector/fieldModel.ts";
import { fieldLabel, optionLabel } from "../../../src/model/fieldLabels.ts";
import { curveNames, type ElementKind } from "../../../src/model/schema.ts";

const KINDS: ElementKind[] = ["bus", "grid", "transformer", "line", "generator", "inverter", "motor", "load", "switch", "relay", "fuse", "lvbreaker"];

function walk(specs: FieldSpec[], out: FieldSpec[] = []): FieldSpec[] {
  for (const s of specs) {
    out.push(s);
    if (s.type === "group") walk(s.fields, out);
    if (s.type === "list") walk(s.item, out);
    if (s.type === "variant") for (const v of Object.values(s.variants)) walk(v, out);
  }
  return out;
}

describe("words on the screen, not internal names", () => {
  it("no field label is a raw key (an underscore, or lower camel case like kFactor)", () => {
    for (const kind of KINDS) {
      for (const spec of walk(fieldsOfKind(kind))) {
        expect(spec.label, `${kind}.${spec.key}`).not.toMatch(/_|^[a-z]+[A-Z]/);
        expect(spec.label, `${kind}.${spec.key}`).not.toMatch(/^Neg seq$|^Grid-forming$/);
      }
    }
  });

  it("every enumerated value of every field has display words unless it is itself the trade's word", () => {
    // vector groups (IEC 60076-1), insulations and device numbers read as written
    const asWritten = new Set(["vectorGroup", "insulation"]);
    for (const kind of KINDS) {
      for (const spec of walk(fieldsOfKind(kind))) {
        if (spec.type !== "choice" || asWritten.has(spec.key)) continue;
        for (const o of spec.options) expect(optionLabel(spec.key, o), `${kind}.${spec.key} = ${String(o)}`).not.toBe(String(o));
      }
    }
    expect(curveNames.map((c) => optionLabel("curve", c))).toContain("IEC standard inverse");
    expect(optionLabel("source", "pv")).toBe("PV");
    expect(optionLabel("kind", "parametric")).toBe("Family curve");
  });

  it("the earthing group offers the earthing kind; the impedance only for resistance or reactance", () => {
    const earthing = fieldsOfKind("transformer").find((f) => f.key === "earthingLv");
    expect(earthing?.type === "group" && earthing.fields.map((f) => [f.key, f.label])).toEqual([
      ["kind", "Neutral earthing"],
      ["z_ohm", "Earthing impedance"],
    ]);
    expect(fieldApplies("z_ohm", [{ kind: "solid" }])).toBe(false);
    expect(fieldApplies("z_ohm", [{ kind: "isolated" }])).toBe(false);
    expect(fieldApplies("z_ohm", [{ kind: "resistance" }])).toBe(true);
    expect(fieldApplies("z_ohm", [{ kind: "solid" }, { kind: "reactance" }])).toBe(true); // any of several selected
  });

  it("an inverter shows the k-factor and negative-sequence fields when grid-following, the source impedance when grid-forming", () => {
    const following = { kind: "inverter", control: "grid-following" };
    const forming = { kind: "inverter", control: "grid-forming" };
    expect(["kFactor", "negSeq", "zForming_pu"].map((k) => fieldApplies(k, [following]))).toEqual([true, true, false]);
    expect(["kFactor", "negSeq", "zForming_pu"].map((k) => fieldApplies(k, [forming]))).toEqual([false, false, true]);
    expect(fieldLabel("inverter", ["zForming_pu"])).toBe("Source impedance (grid-forming)");
  });

  it("a relay function shows its delay for definite time and its multiplier for an inverse curve", () => {
    const dt = { ansi: "51", curve: "definite-time" };
    const inv = { ansi: "51", curve: "iec-standard-inverse" };
    expect([fieldApplies("delay_s", [dt]), fieldApplies("multiplier", [dt])]).toEqual([true, false]);
    expect([fieldApplies("delay_s", [inv]), fieldApplies("multiplier", [inv])]).toEqual([false, true]);
    expect(fieldApplies("direction", [inv])).toBe(false);
    expect(fieldApplies("direction", [{ ansi: "67", curve: "definite-time" }])).toBe(true);
  });

  it("labels follow the path: an LV breaker's tr_s reads as its long-time delay", () => {
    expect(fieldLabel("lvbreaker", ["longTime", "tr_s"])).toBe("Long-time delay tr");
    expect(fieldLabel("generator", ["earthing", "kind"])).toBe("Neutral earthing");
    expect(fieldLabel("relay", ["tolerance", "pickup_pct"])).toBe("Pickup tolerance ±");
    expect(fieldLabel("relay", ["functions", 2, "ansi"])).toBe("Function (IEEE C37.2)");
  });
});
