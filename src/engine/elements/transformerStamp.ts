// Two-winding network transformer (IEC 60909-0:2016, 6.3): ZT from uk and ur, corrected by KT for the IEC method
// (or by the unit's factor when it is a power station unit's transformer, 6.7),
// an off-nominal ratio from rated voltages and tap, the vector group's phase shift, and zero-sequence paths from
// the winding connections and neutral earthing (delta blocks; an earthed star opposite a delta is a shunt on the
// star side; earthed star to earthed star passes through; an earthing impedance enters as 3 Zn).
import type { Earthing, Transformer } from "../../model/schema.ts";
import type { BranchStamp, Cx } from "../network/model.ts";
import { add, inv, scale } from "../complex.ts";
import { transformerKT } from "../iec60909/factors.ts";

export interface TransformerInput {
  tr: Transformer;
  label: string;
  from: number;
  to: number;
  unHv_kV: number;
  unLv_kV: number;
  baseMVA: number;
  /** KT is applied when set (IEC method), with the LV side's cmax. */
  cmaxLv: number | null;
  /** Unit transformer of a power station unit: this factor (K_S, K_SO or the in-unit K_T,S / K_T,SO) replaces KT. */
  kUnit?: number;
}

/** Clock number of the vector group: LV lags HV by 30 degrees per hour. */
export function clockNumber(vectorGroup: string): number {
  const m = /(\d+)$/.exec(vectorGroup);
  return m ? Number(m[1]) : 0;
}

function earthedNeutral_pu(e: Earthing, zBase: number): Cx | null {
  if (e.kind === "isolated") return null;
  if (e.kind === "solid") return { re: 0, im: 0 };
  const z = (e.z_ohm ?? 0) / zBase;
  return e.kind === "resistance" ? { re: z, im: 0 } : { re: 0, im: z };
}

/** Relative reactance xT = sqrt(uk^2 - ur^2) / 100 in pu of the transformer rating (ur capped at uk). */
export function transformerXT(tr: Transformer): number {
  const ur = Math.min(tr.ur_pct, tr.uk_pct);
  return Math.sqrt(tr.uk_pct * tr.uk_pct - ur * ur) / 100;
}

export function transformerStamp(p: TransformerInput): { stamp: BranchStamp; error: string | null } {
  const { tr } = p;
  let error: string | null = null;
  if (tr.ur_pct > tr.uk_pct) error = `${p.label}: ur_pct must not exceed uk_pct (got ${tr.ur_pct} > ${tr.uk_pct})`;
  const ur = Math.min(tr.ur_pct, tr.uk_pct);
  const xT = transformerXT(tr);
  const kt = p.kUnit ?? (p.cmaxLv === null ? 1 : transformerKT(xT, p.cmaxLv));
  const k = (p.baseMVA / tr.sr_MVA) * (tr.urLv_kV / p.unLv_kV) ** 2 * kt;
  const z1: Cx = { re: (ur / 100) * k, im: xT * k };
  const t = ((tr.urHv_kV * (1 + tr.tap_pct / 100)) / p.unHv_kV) / (tr.urLv_kV / p.unLv_kV);
  let shift = -clockNumber(tr.vectorGroup) * 30;
  while (shift <= -180) shift += 360;
  while (shift > 180) shift -= 360;

  const vg = tr.vectorGroup;
  const hvStar = vg.startsWith("YN") ? "YN" : vg.startsWith("Y") ? "Y" : "D";
  const lvPart = vg.slice(hvStar.length);
  const lvStar = lvPart.startsWith("yn") ? "yn" : lvPart.startsWith("y") ? "y" : "d";
  const zbHv = (p.unHv_kV * p.unHv_kV) / p.baseMVA;
  const zbLv = (p.unLv_kV * p.unLv_kV) / p.baseMVA;
  const znHv = hvStar === "YN" ? earthedNeutral_pu(tr.earthingHv, zbHv) : null;
  const znLv = lvStar === "yn" ? earthedNeutral_pu(tr.earthingLv, zbLv) : null;
  const z0 = scale(z1, tr.z0z1);
  let y0: Cx | null = null;
  let y0From: Cx | null = null;
  let y0To: Cx | null = null;
  if (hvStar === "D" && znLv) y0To = inv(add(z0, scale(znLv, 3)));
  else if (lvStar === "d" && znHv) y0From = inv(add(scale(z0, t * t), scale(znHv, 3)));
  else if (znHv && znLv) y0 = inv(add(add(z0, scale(znLv, 3)), scale(znHv, 3 / (t * t))));

  const y1 = inv(z1);
  return {
    stamp: {
      element: tr.id,
      label: p.label,
      kind: "transformer",
      from: p.from,
      to: p.to,
      fromBus: tr.hvBus,
      toBus: tr.lvBus,
      t,
      shift_deg: shift,
      y: [y0, y1, { ...y1 }],
      y0From,
      y0To,
      z1,
      rated_A: (tr.sr_MVA * 1000) / (Math.sqrt(3) * tr.urHv_kV),
    },
    error,
  };
}
