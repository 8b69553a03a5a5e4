// Numbers the solvers can work with. LDL^T squares pivots and multiplies admittances together: per-unit
// admittances far beyond any physical value (an S"k of 1e308 MVA, a uk of 1e-300 %, a base of 1e-300 MVA that
// slipped past validation) overflow to Infinity or vanish to 0 and the factorisation fails or returns NaN.
// Every stamp is checked after compiling; each one out of range is named with the fields that made it.
import type { Element } from "../../model/schema.ts";
import { elementLabel } from "../../model/elementLabel.ts";
import { OUT_OF_RANGE } from "../engineFailure.ts";
import type { EngineMessage } from "../types.ts";
import type { Cx, Model } from "./model.ts";

/** Per-unit magnitudes kept: real plant spans about 1e-12 to 1e12 pu; squares of these stay far inside a double. */
export const PU_MIN = 1e-40;
export const PU_MAX = 1e40;

const FIELDS: Partial<Record<Element["kind"], string>> = {
  grid: "skMax_MVA, skMin_MVA, rx, z0z1, r0x0",
  transformer: "sr_MVA, uk_pct, ur_pct, z0z1, earthing z_ohm",
  line: "length_km, r1_ohmPerKm, x1_ohmPerKm, r0_ohmPerKm, x0_ohmPerKm, parallel",
  generator: "sr_MVA, xdss_pu, x2_pu, x0_pu, rx, earthing z_ohm",
  motor: "pr_kW, ilrIr, rx",
  inverter: "sr_MVA, iMax_pu, zForming_pu",
};

function bad(x: number): boolean {
  return !Number.isFinite(x);
}
function badCx(c: Cx | null | undefined): boolean {
  if (!c) return false;
  if (bad(c.re) || bad(c.im)) return true;
  const m = Math.hypot(c.re, c.im);
  return m !== 0 && (m < PU_MIN || m > PU_MAX);
}

/** Errors for every element whose stamp holds a value the solvers cannot use (empty when all are fine). */
export function stampRangeErrors(model: Model, elements: ReadonlyMap<string, Element>, baseMVA: number): EngineMessage[] {
  const offenders = new Set<string>();
  for (const b of model.branches) if (bad(b.t) || b.y.some(badCx) || badCx(b.y0From) || badCx(b.y0To) || badCx(b.z1)) offenders.add(b.element);
  for (const s of model.shunts) if (s.y.some(badCx) || badCx(s.z1) || bad(s.ir_pu)) offenders.add(s.element);
  for (const u of model.inverters) if (bad(u.ir_pu) || bad(u.iMax_pu) || bad(u.kFactor) || bad(u.k2) || badCx(u.zForming) || bad(u.activePower_pu) || bad(u.vScale)) offenders.add(u.element);
  return [...offenders].map((id) => {
    const e = elements.get(id);
    const label = e ? elementLabel(e) : id;
    const fields = e ? FIELDS[e.kind] : undefined;
    return {
      level: "error" as const,
      code: OUT_OF_RANGE,
      text: `${label}: its per-unit impedance on the ${baseMVA} MVA base is outside what the engine can compute with (beyond ${PU_MIN} to ${PU_MAX} pu, or not a number); check ${fields ? `${fields} and ` : ""}meta.baseMVA`,
      element: id,
    };
  });
}
