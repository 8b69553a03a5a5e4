// Reads one device location's currents for one fault from a sweep's compact linear form.
import type { SweepDeviceCurrents, SweepResult, Complex } from "../types.ts";
import { seqToPhase, toPhasor } from "./phasors.ts";

const overrideIndex = new WeakMap<SweepResult, Map<number, Float64Array>>();

export function sweepDeviceCurrents(sweep: SweepResult, d: number, b: number, t: number): SweepDeviceCurrents {
  const B = sweep.busIds.length;
  const T = sweep.types.length;
  const dd = sweep.deviceData;
  let ov = overrideIndex.get(sweep);
  if (!ov) {
    ov = new Map(dd.overrides.map((o) => [o.b * T + o.t, o.seq_A]));
    overrideIndex.set(sweep, ov);
  }
  const hit = ov.get(b * T + t);
  let seq: Complex[];
  if (hit) {
    seq = [0, 1, 2].map((s) => ({ re: hit[d * 6 + 2 * s], im: hit[d * 6 + 2 * s + 1] }));
  } else {
    const J = dd.nInj;
    const base = dd.base_A[d];
    const rot = ((dd.shift_deg[d] - dd.busShift_deg[b]) * Math.PI) / 180;
    seq = [];
    for (let s = 0; s < 3; s++) {
      const o = (d * B + b) * 6 + 2 * s;
      const f = (b * T + t) * 6 + 2 * s;
      const tr = dd.transfer[o];
      const ti = dd.transfer[o + 1];
      const fr = dd.faultSeq_pu[f];
      const fi = dd.faultSeq_pu[f + 1];
      let re = tr * fr - ti * fi;
      let im = tr * fi + ti * fr;
      if (s > 0) {
        for (let j = 0; j < J; j++) {
          const m = (d * J + j) * 6 + 2 * s;
          const q = ((b * T + t) * J + j) * 6 + 2 * s;
          const ar = dd.injMap[m];
          const ai = dd.injMap[m + 1];
          const xr = dd.inj_pu[q];
          const xi = dd.inj_pu[q + 1];
          re += ar * xr - ai * xi;
          im += ar * xi + ai * xr;
        }
      }
      const ang = s === 1 ? rot : s === 2 ? -rot : 0;
      const c = Math.cos(ang);
      const sn = Math.sin(ang);
      seq.push({ re: (re * c - im * sn) * base, im: (re * sn + im * c) * base });
    }
  }
  const ph = seqToPhase([seq[0], seq[1], seq[2]]);
  return { seq_A: [seq[0], seq[1], seq[2]], phase_A: [toPhasor(ph[0]), toPhasor(ph[1]), toPhasor(ph[2])] };
}
