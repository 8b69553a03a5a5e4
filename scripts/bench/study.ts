// Study benchmark: the whole protection study of the demo project (every scenario, bus, line point, fault
// type and limit, with verdicts, blinding re-solves and timelines), and of generated 500-bus networks with
// 100 devices (radial and meshed). Targets: demo < 1 s, 500 buses / 100 devices < 10 s. Prints PASS/MISS.
import { readFileSync } from "node:fs";
import { join, dirname } from "node:path";
import { fileURLToPath } from "node:url";
import { loadProject } from "../../src/model/projectFile.ts";
import { generateMeshedNetwork, generateRadialNetwork } from "../../src/model/generateNetwork.ts";
import type { Project } from "../../src/model/schema.ts";
import { studyProject } from "../../src/study/studyProject.ts";
import type { StudyResult } from "../../src/study/types.ts";
import { figure, peakRss_MB, section, target } from "./libBench.ts";

const root = join(dirname(fileURLToPath(import.meta.url)), "..", "..");
const SEED = 20260;

async function timeStudy(project: Project, runs: number): Promise<{ ms: number; result: StudyResult }> {
  let result = await studyProject(project); // warm-up, also the result reported
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    result = await studyProject(project);
    t.push(performance.now() - t0);
  }
  t.sort((a, b) => a - b);
  return { ms: t[Math.floor(t.length / 2)], result };
}

function describe(result: StudyResult): void {
  const fails = result.verdicts.filter((v) => v.status === "fail").length;
  figure("fault cases", result.cases.length, "");
  figure("verdicts", result.verdicts.length, "", `${fails} fail`);
  figure("timelines", result.timelines.length, "");
}

async function main() {
  section("demo project (assets/demo/dairy-coop.islet), whole study");
  const demo = loadProject(readFileSync(join(root, "assets/demo/dairy-coop.islet"), "utf8"));
  if (!demo.ok) throw new Error(demo.error.messages.join("\n"));
  const d = await timeStudy(demo.project, 5);
  describe(d.result);
  target("demo study", d.ms, "ms", "lower", 1000);

  for (const [label, make] of [
    ["radial, 500 buses, 100 devices", () => generateRadialNetwork({ buses: 500, devices: 100, seed: SEED })],
    ["meshed, 500 buses, 100 devices", () => generateMeshedNetwork({ buses: 500, devices: 100, seed: SEED })],
  ] as const) {
    section(`${label}, whole study`);
    const r = await timeStudy(make(), 1);
    describe(r.result);
    target(`${label} study`, r.ms, "ms", "lower", 10000);
  }
  figure("peak RSS", peakRss_MB(), "MB");
}

await main();
