// Writes assets/demo/dairy-coop.islet from src/model/demo/dairyCoop.ts through serializeProject,
// so the committed demo is always canonical. Run: node tests/tools/gen-demo.mjs
import { register } from "tsx/esm/api";
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";

register();
const root = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
const { dairyCoopProject } = await import("../../src/model/demo/dairyCoop.ts");
const { serializeProject } = await import("../../src/model/projectFile.ts");
const out = resolve(root, "assets/demo/dairy-coop.islet");
mkdirSync(dirname(out), { recursive: true });
writeFileSync(out, serializeProject(dairyCoopProject()), "utf8");
console.log(`wrote ${out}`);
