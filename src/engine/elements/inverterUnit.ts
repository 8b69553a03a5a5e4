// Converter-interfaced unit: rated current and limits in node per unit; grid-forming units also get a shunt
// (1.0 pu behind zForming, mostly reactive: R/X 0.1) used by the refined model only.
import type { Inverter } from "../../model/schema.ts";
import type { InverterUnit, ShuntStamp } from "../network/model.ts";
import { inv, zFromRx } from "../complex.ts";

export const FORMING_RX = 0.1;

export function inverterUnit(v: Inverter, node: number, label: string, un_kV: number, baseMVA: number): { unit: InverterUnit; shunt: ShuntStamp | null } {
  const zF = zFromRx(v.zForming_pu * (baseMVA / v.sr_MVA) * (v.ur_kV / un_kV) ** 2, FORMING_RX);
  const unit: InverterUnit = {
    element: v.id,
    label,
    node,
    bus: v.bus,
    control: v.control,
    ir_pu: (v.sr_MVA / baseMVA) * (un_kV / v.ur_kV),
    iMax_pu: v.iMax_pu,
    kFactor: v.kFactor,
    negSeq: v.negSeq.mode,
    k2: v.negSeq.k2,
    zForming: zF,
    activePower_pu: v.activePower_pu,
    vScale: un_kV / v.ur_kV,
  };
  const shunt: ShuntStamp | null =
    v.control === "grid-forming"
      ? { element: v.id, label, kind: "inverter", node, bus: v.bus, y: [null, inv(zF), inv(zF)], ir_pu: 0, z1: zF, refinedOnly: true }
      : null;
  return { unit, shunt };
}
