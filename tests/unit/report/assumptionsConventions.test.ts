import { describe, expect, it } from "vitest";
import { projectSchema } from "../../../src/model/schema.ts";
import { assumptionsSection } from "../../../src/report/assumptionsSection.ts";
import { escapeHtml } from "../../../src/report/escapeHtml.ts";
import { engineConventions } from "../../../src/engine/index.ts";

const make = (method: "iec60909" | "classic") =>
  projectSchema.parse({ format: "islet-project", formatVersion: 1, meta: { name: "p" }, study: { method }, elements: [{ kind: "bus", id: "A", un_kV: 0.4 }], scenarios: [] });

const rows = (html: string) => {
  const part = html.slice(html.indexOf("Conventions where the standard leaves a choice"), html.indexOf("<h3>Study settings"));
  return [...part.matchAll(/<p class="convention"><strong>([^<]*)\.<\/strong> ([^<]*)<\/p>/g)].map((m) => [m[1], m[2]]);
};

describe("assumptions: the engine's conventions", () => {
  for (const method of ["iec60909", "classic"] as const) {
    it(`lists every convention the engine applies (${method})`, () => {
      const got = rows(assumptionsSection(make(method)));
      expect(got).toEqual(engineConventions(method).map((c) => [escapeHtml(c.topic), escapeHtml(c.text)]));
    });
  }

  it("states the converter peak, generator sequence, minimum-limit, tap and temperature conventions", () => {
    const text = rows(assumptionsSection(make("iec60909"))).map((r) => r.join(": ")).join("\n");
    expect(text).toContain("kappa = 1");
    expect(text).toContain("x(2) and x(0)");
    expect(text).toContain("Asynchronous motors are left out of the minimum");
    expect(text).toContain("Converters feed the minimum currents as they do the maximum ones");
    expect(text).toContain("KT, KG and the power station unit factors are computed with cmax at both limits");
    expect(text).toContain("ideal ratio on the HV side");
    expect(text).toContain("0.004/K");
  });
});
