// Engine benchmark: generated radial feeders of 100, 1,000 and 10,000 buses and a meshed 500-bus network.
// Figures: compile (network build and factorization), one-bus fault with all branch-end currents, all-bus sweep of the
// four fault types, memory, and the speed ratio against a plain dense mathjs solution of the same network.
// Uses the engine's public API only. Targets print PASS/MISS; nothing here fails on a miss.
import { compileNetwork, solveFault, sweepFaults, sweepDeviceCurrents, FAULT_TYPES, type CompiledNetwork, type Method, type FaultType } from "../../src/engine/index.ts";
import { generateRadialNetwork, generateMeshedNetwork, GENERATED_SCENARIOS } from "../../src/model/generateNetwork.ts";
import type { Project } from "../../src/model/schema.ts";
import { figure, heapUsed_MB, peakRss_MB, section, target, timeMedian } from "./libBench.ts";
import { denseThreePhaseFault } from "./libDenseBaseline.ts";

const SEED = 20260;

function compile(project: Project, method?: Method): CompiledNetwork {
  const r = compileNetwork(project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max", method });
  if (!r.ok) throw new Error(`compileNetwork failed: ${r.errors.map((e) => e.text).join("; ")}`);
  return r.network;
}

const countDevices = (p: Project) => p.elements.filter((e) => e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker").length;

interface Case {
  label: string;
  make: () => Project;
  oneBusTarget_ms?: number;
  sweepTarget_ms?: number;
  sweepRuns: number;
}

const cases: Case[] = [
  { label: "radial, 100 buses", make: () => generateRadialNetwork({ buses: 100, devices: 100, seed: SEED }), sweepRuns: 5 },
  { label: "radial, 1,000 buses", make: () => generateRadialNetwork({ buses: 1000, devices: 500, seed: SEED }), oneBusTarget_ms: 5, sweepRuns: 5 },
  { label: "radial, 10,000 buses", make: () => generateRadialNetwork({ buses: 10000, devices: 500, seed: SEED }), sweepTarget_ms: 500, sweepRuns: 3 },
  { label: "meshed, 500 buses", make: () => generateMeshedNetwork({ buses: 500, devices: 500, seed: SEED }), sweepRuns: 5 },
];

console.log(`engine benchmark: Node ${process.version}, seed ${SEED}; times are medians after warm-up`);
const heap0 = heapUsed_MB();

for (const c of cases) {
  section(c.label);
  const t0 = performance.now();
  const project = c.make();
  figure("generate project", performance.now() - t0, "ms", `${project.elements.length} elements, ${countDevices(project)} devices`);

  const heapBefore = heapUsed_MB();
  const compileT = timeMedian(() => compile(project), { warmup: 1, runs: c.sweepRuns });
  figure("compile: build and factorize sequence networks", compileT.median_ms, "ms");
  const net = compile(project);
  figure("heap held by the compiled network", heapUsed_MB() - heapBefore, "MB");

  // One bus fault with every branch-end and shunt current: the last generated bus, deep in the tree.
  const bus = `bus-${project.elements.filter((e) => e.kind === "bus").length - 1}`;
  let slowest = 0;
  for (const type of FAULT_TYPES) {
    const t = timeMedian(() => solveFault(net, { kind: "bus", bus }, type), { warmup: 3, runs: 15 });
    const r = solveFault(net, { kind: "bus", bus }, type);
    figure(`one-bus ${type} fault at ${bus}`, t.median_ms, "ms", `${r.branchEnds.length} branch ends, ${r.shunts.length} shunts, I"k ${r.ikss_kA.toFixed(3)} kA`);
    slowest = Math.max(slowest, t.median_ms);
  }
  if (c.oneBusTarget_ms) target(`one-bus fault with all device currents, ${c.label} (slowest type)`, slowest, "ms", "lower", c.oneBusTarget_ms);

  const types: FaultType[] = [...FAULT_TYPES];
  const heapSweep0 = heapUsed_MB();
  const sweepT = timeMedian(() => sweepFaults(net, { types }), { warmup: 1, runs: c.sweepRuns });
  const sweep = sweepFaults(net, { types });
  const heapSweep = heapUsed_MB() - heapSweep0;
  const nb = sweep.busIds.length;
  const label = `all-bus sweep, 4 fault types, ${c.label}, ${sweep.devices.length} devices`;
  if (c.sweepTarget_ms) target(label, sweepT.median_ms, "ms", "lower", c.sweepTarget_ms);
  else figure(label, sweepT.median_ms, "ms");
  figure("faults per second in the sweep", (nb * types.length) / (sweepT.median_ms / 1000), "1/s", `${nb} buses x ${types.length} types`);
  figure("heap held by the sweep result", heapSweep, "MB");

  // Reading device currents out of the sweep: every device for every fault at up to 500 buses.
  const buses = Math.min(nb, 500);
  const readT = timeMedian(
    () => {
      let s = 0;
      for (let b = 0; b < buses; b++) for (let t = 0; t < types.length; t++) for (let d = 0; d < sweep.devices.length; d++) s += sweepDeviceCurrents(sweep, d, b, t).phase_A[0].mag;
      return s;
    },
    { warmup: 1, runs: 3 },
  );
  const reads = buses * types.length * sweep.devices.length;
  figure("read device currents from the sweep", reads > 0 ? (readT.median_ms * 1e6) / reads : 0, "ns per device and fault", `${reads} reads`);
  figure("peak resident memory so far", peakRss_MB(), "MB");
}

// Against a plain dense mathjs solution of the same network: build Ybus densely, lusolve for one faulted bus.
for (const [label, make] of [
  ["radial, 100 buses", () => generateRadialNetwork({ buses: 100, devices: 100, seed: SEED })],
  ["meshed, 500 buses", () => generateMeshedNetwork({ buses: 500, devices: 500, seed: SEED })],
] as const) {
  section(`dense mathjs comparison, ${label}`);
  const project = make();
  const bus = `bus-${project.elements.filter((e) => e.kind === "bus").length - 1}`;
  const runs = label.startsWith("meshed") ? 1 : 3;
  if (runs === 1) console.log("      (the dense 500-bus solve takes tens of seconds: one run)");
  const dense = [];
  for (let i = 0; i < runs; i++) dense.push(denseThreePhaseFault(project, bus));
  dense.sort((a, b) => a.build_ms + a.solve_ms - (b.build_ms + b.solve_ms));
  const d = dense[Math.floor(dense.length / 2)];
  const fromScratch = timeMedian(() => solveFault(compile(project, "classic"), { kind: "bus", bus }, "3ph"), { warmup: 2, runs: 7 });
  const net = compile(project, "classic");
  const perFault = timeMedian(() => solveFault(net, { kind: "bus", bus }, "3ph"), { warmup: 3, runs: 15 });
  figure("dense: build Ybus", d.build_ms, "ms");
  figure("dense: lusolve for the faulted bus", d.solve_ms, "ms");
  figure("engine: compile and solve the same 3ph fault", fromScratch.median_ms, "ms");
  figure("engine: one more 3ph fault on the compiled network", perFault.median_ms, "ms", `dense needs a new lusolve: ratio ${(d.solve_ms / perFault.median_ms).toFixed(0)}x`);
  const ratio = (d.build_ms + d.solve_ms) / fromScratch.median_ms;
  if (label.startsWith("meshed")) target("speed-up over dense mathjs, 500 buses, from scratch", ratio, "x", "higher", 100);
  else figure("speed-up over dense mathjs, from scratch", ratio, "x");
  const eng = solveFault(net, { kind: "bus", bus }, "3ph").ikss_kA;
  figure("sanity: |engine classic - dense| / dense, 3ph I\"k", Math.abs(eng - d.ik_kA) / d.ik_kA, "", "dense leaves inverters out");
}

section("memory");
figure("heap in use at the end, over the start", heapUsed_MB() - heap0, "MB");
figure("peak resident memory", peakRss_MB(), "MB");
