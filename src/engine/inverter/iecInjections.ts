// IEC 60909-0:2016 treatment of full-size converter units: positive-sequence current sources of magnitude
// I_kPF = iMax * Ir. Their contributions are added in magnitude, I"k = (c Un/sqrt3 + sum |Zij| I_kPFj) / |Zk|,
// which is the same as injecting each unit's current at the angle that puts Z_kj I_j in phase with c:
// arg I_j = -arg Z_kj. In a floating island (current sources only) the limit is I = sum (w_j / w_k) I_j.
import type { InverterUnit } from "../network/model.ts";
import type { SequenceSystem } from "../network/sequenceSystem.ts";
import type { ComplexVec } from "../fault/solveLinearFault.ts";

export function iecInjections(units: InverterUnit[], sys1: SequenceSystem, zk1: ComplexVec, k: number): { inj: ComplexVec; perUnit: { re: number; im: number }[] } {
  const n = sys1.n;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  const ck = sys1.comp[k];
  const perUnit: { re: number; im: number }[] = [];
  for (const u of units) {
    if (sys1.comp[u.node] !== ck) {
      perUnit.push({ re: 0, im: 0 });
      continue;
    }
    let ang: number;
    if (sys1.floating[ck]) {
      const wr = sys1.wre[u.node];
      const wi = sys1.wim[u.node];
      const kr = sys1.wre[k];
      const ki = sys1.wim[k];
      ang = -(Math.atan2(wi, wr) - Math.atan2(ki, kr));
    } else ang = -Math.atan2(zk1.im[u.node], zk1.re[u.node]);
    const mag = u.iMax_pu * u.ir_pu;
    perUnit.push({ re: mag * Math.cos(ang), im: mag * Math.sin(ang) });
    re[u.node] += mag * Math.cos(ang);
    im[u.node] += mag * Math.sin(ang);
  }
  return { inj: { re, im }, perUnit };
}
