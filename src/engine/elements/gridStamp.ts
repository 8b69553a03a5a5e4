// Network feeder (IEC 60909-0:2016, 6.2): ZQ = c UnQ^2 / S"kQ, split by R/X; zero sequence by |Z0|/|Z1| and R0/X0.
import type { Grid } from "../../model/schema.ts";
import type { ShuntStamp } from "../network/model.ts";
import { inv, zFromRx } from "../complex.ts";

/** c is cmax/cmin (IEC) or the prefault voltage (classic); sk_MVA the limit's S"k. */
export function gridStamp(g: Grid, node: number, label: string, c: number, sk_MVA: number, baseMVA: number): ShuntStamp {
  const z1 = zFromRx((c * baseMVA) / sk_MVA, g.rx);
  const z0 = g.z0z1 > 0 ? zFromRx(g.z0z1 * Math.hypot(z1.re, z1.im), g.r0x0) : null;
  return {
    element: g.id,
    label,
    kind: "grid",
    node,
    bus: g.bus,
    y: [z0 ? inv(z0) : null, inv(z1), inv(z1)],
    ir_pu: 0,
    z1,
    refinedOnly: false,
  };
}
