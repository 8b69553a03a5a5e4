// The data behind `islet study`: every bus's I"k for the four fault types, ip and X/R, per scenario and limit.
// Pure: the CLI command does the file and console work. The JSON shape is documented in README.md.
import type { Project } from "../../model/schema.ts";
import { FAULT_TYPES, CAUTION, type CompileOptions, type CompileResult, type CompiledNetwork, type EngineMessage, type Limit, type ResolvedOptions, type FaultType, type SweepOptions, type SweepResult } from "../types.ts";
import { compileNetwork } from "../network/compileNetwork.ts";
import { sweepFaults } from "../fault/sweepFaults.ts";
import { EngineFailure, NOT_SOLVED, failureMessage } from "../engineFailure.ts";

export interface BusFaultRow {
  bus: string;
  un_kV: number;
  ikss_kA: Record<FaultType, number>;
  ip_kA: number;
  xr: number;
}

export interface BusFaultRun {
  scenario: string;
  scenarioName: string;
  limit: Limit;
  ok: boolean;
  options: ResolvedOptions | null;
  buses: BusFaultRow[];
  messages: EngineMessage[];
}

export interface BusFaultTable {
  caution: string;
  runs: BusFaultRun[];
}

/** One (scenario, limit) pair of the table and how to build its network. */
export interface BusFaultTask {
  scenarioId: string | undefined;
  scenarioName: string;
  limit: Limit;
  compile: CompileOptions;
}

/** The (scenario, limit) pairs: every scenario's, or the one scenario asked for. Throws only on an unknown scenario id. */
export function busFaultTasks(project: Project, scenarioId?: string): BusFaultTask[] {
  const scenarios = scenarioId !== undefined ? project.scenarios.filter((s) => s.id === scenarioId) : project.scenarios;
  if (scenarioId !== undefined && scenarios.length === 0) throw new Error(`scenario "${scenarioId}" not found; the project has: ${project.scenarios.map((s) => s.id).join(", ") || "none"}`);
  const plan: { id: string | undefined; name: string; limits: Limit[] }[] = scenarios.length
    ? scenarios.map((s) => ({ id: s.id, name: s.name, limits: s.limits }))
    : [{ id: undefined, name: "(as drawn)", limits: ["max", "min"] }];
  return plan.flatMap((sc) => sc.limits.map((limit) => ({ scenarioId: sc.id, scenarioName: sc.name, limit, compile: { scenario: sc.id, limit } })));
}

/** The sweep options of the table: the four fault types, no device currents. */
export const BUS_TABLE_SWEEP: SweepOptions = { types: [...FAULT_TYPES], devices: [] };

/** One run of the table from its task, its network (or why it could not be built) and then its sweep (BUS_TABLE_SWEEP). */
export function busFaultRun(project: Project, task: BusFaultTask, c: CompileResult, sw: SweepResult | null): BusFaultRun {
  if (!c.ok || !sw) return { scenario: task.scenarioId ?? "", scenarioName: task.scenarioName, limit: task.limit, ok: false, options: null, buses: [], messages: c.ok ? [] : c.errors };
  const unOf = new Map(project.elements.filter((e) => e.kind === "bus").map((e) => [e.id, (e as { un_kV: number }).un_kV]));
  const T = sw.types.length;
  const buses: BusFaultRow[] = sw.busIds.map((bus, b) => {
    const ikss = {} as Record<FaultType, number>;
    sw.types.forEach((t, ti) => (ikss[t] = sw.ikss_kA[b * T + ti]));
    return { bus, un_kV: unOf.get(bus) ?? 0, ikss_kA: ikss, ip_kA: sw.ip_kA[b], xr: sw.xr[b] };
  });
  // A figure the engine could not compute stays NaN (null in JSON, "-" in the table), and the run says which buses.
  const unsolved = buses.filter((r) => ![...Object.values(r.ikss_kA), r.ip_kA, r.xr].every(Number.isFinite)).map((r) => r.bus);
  const failed: EngineMessage[] = unsolved.length
    ? [{ level: "error", code: NOT_SOLVED, text: `Buses ${unsolved.join(", ")}: the engine could not compute their fault currents (the result is not a finite number); check the impedances and ratings around them and meta.baseMVA`, element: unsolved[0] }]
    : [];
  return { scenario: c.network.scenario, scenarioName: task.scenarioName, limit: task.limit, ok: failed.length === 0, options: sw.options, buses, messages: [...failed, ...c.network.messages, ...sw.messages] };
}

/** The run of a network the solvers could not solve: no figures, the failure naming the buses and elements. */
function unsolvedRun(task: BusFaultTask, c: CompileResult, err: EngineFailure): BusFaultRun {
  const scenario = c.ok ? c.network.scenario : (task.scenarioId ?? "");
  return { scenario, scenarioName: task.scenarioName, limit: task.limit, ok: false, options: null, buses: [], messages: [failureMessage(err)] };
}

/** Runs every (scenario, limit) pair, or the one scenario asked for. Throws only on an unknown scenario id. */
export function busFaultTable(project: Project, scenarioId?: string): BusFaultTable {
  // One network at a time: built, swept, reduced to its rows, let go.
  const runs = busFaultTasks(project, scenarioId).map((task) => {
    const c = compileNetwork(project, task.compile);
    try {
      return busFaultRun(project, task, c, c.ok ? sweepFaults(c.network, BUS_TABLE_SWEEP) : null);
    } catch (err) {
      if (err instanceof EngineFailure) return unsolvedRun(task, c, err);
      throw err;
    }
  });
  return { caution: CAUTION, runs };
}

/** The same table with the sweeps done by `sweep` (for example shared among threads, see SweepPool in src/cli). */
export async function busFaultTableWith(project: Project, scenarioId: string | undefined, sweep: (task: BusFaultTask, network: CompiledNetwork) => Promise<SweepResult>): Promise<BusFaultTable> {
  const runs: BusFaultRun[] = [];
  for (const task of busFaultTasks(project, scenarioId)) {
    const c = compileNetwork(project, task.compile);
    try {
      runs.push(busFaultRun(project, task, c, c.ok ? await sweep(task, c.network) : null));
    } catch (err) {
      if (!(err instanceof EngineFailure)) throw err;
      runs.push(unsolvedRun(task, c, err));
    }
  }
  return { caution: CAUTION, runs };
}

/** Human-readable table. */
export function formatBusFaultTable(report: BusFaultTable): string {
  const lines: string[] = [];
  const num = (x: number, w: number, d = 3) => (Number.isFinite(x) ? x.toFixed(d) : "-").padStart(w);
  for (const r of report.runs) {
    lines.push(`Scenario ${r.scenario || "(as drawn)"} "${r.scenarioName}", ${r.limit} (${r.options ? `${r.options.method}, inverters: ${r.options.inverterModel}` : "not computed"})`);
    if (!r.ok) {
      for (const m of r.messages) lines.push(`  error: ${m.text}`);
      lines.push("");
      continue;
    }
    lines.push(`  ${"bus".padEnd(16)} ${"Un kV".padStart(7)} ${"3ph kA".padStart(9)} ${"LL kA".padStart(9)} ${"LG kA".padStart(9)} ${"LLG kA".padStart(10)} ${"ip kA".padStart(9)} ${"X/R".padStart(7)}`);
    for (const b of r.buses) {
      lines.push(`  ${b.bus.padEnd(16)} ${num(b.un_kV, 7, 2)} ${num(b.ikss_kA["3ph"], 9)} ${num(b.ikss_kA.LL, 9)} ${num(b.ikss_kA.LG, 9)} ${num(b.ikss_kA.LLG, 10)} ${num(b.ip_kA, 9)} ${num(b.xr >= 1e9 ? Infinity : b.xr, 7, 2)}`);
    }
    for (const m of r.messages) lines.push(`  ${m.level}: ${m.text}`);
    lines.push("");
  }
  lines.push('Initial symmetrical short-circuit current I"k: 3ph symmetrical, LL line current, LG and LLG earth current 3I0; ip peak (3ph).');
  lines.push(report.caution);
  return lines.join("\n");
}
