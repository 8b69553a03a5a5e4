// Project file benchmark: load (parse, schema, rules) and save (canonical text) of the demo and of generated
// radial networks of 1,000 and 10,000 buses. Targets: demo load + save < 50 ms; 1,000 buses load < 1 s;
// 10,000 buses load < 10 s and save < 5 s. Prints PASS/MISS.
import { readFileSync } from "node:fs";
import { join, dirname } from "node:path";
import { fileURLToPath } from "node:url";
import { loadProject, serializeProject } from "../../src/model/projectFile.ts";
import { validateProject } from "../../src/model/validate.ts";
import { generateRadialNetwork } from "../../src/model/generateNetwork.ts";
import { figure, section, target, timeMedian } from "./libBench.ts";

const root = join(dirname(fileURLToPath(import.meta.url)), "..", "..");
const demoText = readFileSync(join(root, "assets/demo/dairy-coop.islet"), "utf8");

section("demo project");
const demoLoad = timeMedian(() => loadProject(demoText), { warmup: 3, runs: 21 });
const demo = loadProject(demoText);
if (!demo.ok) throw new Error(demo.error.messages.join("; "));
const demoSave = timeMedian(() => serializeProject(demo.project), { warmup: 3, runs: 21 });
figure("load", demoLoad.median_ms, "ms");
figure("save", demoSave.median_ms, "ms");
target("demo load + save", demoLoad.median_ms + demoSave.median_ms, "ms", "lower", 50);

for (const [buses, loadLimit_ms, saveLimit_ms, runs] of [
  [1000, 1000, 500, 5],
  [10000, 10000, 5000, 3],
] as const) {
  section(`generated radial network, ${buses} buses`);
  const project = generateRadialNetwork({ buses, devices: buses / 2, seed: 7 });
  const text = serializeProject(project);
  figure("elements", project.elements.length, "");
  figure("file size", text.length / 2 ** 20, "MiB");
  const load = timeMedian(() => loadProject(text), { warmup: 1, runs });
  const save = timeMedian(() => serializeProject(project), { warmup: 1, runs });
  const rules = timeMedian(() => validateProject(project), { warmup: 1, runs });
  figure("validateProject (schema + rules)", rules.median_ms, "ms");
  target(`${buses} buses: load`, load.median_ms, "ms", "lower", loadLimit_ms);
  target(`${buses} buses: save`, save.median_ms, "ms", "lower", saveLimit_ms);
}
