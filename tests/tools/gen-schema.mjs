// Writes assets/schema/islet-project.schema.json from the zod schemas in src/model/schema.ts.
// Run: npm run schema (a unit test fails when the committed file is stale).
import { register } from "tsx/esm/api";
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";

register();
const root = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
const { projectJsonSchemaText, PROJECT_SCHEMA_PATH } = await import("../../src/model/projectJsonSchema.ts");
const out = resolve(root, PROJECT_SCHEMA_PATH);
mkdirSync(dirname(out), { recursive: true });
writeFileSync(out, projectJsonSchemaText(), "utf8");
console.log(`wrote ${out}`);
