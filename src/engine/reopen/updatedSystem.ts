// One sequence network with element ends opened, as a low-rank update of the base network's factorization
// (see network/lowRankUpdate.ts): the matrix a fresh factorization of the opened network would factor,
// A' = A + E D E^T, where D holds what the opened ends remove (each branch's two-port change, each opened shunt's
// admittance) and the reference shunts that change: a part the openings leave without any shunt path (a dead
// section, a zero-sequence part whose earth was opened) gets its 1 pu reference at its first node, exactly as
// sequenceSystem gives it, so A' is regular whenever the fresh matrix is.
import type { BranchStamp, Cx, Model, Seq } from "../network/model.ts";
import { sequenceComponents, zColumn, type SequenceSystem, type Variant } from "../network/sequenceSystem.ts";
import { smallComplexInverse, type LowRankUpdate } from "../network/lowRankUpdate.ts";
import type { ComplexVec } from "../fault/solveLinearFault.ts";
import { EngineFailure } from "../engineFailure.ts";

const SEQUENCE_NAMES = ["zero", "positive", "negative"] as const;
/** max |D| max |Z_GG| beyond which solves on the update are refined (see LowRankUpdate.refineWith). */
const STIFF = 1e3;

/** Columns of the base Z' at nodes, per sequence system (a study reuses the same few device-end nodes). */
export type BaseColumns = (sys: SequenceSystem, node: number) => ComplexVec;

/** Per-sequence two-port [y11, y12, y22] of a branch (zero for a self-loop, whose stamps cancel). */
function twoPort(b: BranchStamp, s: Seq): [Cx, Cx, Cx] {
  const y11 = { re: 0, im: 0 };
  const y12 = { re: 0, im: 0 };
  const y22 = { re: 0, im: 0 };
  if (b.from === b.to) return [y11, y12, y22];
  const y = b.y[s];
  if (y) {
    const t = b.t;
    y11.re += y.re / (t * t);
    y11.im += y.im / (t * t);
    y12.re = -y.re / t;
    y12.im = -y.im / t;
    y22.re += y.re;
    y22.im += y.im;
  }
  if (s === 0 && b.y0From) {
    y11.re += b.y0From.re;
    y11.im += b.y0From.im;
  }
  if (s === 0 && b.y0To) {
    y22.re += b.y0To.re;
    y22.im += b.y0To.im;
  }
  return [y11, y12, y22];
}

/** First node of every floating part of a system (where its reference shunt sits). */
function referenceNodes(comp: Int32Array, floating: boolean[]): Set<number> {
  const seen = new Set<number>();
  const refs = new Set<number>();
  for (let i = 0; i < comp.length; i++) {
    const c = comp[i];
    if (seen.has(c)) continue;
    seen.add(c);
    if (floating[c]) refs.add(i);
  }
  return refs;
}

/** The change D on the nodes G, accumulated as a sparse symmetric map. */
class SmallDelta {
  readonly nodes: number[] = [];
  private readonly at = new Map<number, number>();
  readonly entries = new Map<string, Cx>();
  private index(node: number): number {
    let i = this.at.get(node);
    if (i === undefined) {
      i = this.nodes.length;
      this.nodes.push(node);
      this.at.set(node, i);
    }
    return i;
  }
  add(a: number, b: number, re: number, im: number): void {
    if (re === 0 && im === 0) return;
    const i = this.index(a);
    const j = this.index(b);
    for (const key of i === j ? [`${i},${i}`] : [`${i},${j}`, `${j},${i}`]) {
      const e = this.entries.get(key) ?? { re: 0, im: 0 };
      e.re += re;
      e.im += im;
      this.entries.set(key, e);
    }
  }
}

/**
 * The opened network's system for one sequence and variant, on the base system's factor: the same comp, floating
 * and w as a fresh factorization would give, and Z' by the update. Returns the base system itself when the openings
 * change nothing in this sequence. Throws an EngineFailure when the update is singular (the opened matrix is too).
 */
export function updatedSystem(base: Model, opened: Model, sys0: SequenceSystem, variant: Variant, columns: BaseColumns): SequenceSystem {
  const s = sys0.seq;
  const n = sys0.n;
  const delta = new SmallDelta();
  for (let i = 0; i < base.branches.length; i++) {
    const b0 = base.branches[i];
    const b1 = opened.branches[i];
    if (b0 === b1) continue;
    const p0 = twoPort(b0, s);
    const p1 = twoPort(b1, s);
    delta.add(b0.from, b0.from, p1[0].re - p0[0].re, p1[0].im - p0[0].im);
    delta.add(b0.to, b0.from, p1[1].re - p0[1].re, p1[1].im - p0[1].im);
    delta.add(b0.to, b0.to, p1[2].re - p0[2].re, p1[2].im - p0[2].im);
  }
  // Shunts: what the base has and the opened network has not (opened shunts keep no admittance).
  const kept = new Set(opened.shunts.filter((x) => !x.open).map((x) => x));
  for (const sh of base.shunts) {
    if (kept.has(sh) || (sh.refinedOnly && variant === "iec")) continue;
    const y = sh.y[s];
    if (y) delta.add(sh.node, sh.node, -y.re, -y.im);
  }
  const parts = sequenceComponents(opened, s, variant);
  const refs0 = referenceNodes(sys0.comp, sys0.floating);
  const refs1 = referenceNodes(parts.comp, parts.floating);
  for (const r of refs1) if (!refs0.has(r)) delta.add(r, r, 1, 0);
  for (const r of refs0) if (!refs1.has(r)) delta.add(r, r, -1, 0);
  if (![...delta.entries.values()].some((v) => v.re !== 0 || v.im !== 0)) return sys0;
  const m = delta.nodes.length;
  const D = new Float64Array(m * m * 2);
  for (const [key, v] of delta.entries) {
    const [a, b] = key.split(",").map(Number);
    D[(a * m + b) * 2] = v.re;
    D[(a * m + b) * 2 + 1] = v.im;
  }
  const wre = new Float64Array(m * n);
  const wim = new Float64Array(m * n);
  delta.nodes.forEach((node, h) => {
    const col = columns(sys0, node);
    wre.set(col.re, h * n);
    wim.set(col.im, h * n);
  });
  // K = I + D W_G, W_G[c][b] = Z[g_c, g_b]; H = K^-1 D.
  const K = new Float64Array(m * m * 2);
  for (let a = 0; a < m; a++)
    for (let b = 0; b < m; b++) {
      let kr = a === b ? 1 : 0;
      let ki = 0;
      for (let c = 0; c < m; c++) {
        const dr = D[(a * m + c) * 2];
        const di = D[(a * m + c) * 2 + 1];
        if (dr === 0 && di === 0) continue;
        const zr = wre[b * n + delta.nodes[c]];
        const zi = wim[b * n + delta.nodes[c]];
        kr += dr * zr - di * zi;
        ki += dr * zi + di * zr;
      }
      K[(a * m + b) * 2] = kr;
      K[(a * m + b) * 2 + 1] = ki;
    }
  const kInv = smallComplexInverse(K, m);
  if (!kInv || !kInv.every(Number.isFinite)) {
    // The opened network's matrix is singular too (det A' = det A det K): what a fresh factorization would meet.
    const buses = [...new Set(delta.nodes.flatMap((node) => base.nodes[node].buses))];
    const elements = [...new Set([...base.branches.filter((b, i) => b !== opened.branches[i]), ...base.shunts.filter((x) => !kept.has(x))].map((x) => x.element))];
    throw new EngineFailure(
      `The ${SEQUENCE_NAMES[s]}-sequence network with ends of ${elements.join(", ")} open could not be solved at bus ${buses.join(", ")}: its equations are singular or overflow in floating point`,
      buses,
      elements,
    );
  }
  const h = new Float64Array(m * m * 2);
  for (let a = 0; a < m; a++)
    for (let b = 0; b < m; b++) {
      let hr = 0;
      let hi = 0;
      for (let c = 0; c < m; c++) {
        const pr = kInv[(a * m + c) * 2];
        const pi = kInv[(a * m + c) * 2 + 1];
        const dr = D[(c * m + b) * 2];
        const di = D[(c * m + b) * 2 + 1];
        hr += pr * dr - pi * di;
        hi += pr * di + pi * dr;
      }
      h[(a * m + b) * 2] = hr;
      h[(a * m + b) * 2 + 1] = hi;
    }
  // Stiffness of what opened against the network around it: max |D| max |Z_GG|. Beyond STIFF the update's Z' is a
  // difference of nearly equal base columns, and each solve gets residual steps on the opened matrix.
  let dMax = 0;
  let zMax = 0;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) dMax = Math.max(dMax, Math.hypot(D[(a * m + b) * 2], D[(a * m + b) * 2 + 1]));
    zMax = Math.max(zMax, Math.hypot(wre[a * n + delta.nodes[a]], wim[a * n + delta.nodes[a]]));
  }
  const update: LowRankUpdate = { rank: m, nodes: Int32Array.from(delta.nodes), wre, wim, h, ...(dMax * zMax > STIFF ? { refineWith: D } : {}) };
  const sys: SequenceSystem = { seq: s, n, factor: sys0.factor, comp: parts.comp, floating: parts.floating, wre: sys0.wre.slice(), wim: sys0.wim.slice(), update };
  // w = Z'[:, ref] on every floating part the update touches; untouched parts are base parts, their w unchanged.
  const touched = new Set(delta.nodes.map((node) => parts.comp[node]));
  for (let i = 0; i < n; i++)
    if (touched.has(parts.comp[i])) {
      sys.wre[i] = 0;
      sys.wim[i] = 0;
    }
  for (const r of refs1) {
    const c = parts.comp[r];
    if (!touched.has(c)) continue;
    const col = zColumn(sys, r);
    for (let i = 0; i < n; i++)
      if (parts.comp[i] === c) {
        sys.wre[i] = col.re[i];
        sys.wim[i] = col.im[i];
      }
  }
  return sys;
}
