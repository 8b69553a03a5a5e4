// The whole protection study, as a pipeline over each scenario:
//   1. zones and expected isolation (pipeline/scenarioPlan.ts): what should open for each fault, and the
//      backups when a breaker sticks;
//   2. simulated operation (pipeline/simulateScenario.ts): what does open, every case to its end;
//   3. judges (pipeline/caseRecord.ts, judges/): sensitivity, selectivity and sympathetic tripping, backup,
//      speed, each verdict with its numbers and one line;
//   4. blinding (pipeline/blindingPass.ts) and pickups against load;
//   5. the matrix and the clearing timelines of the cases that matter (pipeline/replayTimeline.ts).
// Pure and deterministic; progress, cancellation and yielding to the host are passed in.
import type { Project, Scenario } from "../model/schema.ts";
import type { DeviceModel } from "./deviceModel.ts";
import { locationKey } from "./keys.ts";
import { studyMatrix } from "./matrix.ts";
import { blindingPass, type BlindingCase } from "./pipeline/blindingPass.ts";
import { caseRecord, loadLostMemo } from "./pipeline/caseRecord.ts";
import { casesThatMatter, replayTimeline } from "./pipeline/replayTimeline.ts";
import { planScenario } from "./pipeline/scenarioPlan.ts";
import { simulateScenario, StudyCancelled } from "./pipeline/simulateScenario.ts";
import type { StudySolver } from "./studySolver.ts";
import { FAULT_TYPES, STUDY_CAUTION, type CaseResult, type ClearingTimeline, type FaultLimit, type FaultType, type StudyOptions, type StudyResult, type Verdict, type VerdictStatus } from "./types.ts";
import { verdictIdsDistinct } from "./verdictIds.ts";
import { loadVerdicts } from "./verdicts/loadVerdicts.ts";
import { judgeDuty } from "./judges/duty.ts";
import { memoWithstand } from "./withstand.ts";
import type { JudgeContext } from "./judges/judgedCase.ts";

export { StudyCancelled };

/** Most cases simulated in one part of a scenario (a limit with all its fault types, or one type when more). */
const PART_CASES = 40_000;

export interface StudyDeps {
  solver: StudySolver;
  model: DeviceModel;
}

export interface StudyHooks {
  onProgress?: (done: number, total: number, phase: "cases" | "verdicts" | "timelines") => void;
  /** Checked between cases; true stops the study with StudyCancelled. */
  isCancelled?: () => boolean;
  /** Lets the host breathe between batches of cases (a worker reads its messages here). */
  yieldNow?: () => Promise<void>;
  /**
   * Each part of a scenario (a limit, or a limit and fault type on a large network) with its cases and their
   * verdicts as soon as it is done, and last the scenario's own verdicts (duty, load): for writing them out while
   * the study goes on. With StudyOptions.keepResults false the result then holds no cases or verdicts of its own.
   */
  onScenario?: (part: { scenario: string; cases: CaseResult[]; verdicts: Verdict[]; warnings: string[] }) => void | Promise<void>;
}

/** Collects verdicts once each (a project whose ids can repeat keeps the first verdict under an id). */
class VerdictBook {
  readonly list: Verdict[] = [];
  private readonly byId: Map<string, Verdict> | null;
  constructor(distinct: boolean) {
    this.byId = distinct ? null : new Map();
  }
  add(vs: readonly Verdict[], counts?: Record<VerdictStatus, number>): void {
    for (const v of vs) {
      if (this.byId) {
        const known = this.byId.get(v.id);
        if (known) {
          if (counts) counts[known.status]++;
          continue;
        }
        this.byId.set(v.id, v);
      }
      this.list.push(v);
      if (counts) counts[v.status]++;
    }
  }
}

export async function runStudy(project: Project, deps: StudyDeps, options: StudyOptions = {}, hooks: StudyHooks = {}): Promise<StudyResult> {
  const { solver, model } = deps;
  const warnings: string[] = [];
  const warn = (m: string) => {
    if (!warnings.includes(m)) warnings.push(m);
  };
  const cases: CaseResult[] = [];
  const caseCounts: Record<VerdictStatus, number>[] = [];
  const timelines: ClearingTimeline[] = [];
  const scenarios = project.scenarios.filter((s) => !options.scenarios || options.scenarios.includes(s.id));
  if (options.scenarios) for (const id of options.scenarios) if (!project.scenarios.some((s) => s.id === id)) warn(`Scenario ${id}: not found in the project`);
  const types: FaultType[] = options.faultTypes ?? [...FAULT_TYPES];
  const limitsOf = (s: Scenario): FaultLimit[] => s.limits.filter((l) => !options.limits || options.limits.includes(l));
  const book = new VerdictBook(verdictIdsDistinct(project, scenarios, types, limitsOf));
  const elements = new Map(project.elements.map((e) => [e.id, e] as const));
  const withstand = memoWithstand();
  const only = options.locationKeys ? new Set(options.locationKeys) : null;

  const plans = scenarios.map((s) => {
    const sp = planScenario(project, s, types, options);
    if (only) {
      const keep = sp.locations.map((l, i) => (only.has(locationKey(l)) ? i : -1)).filter((i) => i >= 0);
      sp.locations = keep.map((i) => sp.locations[i]);
      sp.nodes = keep.map((i) => sp.nodes[i]);
      for (const [t, list] of sp.plans)
        sp.plans.set(
          t,
          keep.map((i) => list[i]),
        );
    }
    return sp;
  });
  const total = plans.reduce((n, sp) => n + sp.locations.length * limitsOf(sp.scenario).length * types.length, 0);
  let done = 0;

  const keep = options.keepResults !== false;
  let warned = 0;
  for (const sp of plans) {
    const { scenario, net } = sp;
    for (const d of net.idleDevices) {
      const dev = net.devices.get(d);
      if (dev && !scenario.outOfService.includes(d) && !scenario.outOfService.includes(dev.at.element) && elements.get(dev.at.element) === undefined)
        warn(`${d}: located at ${dev.at.element} (${dev.at.end}), which is not in the project`);
    }
    const ctx: JudgeContext = {
      net,
      isolation: sp.isolation,
      model,
      criteria: project.criteria,
      elements,
      devices: net.devices,
      sides: sp.sides,
    };
    const loadLost = loadLostMemo(net);
    const limits = limitsOf(scenario);
    const sensLimit: FaultLimit = limits.includes("min") ? "min" : "max";
    const wanted = new Set(options.timelineCases ?? []);
    /** The cases that may get a timeline, kept across the scenario's parts (casesThatMatter is associative over parts). */
    let candidates: { result: CaseResult; index: number }[] = [];
    // A scenario is worked through in parts (a limit, and all its fault types unless they are too many cases for one
    // part); each part's cases and verdicts are handed out, and dropped when the caller keeps none.
    const groups = sp.locations.length * types.length <= PART_CASES ? [types] : types.map((t) => [t]);
    const emit = async (firstCase: number, firstVerdict: number) => {
      if (hooks.onScenario) {
        await hooks.onScenario({ scenario: scenario.id, cases: cases.slice(firstCase), verdicts: book.list.slice(firstVerdict), warnings: warnings.slice(warned) });
        warned = warnings.length;
      }
      if (!keep) {
        cases.length = firstCase;
        caseCounts.length = firstCase;
        book.list.length = firstVerdict;
      }
    };
    for (const limit of limits)
      for (const group of groups) {
        const firstCase = cases.length;
        const firstVerdict = book.list.length;
        const simulated = await simulateScenario({
          project,
          sp,
          types: group,
          limit,
          solver,
          model,
          withstand,
          elements,
          isCancelled: hooks.isCancelled,
          yieldNow: hooks.yieldNow,
          onCase: async () => {
            done++;
            if (done % 64 === 0) {
              hooks.onProgress?.(done, total, "cases");
              await hooks.yieldNow?.();
            }
          },
        });
        const partResults: { result: CaseResult; index: number }[] = [];
        const countsOf = new Map<string, Record<VerdictStatus, number>>();
        const blindingCases: BlindingCase[] = [];
        for (const c of simulated) {
          for (const m of c.messages) warn(m);
          if (c.unsolved !== undefined) warn(`${c.fc.label}: not solved (${c.unsolved}); the case has no current and no verdict`);
          const { result, verdicts } = caseRecord(ctx, c, limit === sensLimit, loadLost);
          const counts = { pass: 0, warn: 0, fail: 0 };
          book.add(verdicts, counts);
          cases.push(result);
          caseCounts.push(counts);
          countsOf.set(result.faultCase.id, counts);
          partResults.push({ result, index: c.index });
          if (limit === sensLimit && c.iFault_A >= 1 && c.unsolved === undefined) blindingCases.push({ fc: c.fc, locIndex: c.index, responses: c.responses, plan: c.lp.plan, failures: c.lp.failures });
        }
        simulated.length = 0;
        if (hooks.isCancelled?.()) throw new StudyCancelled();
        // blinding of this part's cases at the scenario's sensitivity limit
        if (blindingCases.length) {
          const blinding = await blindingPass({ scenario, net, zones: sp.isolation.zones, cases: blindingCases, types: group, limit: sensLimit, solver, model, criteria: project.criteria, locations: sp.locations, yieldNow: hooks.yieldNow });
          const byCase = new Map(partResults.map((r) => [r.result.faultCase.id, r.result] as const));
          for (const [id, vs] of blinding) {
            book.add(vs, countsOf.get(id));
            byCase.get(id)!.verdictIds.push(...vs.map((v) => v.id));
          }
        }
        const pool = [...candidates, ...partResults];
        const kept = new Set(casesThatMatter(pool.map((x) => x.result)));
        pool.forEach((x, k) => {
          if (wanted.has(x.result.faultCase.id)) kept.add(k);
        });
        candidates = [...kept].sort((x, y) => x - y).map((k) => pool[k]);
        await emit(firstCase, firstVerdict);
      }
    hooks.onProgress?.(done, total, "verdicts");
    const scenarioVerdicts = book.list.length;
    const duty = judgeDuty(scenario, net.devices, elements, solver);
    book.add(duty.verdicts);
    for (const w of duty.warnings) warn(w);
    const load = solver.loadCurrents(scenario);
    if (load) book.add(loadVerdicts(scenario, load, net.devices, model, project.criteria));
    else warn(`Scenario ${scenario.id} "${scenario.name}": no load flow, pickups were not checked against load current`);

    // clearing timelines: the cases that matter, plus the ones asked for
    const chosen = new Set(casesThatMatter(candidates.map((x) => x.result)));
    candidates.forEach((x, k) => {
      if (wanted.has(x.result.faultCase.id)) chosen.add(k);
    });
    for (const k of [...chosen].sort((a, b) => a - b)) {
      if (hooks.isCancelled?.()) throw new StudyCancelled();
      timelines.push(replayTimeline({ project, sp, index: candidates[k].index, result: candidates[k].result, solver, model, withstand }));
      hooks.onProgress?.(done, total, "timelines");
      await hooks.yieldNow?.();
    }
    await emit(cases.length, scenarioVerdicts);
  }
  hooks.onProgress?.(total, total, "verdicts");
  return {
    project: project.meta.name,
    cases,
    verdicts: book.list,
    matrix: studyMatrix(scenarios, cases, book.list, elements, { caseCounts }),
    timelines,
    warnings,
    caution: STUDY_CAUTION,
  };
}
