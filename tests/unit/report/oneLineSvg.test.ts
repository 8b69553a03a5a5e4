import { describe, expect, it } from "vitest";
import { projectSchema } from "../../../src/model/schema.ts";
import { oneLineSvg } from "../../../src/report/oneLineSvg.ts";

const project = projectSchema.parse({
  format: "islet-project",
  formatVersion: 1,
  meta: { name: 'Yard <"A">' },
  elements: [
    { kind: "bus", id: "HV", un_kV: 11 },
    { kind: "bus", id: "LV", un_kV: 0.4 },
    { kind: "grid", id: "G", bus: "HV", skMax_MVA: 100, skMin_MVA: 50 },
    { kind: "transformer", id: "T", hvBus: "HV", lvBus: "LV", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 },
    { kind: "load", id: "LD", bus: "LV", p_kW: 100, q_kvar: 20 },
    { kind: "fuse", id: "F1", at: { element: "T", end: "from" }, rating_A: 63 },
    { kind: "relay", id: "R1", at: { element: "T", end: "from" }, ctPrimary_A: 100, functions: [{ id: "a", ansi: "51", quantity: "phase", pickup_A: 80 }, { id: "b", ansi: "50", quantity: "phase", pickup_A: 800 }] },
  ],
  scenarios: [{ id: "s", name: "s" }],
  // the load has no position: it must still be drawn
  layout: { HV: { x: 200, y: 0, w: 200 }, G: { x: 200, y: -80 }, T: { x: 200, y: 100 }, LV: { x: 200, y: 200, w: 200 } },
});

describe("one-line SVG", () => {
  const svg = oneLineSvg(project);

  it("draws every network element and labels every element and device", () => {
    for (const id of ["HV  11 kV", "LV  0.4 kV", ">G<", ">T<", ">LD<", ">F1<", ">R1<"]) expect(svg).toContain(id);
  });

  it("draws a transformer as two circles, coloured by the voltage of each winding's side", () => {
    const circles = [...svg.matchAll(/<circle [^>]*stroke="(#[0-9a-f]+)"/g)].map((m) => m[1]);
    expect(circles).toHaveLength(2);
    expect(circles[0]).not.toBe(circles[1]);
  });

  it("shows a relay's IEEE C37.2 numbers", () => {
    expect(svg).toContain(">51 50<");
  });

  it("escapes the project name in its title", () => {
    expect(svg).toContain("<title>One-line diagram of Yard &lt;&quot;A&quot;&gt;</title>");
  });
});
