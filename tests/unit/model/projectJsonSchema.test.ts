// The committed JSON Schema must be what `npm run schema` generates from the zod schemas today.
import { describe, it, expect } from "vitest";
import { readFileSync } from "node:fs";
import { projectJsonSchemaText, projectJsonSchema, PROJECT_SCHEMA_PATH } from "../../../src/model/projectJsonSchema.ts";
import { FORMAT_TAG, FORMAT_VERSION } from "../../../src/model/schema.ts";

describe("assets/schema/islet-project.schema.json", () => {
  it("equals a fresh generation (run npm run schema after changing src/model/schema.ts)", () => {
    const committed = readFileSync(new URL(`../../../${PROJECT_SCHEMA_PATH}`, import.meta.url), "utf8");
    expect(committed).toBe(projectJsonSchemaText());
  });

  it("describes the envelope, every element kind, and keeps unknown fields allowed", () => {
    const s = projectJsonSchema() as { properties: Record<string, { const?: unknown; items?: { oneOf?: unknown[]; anyOf?: unknown[] } }>; required: string[]; additionalProperties: unknown };
    expect(s.properties.format.const).toBe(FORMAT_TAG);
    expect(s.properties.formatVersion.const).toBe(FORMAT_VERSION);
    expect(s.required).toEqual(expect.arrayContaining(["format", "formatVersion", "meta", "elements", "scenarios"]));
    const kinds = (s.properties.elements.items?.oneOf ?? s.properties.elements.items?.anyOf ?? []) as { properties: { kind: { const: string } } }[];
    expect(kinds.map((k) => k.properties.kind.const)).toEqual(["bus", "grid", "transformer", "line", "generator", "inverter", "motor", "load", "switch", "relay", "fuse", "lvbreaker"]);
    expect(s.additionalProperties).toEqual({}); // loose: fields this version does not know are allowed
  });
});
