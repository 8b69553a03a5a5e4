// One factorised sequence network. A connected part with no shunt path in this sequence (an island of current
// sources only, a zero-sequence part behind deltas) is "floating": it gets a 1 pu reference shunt at its first node
// so the matrix is regular, and w = Z'[:, ref] is kept. Then Z' = G + w w^T, where G is the impedance matrix
// grounded at the reference node, and the exact floating limits follow from G and w (see solveLinearFault).
import type { Model, Seq } from "./model.ts";
import type { EngineCache } from "./engineCache.ts";
import { minimumDegree, type Ordering } from "../sparse/minimumDegree.ts";
import { factorLdlt, solveLdlt, SingularPivot, type LdltFactor, type SymmetricTriplets } from "../sparse/ldlt.ts";
import { EngineFailure } from "../engineFailure.ts";
import { applyLowRank, applyLowRankColumn, refineLowRank, type LowRankUpdate } from "./lowRankUpdate.ts";

export type Variant = "iec" | "refined";

export interface SequenceSystem {
  seq: Seq;
  n: number;
  factor: LdltFactor;
  /** Component index of each node in this sequence's graph. */
  comp: Int32Array;
  floating: boolean[];
  /** w = Z'[:, ref] of each floating component (zero elsewhere). */
  wre: Float64Array;
  wim: Float64Array;
  /** A low-rank change of the factored matrix (element ends opened, see src/engine/reopen): Z' = Z - W H W^T. */
  update?: LowRankUpdate;
  /**
   * A fault point p (the last node, n - 1) on a line between nodes f and t of `inner`, joined to them by the line's
   * halves ya and yb (zero when open); the other nodes are inner's, whose matrix already holds the line whole (or
   * not at all when it is open): eliminating p gives exactly that. See applyZ.
   */
  border?: { inner: SequenceSystem; f: number; t: number; ya: { re: number; im: number }; yb: { re: number; im: number } };
}

const SEQUENCE_NAMES = ["zero", "positive", "negative"] as const;

/** The factorisation, or an EngineFailure naming the buses at the failing node and the elements meeting there. */
function factorOrFail(a: SymmetricTriplets, model: Model, cache: EngineCache, seq: Seq): LdltFactor {
  try {
    return factorLdlt(a, modelOrdering(model, cache));
  } catch (err) {
    const node = err instanceof SingularPivot ? err.node : -1;
    const buses = node >= 0 ? model.nodes[node].buses : [];
    const elements = [...new Set([...model.branches.filter((b) => b.from === node || b.to === node), ...model.shunts.filter((x) => x.node === node)].map((x) => x.element))];
    const where = buses.length ? ` at bus ${buses.join(", ")}${elements.length ? ` (elements there: ${elements.join(", ")})` : ""}` : "";
    throw new EngineFailure(
      `The ${SEQUENCE_NAMES[seq]}-sequence network could not be solved${where}: its equations are singular or overflow in floating point; check the impedances and ratings of those elements and meta.baseMVA`,
      buses,
      elements,
    );
  }
}

function modelOrdering(model: Model, cache: EngineCache): Ordering {
  if (cache.ordering) return cache.ordering;
  const n = model.nodes.length;
  const nb: number[][] = Array.from({ length: n }, () => []);
  for (const b of model.branches) {
    nb[b.from].push(b.to);
    nb[b.to].push(b.from);
  }
  cache.ordering = minimumDegree(n, nb);
  return cache.ordering;
}

/**
 * Connected parts of one sequence's graph: each node's part, whether the part has no shunt path ("floating") and
 * its reference node (its first node), where a floating part gets its 1 pu reference shunt.
 */
export function sequenceComponents(model: Model, seq: Seq, variant: Variant): { comp: Int32Array; floating: boolean[]; refs: number[] } {
  const n = model.nodes.length;
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]];
      i = parent[i];
    }
    return i;
  };
  const hasShunt = new Uint8Array(n);
  for (const b of model.branches) {
    if (b.from === b.to) continue;
    if (b.y[seq]) {
      const ra = find(b.from);
      const rb = find(b.to);
      if (ra !== rb) parent[rb] = ra;
    }
    if (seq === 0 && b.y0From) hasShunt[b.from] = 1;
    if (seq === 0 && b.y0To) hasShunt[b.to] = 1;
  }
  for (const s of model.shunts) {
    if (s.refinedOnly && variant === "iec") continue;
    if (s.y[seq]) hasShunt[s.node] = 1;
  }
  const compOfRoot = new Map<number, number>();
  const comp = new Int32Array(n);
  const refs: number[] = [];
  for (let i = 0; i < n; i++) {
    const r = find(i);
    let c = compOfRoot.get(r);
    if (c === undefined) {
      c = refs.length;
      compOfRoot.set(r, c);
      refs.push(i);
    }
    comp[i] = c;
  }
  const compShunt = new Array<boolean>(refs.length).fill(false);
  for (let i = 0; i < n; i++) if (hasShunt[i]) compShunt[comp[i]] = true;
  return { comp, floating: compShunt.map((h) => !h), refs };
}

export function sequenceSystem(model: Model, cache: EngineCache, seq: Seq, variant: Variant): SequenceSystem {
  const key = `${seq}:${variant}`;
  const hit = cache.systems.get(key);
  if (hit) return hit;
  const n = model.nodes.length;
  const a: SymmetricTriplets = { n, row: [], col: [], re: [], im: [] };
  const put = (i: number, j: number, re: number, im: number) => {
    a.row.push(i);
    a.col.push(j);
    a.re.push(re);
    a.im.push(im);
  };
  for (const b of model.branches) {
    const y = b.y[seq];
    if (b.from === b.to) continue; // a self-loop's stamps cancel (t = 1 for lines)
    if (y) {
      const t = b.t;
      put(b.from, b.from, y.re / (t * t), y.im / (t * t));
      put(b.to, b.to, y.re, y.im);
      put(b.to, b.from, -y.re / t, -y.im / t);
    } else {
      put(b.to, b.from, 0, 0); // keep the symbolic pattern shared by all sequences
    }
    if (seq === 0 && b.y0From) put(b.from, b.from, b.y0From.re, b.y0From.im);
    if (seq === 0 && b.y0To) put(b.to, b.to, b.y0To.re, b.y0To.im);
  }
  for (const s of model.shunts) {
    if (s.refinedOnly && variant === "iec") continue;
    const y = s.y[seq];
    if (!y) continue;
    put(s.node, s.node, y.re, y.im);
  }
  const { comp, floating, refs } = sequenceComponents(model, seq, variant);
  for (let c = 0; c < refs.length; c++) if (floating[c]) put(refs[c], refs[c], 1, 0);
  const factor = factorOrFail(a, model, cache, seq);
  const wre = new Float64Array(n);
  const wim = new Float64Array(n);
  for (let c = 0; c < refs.length; c++) {
    if (!floating[c]) continue;
    const br = new Float64Array(n);
    const bi = new Float64Array(n);
    br[refs[c]] = 1;
    solveLdlt(factor, br, bi);
    for (let i = 0; i < n; i++) {
      if (comp[i] === c) {
        wre[i] = br[i];
        wim[i] = bi[i];
      }
    }
  }
  const sys: SequenceSystem = { seq, n, factor, comp, floating, wre, wim };
  cache.systems.set(key, sys);
  return sys;
}

/**
 * Z' b on a bordered system (see SequenceSystem.border): with s = ya + yb, the bordered matrix [[A_o, c], [c^T, s]],
 * c = -(ya e_f + yb e_t), has A_o - c c^T / s = A (inner's matrix), so
 *   x_o = Z (b_o + b_p (ya e_f + yb e_t) / s),   x_p = (b_p + ya x_f + yb x_t) / s;
 * a point with both halves open is a part of its own with its 1 pu reference shunt: x_p = b_p.
 */
function applyBordered(sys: SequenceSystem, bre: Float64Array, bim: Float64Array): { re: Float64Array; im: Float64Array } {
  const { inner, f, t, ya, yb } = sys.border!;
  const p = sys.n - 1;
  const sr = ya.re + yb.re;
  const si = ya.im + yb.im;
  const s2 = sr * sr + si * si;
  const br = bre.subarray(0, p).slice();
  const bi = bim.subarray(0, p).slice();
  const pr = bre[p];
  const pi = bim[p];
  if (s2 === 0) {
    const x = applyZ(inner, br, bi);
    const re = new Float64Array(sys.n);
    const im = new Float64Array(sys.n);
    re.set(x.re);
    im.set(x.im);
    re[p] = pr;
    im[p] = pi;
    return { re, im };
  }
  // q = b_p / s
  const qr = (pr * sr + pi * si) / s2;
  const qi = (pi * sr - pr * si) / s2;
  br[f] += ya.re * qr - ya.im * qi;
  bi[f] += ya.re * qi + ya.im * qr;
  br[t] += yb.re * qr - yb.im * qi;
  bi[t] += yb.re * qi + yb.im * qr;
  const x = applyZ(inner, br, bi);
  const re = new Float64Array(sys.n);
  const im = new Float64Array(sys.n);
  re.set(x.re);
  im.set(x.im);
  const nr = pr + (ya.re * x.re[f] - ya.im * x.im[f]) + (yb.re * x.re[t] - yb.im * x.im[t]);
  const ni = pi + (ya.re * x.im[f] + ya.im * x.re[f]) + (yb.re * x.im[t] + yb.im * x.re[t]);
  re[p] = (nr * sr + ni * si) / s2;
  im[p] = (ni * sr - nr * si) / s2;
  return { re, im };
}

/** One solve with the factor and the low-rank update, if any. */
function solveUpdated(sys: SequenceSystem, bre: Float64Array, bim: Float64Array): { re: Float64Array; im: Float64Array } {
  const re = bre.slice();
  const im = bim.slice();
  solveLdlt(sys.factor, re, im);
  if (sys.update) applyLowRank(sys.update, bre, bim, re, im);
  return { re, im };
}

/** Z' b for b given (returns new arrays). */
export function applyZ(sys: SequenceSystem, bre: Float64Array, bim: Float64Array): { re: Float64Array; im: Float64Array } {
  if (sys.border) return applyBordered(sys, bre, bim);
  const x = solveUpdated(sys, bre, bim);
  if (sys.update?.refineWith) refineLowRank(sys.update, sys.factor, bre, bim, x.re, x.im, (rr, ri) => solveUpdated(sys, rr, ri));
  return x;
}

/** Column k of Z'. */
export function zColumn(sys: SequenceSystem, k: number): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(sys.n);
  const im = new Float64Array(sys.n);
  re[k] = 1;
  if (sys.border) return applyBordered(sys, re, im);
  if (sys.update?.refineWith) return applyZ(sys, re, im);
  solveLdlt(sys.factor, re, im);
  if (sys.update) applyLowRankColumn(sys.update, k, re, im);
  return { re, im };
}
