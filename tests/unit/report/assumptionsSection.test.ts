import { describe, expect, it } from "vitest";
import { projectSchema } from "../../../src/model/schema.ts";
import { assumptionsSection } from "../../../src/report/assumptionsSection.ts";

const make = (study: object, criteria: object = {}) =>
  projectSchema.parse({
    format: "islet-project",
    formatVersion: 1,
    meta: { name: "p" },
    study,
    criteria,
    elements: [
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "B", un_kV: 0.4 },
    ],
    scenarios: [],
  });

const cells = (html: string) => [...html.matchAll(/<td[^>]*>([^<]*)<\/td>/g)].map((m) => m[1]);

describe("assumptions", () => {
  it("names IEC 60909-0:2016 and its voltage factors for each level", () => {
    const html = assumptionsSection(make({ method: "iec60909", lvTolerance_pct: 6 }));
    expect(html).toContain("IEC 60909-0:2016");
    // IEC 60909-0:2016, Table 1: LV (+6 %) cmax 1.05, cmin 0.95; MV cmax 1.10, cmin 1.00
    const c = cells(html);
    expect(c.slice(0, 6)).toEqual(["0.400 kV", "1.05", "0.95", "11.0 kV", "1.10", "1.00"]);
  });

  it("gives the classic method's prefault voltage instead of c factors", () => {
    const html = assumptionsSection(make({ method: "classic", prefault_pu: 1.05 }));
    expect(html).toContain("prefault voltage of 1.050 pu");
    expect(cells(html).slice(0, 3)).toEqual(["0.400 kV", "1.050", "1.050"]);
  });

  it("states the CTI, margins and the inverter model used", () => {
    const html = assumptionsSection(make({ inverterModel: "iec" }, { cti_s: 0.25, pairCti: [{ primary: "R2", backup: "R1", cti_s: 0.2 }] }));
    expect(html).toContain("0.25 s");
    expect(html).toContain("CTI for R2 backed up by R1");
    expect(html).toContain("<strong>IEC 60909 full-size converter superposition</strong>");
  });
});
