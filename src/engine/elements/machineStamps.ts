// Synchronous generators and asynchronous motors as impedances behind the equivalent source
// (IEC 60909-0:2016, 6.6 and 6.8).
import type { Earthing, Generator, Motor } from "../../model/schema.ts";
import type { Cx, ShuntStamp } from "../network/model.ts";
import { add, inv, scale } from "../complex.ts";
import { generatorKG } from "../iec60909/factors.ts";

function neutral_pu(e: Earthing, zBase: number): Cx | null {
  if (e.kind === "isolated") return null;
  if (e.kind === "solid") return { re: 0, im: 0 };
  const z = (e.z_ohm ?? 0) / zBase;
  return e.kind === "resistance" ? { re: z, im: 0 } : { re: 0, im: z };
}

/** KG for a generator on its own (IEC 60909-0:2016, 6.6.1), 1 for the classic method (cmax null). */
export function standaloneGeneratorK(g: Generator, un_kV: number, cmax: number | null): number {
  return cmax === null ? 1 : generatorKG(un_kV, g.ur_kV, cmax, g.xdss_pu, g.cosPhi);
}

/**
 * Generator: Z"d times the correction factor kg (KG alone, or the share of a power station unit's K_S / K_SO or
 * K_G,S / K_G,SO), x2 and x0 scaled the same and with the same R/X.
 */
export function generatorStamp(g: Generator, node: number, label: string, un_kV: number, baseMVA: number, kg: number): ShuntStamp {
  const k = (baseMVA / g.sr_MVA) * (g.ur_kV / un_kV) ** 2 * kg;
  const z = (x: number): Cx => ({ re: g.rx * x * k, im: x * k });
  const z1 = z(g.xdss_pu);
  const zn = neutral_pu(g.earthing, (un_kV * un_kV) / baseMVA);
  return {
    element: g.id,
    label,
    kind: "generator",
    node,
    bus: g.bus,
    y: [zn ? inv(add(z(g.x0_pu), scale(zn, 3))) : null, inv(z1), inv(z(g.x2_pu))],
    ir_pu: (g.sr_MVA / baseMVA) * (un_kV / g.ur_kV),
    z1,
    refinedOnly: false,
  };
}

/**
 * Motor: ZM = (1/(ILR/IrM)) UrM^2/SrM with SrM = PrM/(eta cos phi); no zero-sequence path (unearthed star).
 * With its pole pairs known it carries m = PrM/p in MW for the breaking-current factor q.
 */
export function motorStamp(m: Motor, node: number, label: string, un_kV: number, baseMVA: number): ShuntStamp {
  const srM_MVA = m.pr_kW / 1000 / (m.eta * m.cosPhi);
  const zMag = (1 / m.ilrIr) * (baseMVA / srM_MVA) * (m.ur_kV / un_kV) ** 2;
  const x = zMag / Math.sqrt(1 + m.rx * m.rx);
  const z1 = { re: m.rx * x, im: x };
  return {
    element: m.id,
    label,
    kind: "motor",
    node,
    bus: m.bus,
    y: [null, inv(z1), inv(z1)],
    ir_pu: (srM_MVA / baseMVA) * (un_kV / m.ur_kV),
    z1,
    refinedOnly: false,
    ...(m.polePairs !== undefined ? { m_MW: m.pr_kW / 1000 / m.polePairs } : {}),
  };
}
