// The project file's JSON Schema, generated from the zod schemas (the single source of truth).
// tests/tools/gen-schema.mjs writes it to assets/schema/islet-project.schema.json; a unit test checks
// that the committed file equals a fresh generation.
import { z } from "zod";
import { FORMAT_VERSION, projectSchema } from "./schema.ts";

export const PROJECT_SCHEMA_PATH = "assets/schema/islet-project.schema.json";

export function projectJsonSchema(): Record<string, unknown> {
  // "input": the shape a file may have on disk, so fields with defaults are optional
  const generated = z.toJSONSchema(projectSchema, { io: "input", target: "draft-2020-12", unrepresentable: "any" }) as Record<string, unknown>;
  const { $schema, ...rest } = generated;
  return {
    $schema,
    $id: `https://islet.invalid/schema/islet-project-${FORMAT_VERSION}.schema.json`,
    title: `Islet project file, formatVersion ${FORMAT_VERSION}`,
    description:
      "An Islet project (.islet): UTF-8 JSON. Records keep fields this version does not know. Generated from src/model/schema.ts; do not edit by hand.",
    ...rest,
  };
}

/** The file text: 2-space indent and a trailing newline. */
export function projectJsonSchemaText(): string {
  return `${JSON.stringify(projectJsonSchema(), null, 2)}\n`;
}
