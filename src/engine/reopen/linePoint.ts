// A fault point along a line of an opened network, on the same factorization: the point p joins the line's ends f
// and t through the line's two halves, and eliminating p gives back the network with the line whole (or without it
// when an end is open), so Z of the split network follows from Z of the unsplit one by bordering (see
// sequenceSystem.ts, applyBordered). solveFault then runs on the split model as it does after its own splitLine,
// without factorizing the split network.
import type { Cx, Model, Seq } from "../network/model.ts";
import type { FaultLocation, FaultOptions, FaultResult, FaultType, CompiledNetwork } from "../types.ts";
import { sequenceSystem, type SequenceSystem, type Variant } from "../network/sequenceSystem.ts";
import { createEngineCache } from "../network/engineCache.ts";
import { splitLine } from "../network/splitLine.ts";
import { unitColumns } from "../fault/compactFault.ts";
import { solveFault, type EngineInternal } from "../fault/solveFault.ts";
import type { ComplexVec } from "../fault/solveLinearFault.ts";
import { LazyMap } from "./lazyMap.ts";

const ZERO: Cx = { re: 0, im: 0 };

/** The split network's system: inner's nodes and the point p = inner.n joined by ya (to f) and yb (to t). */
export function borderedSystem(inner: SequenceSystem, f: number, t: number, ya: Cx, yb: Cx): SequenceSystem {
  const n = inner.n + 1;
  const p = inner.n;
  const comp = new Int32Array(n);
  comp.set(inner.comp);
  const floating = inner.floating.slice();
  const wre = new Float64Array(n);
  const wim = new Float64Array(n);
  wre.set(inner.wre);
  wim.set(inner.wim);
  const sr = ya.re + yb.re;
  const si = ya.im + yb.im;
  const s2 = sr * sr + si * si;
  if (s2 === 0) {
    // Both halves open: a part of its own, floating, its reference shunt at p itself.
    comp[p] = floating.length;
    floating.push(true);
    wre[p] = 1;
  } else {
    comp[p] = ya.re !== 0 || ya.im !== 0 ? comp[f] : comp[t];
    if (floating[comp[p]]) {
      // w_p = (ya w_f + yb w_t) / s
      const nr = ya.re * inner.wre[f] - ya.im * inner.wim[f] + (yb.re * inner.wre[t] - yb.im * inner.wim[t]);
      const ni = ya.re * inner.wim[f] + ya.im * inner.wre[f] + (yb.re * inner.wim[t] + yb.im * inner.wre[t]);
      wre[p] = (nr * sr + ni * si) / s2;
      wim[p] = (ni * sr - nr * si) / s2;
    }
  }
  return { seq: inner.seq, n, factor: inner.factor, comp, floating, wre, wim, border: { inner, f, t, ya, yb } };
}

/** A column of the unsplit network extended to p: (ya x_f + yb x_t) / s (zero for a point with both halves open). */
function extendColumn(col: ComplexVec, f: number, t: number, ya: Cx, yb: Cx): ComplexVec {
  const n = col.re.length;
  const re = new Float64Array(n + 1);
  const im = new Float64Array(n + 1);
  re.set(col.re);
  im.set(col.im);
  const sr = ya.re + yb.re;
  const si = ya.im + yb.im;
  const s2 = sr * sr + si * si;
  if (s2 > 0) {
    const nr = ya.re * col.re[f] - ya.im * col.im[f] + (yb.re * col.re[t] - yb.im * col.im[t]);
    const ni = ya.re * col.im[f] + ya.im * col.re[f] + (yb.re * col.im[t] + yb.im * col.re[t]);
    re[n] = (nr * sr + ni * si) / s2;
    im[n] = (ni * sr - nr * si) / s2;
  }
  return { re, im };
}

/**
 * A fault along a line of `network` (an opened network, or any compiled network) at 0 < pct < 100, solved on its
 * sequence systems without a factorization of the split network; the same result as solveFault, which factorizes
 * the split network. Other locations (and lines at a power station unit's node) go to solveFault as they are.
 */
export function solveLinePoint(network: CompiledNetwork, location: Extract<FaultLocation, { kind: "line" }>, type: FaultType, options: FaultOptions): FaultResult {
  const { model, cache } = network.internal as EngineInternal;
  const b = model.branches.find((x) => x.element === location.line && x.kind === "line");
  // A line at a power station unit's node is split in the unit's own variant (locateFault does that).
  const inUnit = b && (model.inUnit?.has(b.from) || model.inUnit?.has(b.to));
  if (!b || !b.line || inUnit || !(location.pct > 0 && location.pct < 100)) return solveFault(network, location, type, options);
  const split = splitLine(model, location.line, location.pct);
  if (!split) return solveFault(network, location, type, options);
  const halves = split.model.branches.filter((x) => x.element === location.line && x.kind === "line");
  const fromHalf = halves.find((x) => x.to === split.node);
  const toHalf = halves.find((x) => x.from === split.node);
  if (!fromHalf || !toHalf) return solveFault(network, location, type, options);
  const ya = (s: number) => fromHalf.y[s] ?? ZERO;
  const yb = (s: number) => toHalf.y[s] ?? ZERO;
  const splitCache = createEngineCache();
  splitCache.systems = new LazyMap((key) => {
    const [seq, variant] = key.split(":") as [string, Variant];
    const s = Number(seq) as Seq;
    return borderedSystem(sequenceSystem(model, cache, s, variant), b.from, b.to, ya(s), yb(s));
  }, /^[012]:(iec|refined)$/);
  splitCache.unitColumns = new LazyMap((key) => {
    const cols = unitColumns(model, cache, key.slice("units:".length) as Variant);
    return cols.map((list, s) => list.map((col) => extendColumn(col, b.from, b.to, ya(s), yb(s))));
  }, /^units:(iec|refined)$/);
  const at = { model: split.model as Model, cache: splitCache, k: split.node, label: `${b.label} at ${location.pct} %` };
  return solveFault(network, location, type, options, at);
}
