// The README's project-file section documents every field of every record kind, so the
// documentation cannot silently fall behind the schema (the format's own specification).
import { describe, it, expect } from "vitest";
import { readFileSync } from "node:fs";
import { elementSchema, scenarioSchema, studySettingsSchema, criteriaSchema } from "../../../src/model/schema.ts";

const readme = readFileSync(new URL("../../../README.md", import.meta.url), "utf8");
const section = readme.slice(readme.indexOf("<!-- section:project-file -->"), readme.indexOf("<!-- /section:project-file -->"));

type Shaped = { _zod: { def: { shape: Record<string, unknown>; options?: Shaped[] } } };
const fieldsOf = (s: unknown) => Object.keys((s as Shaped)._zod.def.shape);

describe("README, section Project file", () => {
  it("exists and carries the caution", () => {
    expect(section.length).toBeGreaterThan(1000);
    expect(section).toContain("Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.");
  });

  it("names every field of every element kind", () => {
    for (const option of (elementSchema as unknown as Shaped)._zod.def.options!) {
      const [kind, ...fields] = fieldsOf(option);
      expect(kind).toBe("kind");
      for (const f of fields) expect(section, f).toContain(f === "id" || f === "name" ? `\`${f}\`` : f);
    }
  });

  it("names every field of scenarios, study settings and criteria", () => {
    for (const s of [scenarioSchema, studySettingsSchema, criteriaSchema]) for (const f of fieldsOf(s)) expect(section, f).toContain(f);
  });
});
