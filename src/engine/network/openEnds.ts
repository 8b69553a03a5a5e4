// Element ends opened by protective devices: a device at { element, end } interrupts the current at that end only.
// A branch is a two-port with per-sequence nodal admittance [[y11, y12], [y21, y22]]; with port 1 open (I1 = 0) port 2
// keeps y22 - y21 y12 / y11 (Schur complement): nothing for a series impedance, the star-point earth for a
// transformer whose zero-sequence path is an earthed star opposite a delta (a Dyn opened at its HV end keeps its LV
// earth; opened at its LV end the earth goes). Opening a shunt terminal removes the element, its admittance and,
// for a converter, its injection. Shared by the fresh compile (compileNetwork's openEnds) and the low-rank re-solve
// (src/engine/reopen), so both solve the same network.
import type { BranchStamp, Cx, InverterUnit, Model, ShuntStamp } from "./model.ts";
import { elementLabel } from "../../model/elementLabel.ts";

/** One opened element end (a protective device's `at`). */
export interface OpenEnd {
  element: string;
  end: "from" | "to" | "terminal";
}

/** Canonical key of a set of opened ends (order and duplicates do not matter). */
export function openSetKey(ends: readonly OpenEnd[]): string {
  return [...new Set(ends.map((e) => `${e.element}|${e.end}`))].sort().join(";");
}

/** Element kinds whose ends are "from"/"to", and those with a "terminal". */
const BRANCH_KINDS = new Set(["line", "transformer", "switch"]);
const SHUNT_KINDS = new Set(["grid", "generator", "inverter", "motor", "load"]);

/** Why an end does not fit an element of this kind (null when it does), naming the element and the field. */
export function openEndError(element: { id: string; kind: string; name?: string }, end: string): string | null {
  const who = elementLabel(element);
  if (BRANCH_KINDS.has(element.kind)) return end === "from" || end === "to" ? null : `Opened end of ${who}: end must be "from" or "to" for a ${element.kind} (got "${end}")`;
  if (SHUNT_KINDS.has(element.kind)) return end === "terminal" ? null : `Opened end of ${who}: end must be "terminal" for a ${element.kind} (got "${end}")`;
  return `Opened end of ${who}: a ${element.kind} has no end a protective device can open`;
}

const ZERO: Cx = { re: 0, im: 0 };
const isZero = (a: Cx | null): boolean => !a || (a.re === 0 && a.im === 0);
const mul = (a: Cx, b: Cx): Cx => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
const div = (a: Cx, b: Cx): Cx => {
  const m = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / m, im: (a.im * b.re - a.re * b.im) / m };
};

/**
 * The admittance the remaining port keeps when the other port of a branch opens, in sequence s. Series-only paths
 * give exactly zero (not a rounded difference), so a fresh factorization and a low-rank update see the same matrix.
 */
function remaining(b: BranchStamp, s: number, keep: "from" | "to"): Cx | null {
  const y = b.y[s];
  const own = s === 0 ? (keep === "from" ? b.y0From : b.y0To) : null;
  const other = s === 0 ? (keep === "from" ? b.y0To : b.y0From) : null;
  if (!y || isZero(other)) return isZero(own) ? null : own;
  // Both a series path and a shunt at the opened side (no stamp builds this today): y22 - y12^2 / y11.
  const t = b.t;
  const yOwn: Cx = keep === "from" ? { re: y.re / (t * t), im: y.im / (t * t) } : y;
  const yOther: Cx = keep === "from" ? y : { re: y.re / (t * t), im: y.im / (t * t) };
  const y11 = { re: yOther.re + (other as Cx).re, im: yOther.im + (other as Cx).im };
  const y12 = { re: -y.re / t, im: -y.im / t };
  const r = div(mul(y12, y12), y11);
  const base = own ?? ZERO;
  return { re: yOwn.re + base.re - r.re, im: yOwn.im + base.im - r.im };
}

/** A branch with the given ends open: no series path, only what each closed end keeps as its own shunt. */
export function openedBranch(b: BranchStamp, ends: readonly ("from" | "to")[]): BranchStamp {
  const fromOpen = ends.includes("from");
  const toOpen = ends.includes("to");
  return {
    ...b,
    y: [null, null, null],
    y0From: fromOpen ? null : remaining(b, 0, "from"),
    y0To: toOpen ? null : remaining(b, 0, "to"),
    open: [...(fromOpen ? ["from" as const] : []), ...(toOpen ? ["to" as const] : [])],
  };
}

/** A shunt element whose terminal is open: listed (its current is zero), no admittance, no source. */
function openedShunt(s: ShuntStamp): ShuntStamp {
  return { ...s, y: [null, null, null], open: true };
}

/** A converter whose terminal is open: its injection and grid-forming shunt go; a terminal of zero current stays. */
function openedConverter(u: InverterUnit): ShuntStamp {
  return { element: u.element, label: u.label, kind: "inverter", node: u.node, bus: u.bus, y: [null, null, null], ir_pu: 0, z1: u.zForming, refinedOnly: false, open: true };
}

export interface OpenedStamps {
  branches: BranchStamp[];
  shunts: ShuntStamp[];
  inverters: InverterUnit[];
}

/**
 * The model's stamps with the ends opened (new arrays; the model is not changed). Ends of elements the model does
 * not hold (out of service, a load, a motor left out of minimum currents) change nothing. Throws when an end does
 * not fit its element (a terminal of a branch, a from/to end of a shunt element), naming the element.
 */
export function openStamps(model: Pick<Model, "branches" | "shunts" | "inverters">, ends: readonly OpenEnd[]): OpenedStamps {
  const branchEnds = new Map<string, ("from" | "to")[]>();
  const terminals = new Set<string>();
  const branchIds = new Set(model.branches.map((b) => b.element));
  const shuntIds = new Set([...model.shunts.map((s) => s.element), ...model.inverters.map((u) => u.element)]);
  for (const e of ends) {
    if (e.end === "terminal") {
      if (branchIds.has(e.element)) throw new Error(`Opened end ${e.element}: end must be "from" or "to" for a branch (got "terminal")`);
      terminals.add(e.element);
    } else {
      if (shuntIds.has(e.element)) throw new Error(`Opened end ${e.element}: end must be "terminal" for a shunt element (got "${e.end}")`);
      const list = branchEnds.get(e.element) ?? [];
      if (!list.includes(e.end)) list.push(e.end);
      branchEnds.set(e.element, list);
    }
  }
  const branches = model.branches.map((b) => {
    const open = branchEnds.get(b.element);
    if (!open) return b;
    // The halves of a line split at a fault point each carry one outer end.
    const here = b.reportEnds ? open.filter((x) => b.reportEnds!.includes(x)) : open;
    return here.length ? openedBranch(b, [...new Set([...(b.open ?? []), ...here])]) : b;
  });
  const shunts: ShuntStamp[] = [];
  for (const s of model.shunts) {
    if (!terminals.has(s.element)) shunts.push(s);
    else if (!s.refinedOnly) shunts.push(openedShunt(s)); // a grid-forming unit's shunt goes with the unit
  }
  const inverters: InverterUnit[] = [];
  for (const u of model.inverters) {
    if (terminals.has(u.element)) shunts.push(openedConverter(u));
    else inverters.push(u);
  }
  return { branches, shunts, inverters };
}
