// Re-solving faults after protective devices opened element ends, without refactorizing: the opened network's
// model is built by the same stamps as a fresh compile (network/openEnds.ts), and its sequence systems are the
// base factorization plus a low-rank update (updatedSystem.ts). solveFault then runs on it unchanged, so a re-solve
// gives what solveFault gives on compileNetwork(project, { ...options, openEnds }). Opened sets are cached: a study
// re-solves many faults with the same few opened ends.
// What the update does not cover goes to that fresh compile, with the reason in the result's messages:
// a switch opened that joins its buses into one node (opening it splits a node; a protected breaker is a branch and
// opens on the update) and a fault at a power station unit's LV node (solved on the unit's own variant model).
import type { Project } from "../../model/schema.ts";
import type { CompileOptions, CompiledNetwork, EngineMessage, FaultLocation, FaultOptions, FaultResult, FaultType, NetworkNode } from "../types.ts";
import type { Model, Seq } from "../network/model.ts";
import { compileNetwork } from "../network/compileNetwork.ts";
import { createEngineCache, type EngineCache } from "../network/engineCache.ts";
import { assignIslands } from "../network/assignIslands.ts";
import { openEndError, openSetKey, openStamps, type OpenEnd } from "../network/openEnds.ts";
import { sequenceSystem, zColumn, type SequenceSystem, type Variant } from "../network/sequenceSystem.ts";
import { solveFault, type EngineInternal } from "../fault/solveFault.ts";
import type { ComplexVec } from "../fault/solveLinearFault.ts";
import { updatedSystem } from "./updatedSystem.ts";
import { LazyMap } from "./lazyMap.ts";
import { solveLinePoint } from "./linePoint.ts";
import { unitColumns } from "../fault/compactFault.ts";
import { applyLowRankColumn } from "../network/lowRankUpdate.ts";

export type { OpenEnd };

/** Everything the re-solves of one base network share. Create once per (project, scenario, limit, method). */
export interface ReopenContext {
  readonly project: Project;
  readonly options: CompileOptions;
  readonly base: CompiledNetwork;
  /** Opened sets kept, by openSetKey, least recently used first (at most `maxSets`). */
  readonly sets: Map<string, ReopenedSet>;
  readonly maxSets: number;
  /** Base Z' columns at nodes, by "system index:node", least recently used first (at most `maxColumns`). */
  readonly columns: Map<string, ComplexVec>;
  readonly maxColumns: number;
  /** How many faults the update answered (fast) and how many a fresh compile (reference), with the reasons. */
  readonly stats: { fast: number; reference: number; reasons: Record<string, number> };
}

/** One opened set: the updated network (null when the set needs a fresh compile), and that compile once made. */
export interface ReopenedSet {
  readonly key: string;
  readonly ends: OpenEnd[];
  /** The opened network on the base factorization (solveFault works on it), or null. */
  readonly network: CompiledNetwork | null;
  /** Why the whole set goes to the fresh compile (null when it does not). */
  readonly fallback: string | null;
  reference: CompiledNetwork | null;
}

/** Memory the cached base columns may take (each is 16 bytes per node). */
const COLUMN_BUDGET_BYTES = 256 * 2 ** 20;
/** Opened sets kept at once (each holds its updated systems: a few columns and a copy of w per sequence). */
const MAX_SETS = 256;

/**
 * A context for re-solves of `base`, which must be compileNetwork(project, options) (without openEnds). The caches
 * are bounded (least recently used go first): `limits` overrides how many opened sets and base columns are kept.
 */
export function createReopenContext(project: Project, options: CompileOptions, base?: CompiledNetwork, limits: { maxSets?: number; maxColumns?: number } = {}): ReopenContext {
  let net = base;
  if (!net) {
    const r = compileNetwork(project, { ...options, openEnds: undefined });
    if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
    net = r.network;
  }
  const n = Math.max(1, net.nodes.length);
  const maxColumns = limits.maxColumns ?? Math.max(64, Math.floor(COLUMN_BUDGET_BYTES / (16 * n)));
  return { project, options: { ...options, openEnds: undefined }, base: net, sets: new Map(), maxSets: limits.maxSets ?? MAX_SETS, columns: new Map(), maxColumns, stats: { fast: 0, reference: 0, reasons: {} } };
}

/** Marks a cache entry as just used (a Map keeps insertion order), and drops the oldest beyond `max`. */
function touch<V>(map: Map<string, V>, key: string, value: V, max: number): V {
  map.delete(key);
  map.set(key, value);
  while (map.size > max) map.delete(map.keys().next().value as string);
  return value;
}

/** The base column Z'[:, node] of a base system, cached. */
function baseColumn(ctx: ReopenContext, sys: SequenceSystem, node: number): ComplexVec {
  const key = `${systemIds.get(sys) ?? registerSystem(sys)}:${node}`;
  return touch(ctx.columns, key, ctx.columns.get(key) ?? zColumn(sys, node), ctx.maxColumns);
}

/** A number per base sequence system, for the column keys (systems are never copied). */
const systemIds = new WeakMap<SequenceSystem, number>();
let nextSystemId = 1;
function registerSystem(sys: SequenceSystem): number {
  const id = nextSystemId++;
  systemIds.set(sys, id);
  return id;
}

/** The fresh compile of an opened set (the reference path), cached with the set. */
export function referenceNetwork(ctx: ReopenContext, set: ReopenedSet): CompiledNetwork {
  if (!set.reference) {
    const r = compileNetwork(ctx.project, { ...ctx.options, openEnds: set.ends });
    if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
    set.reference = r.network;
  }
  return set.reference;
}

/** Elements by id, per project (a study opens hundreds of sets on one project). */
const elementIndex = new WeakMap<Project, Map<string, Project["elements"][number]>>();

/** The opened set for these ends, built (or found) once. Throws on an end that does not fit its element. */
export function reopenedSet(ctx: ReopenContext, ends: readonly OpenEnd[]): ReopenedSet {
  const key = openSetKey(ends);
  const hit = ctx.sets.get(key);
  if (hit) return touch(ctx.sets, key, hit, ctx.maxSets);
  const list = [...new Map(ends.map((e) => [`${e.element}|${e.end}`, { element: e.element, end: e.end }])).values()];
  let byId = elementIndex.get(ctx.project);
  if (!byId) {
    byId = new Map(ctx.project.elements.map((e) => [e.id, e]));
    elementIndex.set(ctx.project, byId);
  }
  for (const e of list) {
    const el = byId.get(e.element);
    const bad = el ? openEndError(el, e.end) : `Opened end ${e.element} (${e.end}): unknown element`;
    if (bad) throw new Error(bad);
  }
  // A switch that joins its buses into one node cannot open on the base factorization; a protected breaker is a
  // branch of its own (compileNetwork) and opens like any branch end.
  const { model: baseModel } = ctx.base.internal as EngineInternal;
  const switches = list.filter((e) => byId.get(e.element)?.kind === "switch" && !baseModel.branches.some((b) => b.element === e.element));
  let set: ReopenedSet;
  if (switches.length > 0) {
    set = { key, ends: list, network: null, fallback: `switch ${switches[0].element} opened (a switch without a protective device joins its buses into one node)`, reference: null };
  } else {
    set = { key, ends: list, network: openedNetwork(ctx, list), fallback: null, reference: null };
  }
  return touch(ctx.sets, key, set, ctx.maxSets);
}

/** The opened model on the base model's nodes, and its systems on the base factorization. */
function openedNetwork(ctx: ReopenContext, ends: OpenEnd[]): CompiledNetwork {
  const { model: base, cache: baseCache } = ctx.base.internal as EngineInternal;
  const nodes = base.nodes.map((n) => ({ ...n }));
  const model: Model = { ...base, ...openStamps(base, ends), nodes, islandLive: [], inUnit: undefined };
  // Opening only removes connections, so no loop of unequal phase shifts can appear.
  assignIslands(model);
  const cache: EngineCache = createEngineCache();
  cache.ordering = baseCache.ordering;
  // Each sequence system on first use (a study using the IEC converter model never needs the refined variant):
  // sequenceSystem finds it in the cache, so nothing is ever factorized for the opened network.
  cache.systems = new LazyMap((key) => {
    const [seq, variant] = key.split(":") as [string, Variant];
    const sys0 = sequenceSystem(base, baseCache, Number(seq) as Seq, variant);
    return updatedSystem(base, model, sys0, variant, (sys, node) => baseColumn(ctx, sys, node));
  }, /^[012]:(iec|refined)$/);
  // Columns at the converters' nodes: the base network's (kept with it), corrected by each sequence's update.
  cache.unitColumns = new LazyMap((key) => {
    const variant = key.slice("units:".length) as Variant;
    const baseCols = unitColumns(base, baseCache, variant);
    const cols: ComplexVec[][] = [[], [], []];
    for (const s of [1, 2] as const) {
      const sys = sequenceSystem(model, cache, s, variant);
      for (const u of model.inverters) {
        // A stiff update's columns are solved with their residual steps (see LowRankUpdate.refineWith).
        if (sys.update?.refineWith) {
          cols[s].push(zColumn(sys, u.node));
          continue;
        }
        const j = base.inverters.findIndex((x) => x.element === u.element);
        const col = { re: baseCols[s][j].re.slice(), im: baseCols[s][j].im.slice() };
        if (sys.update) applyLowRankColumn(sys.update, u.node, col.re, col.im);
        cols[s].push(col);
      }
    }
    return cols;
  }, /^units:(iec|refined)$/);
  const messages: EngineMessage[] = [];
  for (let i = 0; i < model.islandLive.length; i++) {
    if (model.islandLive[i]) continue;
    const bs = nodes.filter((n) => n.island === i).flatMap((n) => n.buses);
    messages.push({ level: "warning", code: "dead-island", text: `Buses ${bs.join(", ")} have no source in this scenario: fault currents there are zero` });
  }
  const publicNodes: NetworkNode[] = nodes.map((n, index) => ({ index, buses: n.buses, un_kV: n.un_kV, shift_deg: n.shift_deg, island: n.island }));
  const internal: EngineInternal = { model, cache };
  return { scenario: ctx.base.scenario, options: ctx.base.options, nodes: publicNodes, busNode: ctx.base.busNode, messages, internal };
}

/** Why a fault of an updated set still needs the fresh compile (null: the update answers it). */
export function faultFallback(ctx: ReopenContext, location: FaultLocation): string | null {
  const { model } = ctx.base.internal as EngineInternal;
  if (!model.inUnit) return null;
  if (location.kind === "bus") {
    const k = model.busNode.get(location.bus);
    return k !== undefined && model.inUnit.has(k) ? `fault at bus ${location.bus}, inside a power station unit (the unit's own corrections)` : null;
  }
  const b = model.branches.find((x) => x.element === location.line);
  return b && (model.inUnit.has(b.from) || model.inUnit.has(b.to)) ? `fault along line ${location.line}, at a power station unit's node (the unit's own corrections)` : null;
}

function countPath(ctx: ReopenContext, reason: string | null): void {
  if (reason === null) ctx.stats.fast++;
  else {
    ctx.stats.reference++;
    ctx.stats.reasons[reason] = (ctx.stats.reasons[reason] ?? 0) + 1;
  }
}

/**
 * One fault with the given ends open: the FaultResult solveFault gives on the fresh compile with those ends open,
 * from the base factorization. A fault point along a line is placed on it by bordering (linePoint.ts).
 */
export function solveReopened(ctx: ReopenContext, ends: readonly OpenEnd[], location: FaultLocation, type: FaultType, options: FaultOptions = {}): FaultResult {
  const set = reopenedSet(ctx, ends);
  const reason = set.fallback ?? faultFallback(ctx, location);
  countPath(ctx, reason);
  if (reason === null && set.network) return location.kind === "line" ? solveLinePoint(set.network, location, type, options) : solveFault(set.network, location, type, options);
  const r = solveFault(referenceNetwork(ctx, set), location, type, options);
  r.messages.push({ level: "info", code: "reopen-fresh-compile", text: `Re-solved by a fresh compile of the network: ${reason}` });
  return r;
}
