import { describe, it, expect } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { loadTemplate, loadTemplates, instantiateTemplate, checkDeviceSettings, operatingTime, TemplateError } from "../../../src/protection/index.ts";
import { elementSchema } from "../../../src/model/schema.ts";

const dir = join(__dirname, "../../../assets/templates");
const files = readdirSync(dir)
  .filter((f) => f.endsWith(".json"))
  .map((f) => ({ source: f, json: JSON.parse(readFileSync(join(dir, f), "utf8")) as unknown }));

describe("device templates in assets/templates", () => {
  it("all load, with ids matching their file names", () => {
    const { templates, errors } = loadTemplates(files);
    expect(errors.map((e) => e.message)).toEqual([]);
    expect(templates.length).toBe(files.length);
    for (const t of templates) expect(files.some((f) => f.source === `${t.id}.json`)).toBe(true);
  });

  it("cover the relay curves, LV trip units and fuse families the project names", () => {
    const titles = loadTemplates(files).templates.map((t) => t.title);
    for (const want of ["IEC standard inverse feeder relay", "IEC very inverse relay", "IEEE extremely inverse relay", "LV breaker 1600 A, electronic trip", "LV breaker 630 A, electronic trip", "LV breaker 250 A, thermal-magnetic", "General-purpose fuse 160 A"]) {
      expect(titles).toContain(want);
    }
  });

  it("give devices that pass the document schema and the settings check without warnings, and that operate", () => {
    for (const t of loadTemplates(files).templates) {
      const d = instantiateTemplate(t, "X1", "New device", { element: "L1", end: "from" });
      expect(elementSchema.safeParse(d).success).toBe(true);
      expect(checkDeviceSettings(d)).toEqual([]);
      expect(operatingTime(d, { phase_A: [1e5, 1e5, 1e5], residual_A: 1e5, negative_A: 1e5 }, { ignoreDirection: true }).picked).toBe(true);
    }
  });

  it("do not share data with the devices made from them", () => {
    const t = loadTemplate(files.find((f) => f.source.startsWith("relay-iec-standard"))!.json, "x");
    const d = instantiateTemplate(t, "X1", "New device", { element: "L1", end: "from" });
    if (d.kind === "relay") d.functions[0].pickup_A = 1;
    expect(t.device.kind === "relay" && t.device.functions[0].pickup_A).toBe(300);
  });
});

describe("template loader", () => {
  it("rejects a template with impossible settings, naming the file and field", () => {
    const bad = { format: "islet-device-template", formatVersion: 1, id: "bad", title: "Bad relay", device: { kind: "relay", ctPrimary_A: 100, functions: [{ id: "F", ansi: "51", quantity: "phase", curve: "iec-very-inverse", pickup_A: 100, tMin_s: 5, tMax_s: 1 }] } };
    expect(() => loadTemplate(bad, "bad.json")).toThrow(TemplateError);
    expect(() => loadTemplate(bad, "bad.json")).toThrow(/Template bad\.json: .*functions\[0\]\.tMin_s/);
  });

  it("rejects a wrong envelope and a schema violation, keeping the good files", () => {
    const { templates, errors } = loadTemplates([
      { source: "a.json", json: { format: "something-else" } },
      { source: "b.json", json: { format: "islet-device-template", formatVersion: 1, id: "b", title: "B", device: { kind: "fuse", rating_A: -1 } } },
      files[0],
    ]);
    expect(templates.length).toBe(1);
    expect(errors.map((e) => e.source)).toEqual(["a.json", "b.json"]);
    expect(errors[1].message).toContain("device.rating_A");
  });
});
