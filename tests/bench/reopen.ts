// Re-solve benchmark: faults with 1-2 protective-device ends open, answered from the base factorization by a
// low-rank update (src/engine/reopen), against a fresh compile and solve of the opened network, on the generated
// 500-bus radial and meshed networks. Figures per fault (every device current, the four fault types averaged):
// a re-solve with the opened set already set up, the set-up of a new opened set, the opened-set sweep per bus and
// fault type, a mid-cable fault, and the fresh compile + solve. Targets print PASS/MISS; nothing here fails on a miss.
import { compileNetwork, createReopenContext, reopenedSet, solveFault, solveReopened, sweepReopened, FAULT_TYPES, type OpenEnd } from "../../src/engine/index.ts";
import { generateMeshedNetwork, generateRadialNetwork, GENERATED_SCENARIOS } from "../../src/model/generateNetwork.ts";
import type { Project } from "../../src/model/schema.ts";
import { figure, section, target, timeMedian } from "./libBench.ts";

const SEED = 20260;
const options = { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" as const };

function deviceEnds(project: Project): OpenEnd[] {
  const out = new Map<string, OpenEnd>();
  for (const e of project.elements) if (e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker") out.set(`${e.at.element}|${e.at.end}`, { element: e.at.element, end: e.at.end });
  return [...out.values()];
}

const cases = [
  { label: "radial, 500 buses", make: () => generateRadialNetwork({ buses: 500, devices: 100, seed: SEED }) },
  { label: "meshed, 500 buses", make: () => generateMeshedNetwork({ buses: 500, devices: 100, seed: SEED }) },
];

console.log(`re-solve benchmark: Node ${process.version}, seed ${SEED}; times are medians after warm-up`);
for (const c of cases) {
  section(c.label);
  const project = c.make();
  const ends = deviceEnds(project);
  const ctx = createReopenContext(project, options);
  const buses = Object.keys(ctx.base.busNode);
  // Opened sets of one and two device ends spread over the network, and ten faulted buses per set.
  const sets: OpenEnd[][] = [];
  for (let i = 0; i < 6; i++) sets.push([ends[(i * 17) % ends.length]]);
  for (let i = 0; i < 6; i++) sets.push([ends[(i * 29 + 5) % ends.length], ends[(i * 11 + 40) % ends.length]]);
  const faulted = (i: number) => Array.from({ length: 10 }, (_, j) => buses[(i * 37 + j * 53) % buses.length]);
  const perSet = 10 * FAULT_TYPES.length;
  figure("opened sets", sets.length, "", `${ends.length} device ends, ${buses.length} buses; ${perSet} faults per set`);

  for (const rank of [1, 2]) {
    const group = sets.filter((s) => s.length === rank);
    const faults = group.length * perSet;
    const each = (fn: (s: OpenEnd[], bus: string, type: (typeof FAULT_TYPES)[number]) => void) =>
      group.forEach((s, i) => {
        for (const bus of faulted(i)) for (const type of FAULT_TYPES) fn(s, bus, type);
      });
    // Set-up of a new opened set (the model, its islands and the updates of the sequences it uses) with its first
    // fault, on a fresh context each run (no cached columns).
    const setup = timeMedian(
      () => {
        const fresh = createReopenContext(project, options, ctx.base);
        for (const s of group) solveReopened(fresh, s, { kind: "bus", bus: buses[0] }, "3ph", { detail: "devices", inverterModel: "iec" });
      },
      { warmup: 1, runs: 5 },
    );
    for (const s of group) reopenedSet(ctx, s);
    const warmIec = timeMedian(() => each((s, bus, type) => solveReopened(ctx, s, { kind: "bus", bus }, type, { detail: "devices", inverterModel: "iec" })), { warmup: 1, runs: 5 });
    const warmRefined = timeMedian(() => each((s, bus, type) => solveReopened(ctx, s, { kind: "bus", bus }, type, { detail: "devices", inverterModel: "refined" })), { warmup: 1, runs: 5 });
    const sweep = timeMedian(() => group.forEach((s, i) => sweepReopened(ctx, s, { buses: faulted(i), inverterModel: "iec" })), { warmup: 1, runs: 7 });
    const sweepOne = timeMedian(() => group.forEach((s, i) => faulted(i).forEach((bus) => sweepReopened(ctx, s, { buses: [bus], inverterModel: "iec" }))), { warmup: 1, runs: 7 });
    const sweepRefined = timeMedian(() => group.forEach((s, i) => sweepReopened(ctx, s, { buses: faulted(i), inverterModel: "refined" })), { warmup: 1, runs: 7 });
    // Fresh compile with the ends open and one solve (what each re-solve would cost without the update).
    const fresh = timeMedian(
      () =>
        group.forEach((s, i) => {
          const r = compileNetwork(project, { ...options, openEnds: s });
          if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
          solveFault(r.network, { kind: "bus", bus: faulted(i)[0] }, "3ph", { detail: "devices", inverterModel: "iec" });
        }),
      { warmup: 1, runs: 5 },
    );
    // Faults at the middle of cables: placed by bordering, against a fresh compile and solveFault's own split.
    const lines = project.elements.filter((e) => e.kind === "line").map((e) => e.id);
    const lineAt = (i: number, j: number) => ({ kind: "line" as const, line: lines[(i * 31 + j * 7) % lines.length], pct: 50 });
    const lineWarm = timeMedian(() => group.forEach((s, i) => { for (let j = 0; j < 10; j++) solveReopened(ctx, s, lineAt(i, j), "LG", { detail: "devices", inverterModel: "iec" }); }), { warmup: 1, runs: 5 });
    const lineFresh = timeMedian(
      () =>
        group.forEach((s, i) => {
          const r = compileNetwork(project, { ...options, openEnds: s });
          if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
          solveFault(r.network, lineAt(i, 0), "LG", { detail: "devices", inverterModel: "iec" });
        }),
      { warmup: 1, runs: 5 },
    );
    const freshPer = fresh.median_ms / group.length;
    const sweepPer = sweep.median_ms / faults;
    const note = `${rank} opened end${rank > 1 ? "s" : ""}`;
    figure(`${note}: set-up of a new opened set with its first fault`, setup.median_ms / group.length, "ms");
    figure(`${note}: re-solve per fault, every device current, IEC converters (solveReopened)`, warmIec.median_ms / faults, "ms");
    figure(`${note}: re-solve per fault, every device current, refined converters (solveReopened)`, warmRefined.median_ms / faults, "ms");
    figure(`${note}: opened-set sweep per bus and fault type, IEC converters (sweepReopened)`, sweepPer, "ms");
    figure(`${note}: opened-set sweep of a single bus, per fault type, IEC converters (sweepReopened)`, sweepOne.median_ms / faults, "ms");
    figure(`${note}: opened-set sweep per bus and fault type, refined converters (sweepReopened)`, sweepRefined.median_ms / faults, "ms");
    figure(`${note}: fresh compile + solve per fault, IEC converters`, freshPer, "ms");
    figure(`${note}: line point (mid-cable LG) re-solve per fault, IEC converters (solveReopened)`, lineWarm.median_ms / (group.length * 10), "ms");
    figure(`${note}: line point fresh compile + solve per fault`, lineFresh.median_ms / group.length, "ms");
    target(`${c.label}, ${note}: opened-set sweep speed-up over a fresh compile + solve per fault`, freshPer / sweepPer, "x", "higher", 10);
  }
  figure("faults answered by the update / by a fresh compile", ctx.stats.fast, "", `${ctx.stats.reference} by a fresh compile`);
}
