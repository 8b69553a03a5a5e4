// Reads one device location's currents for one fault from a sweep's compact linear form.
import { TRANSFER_BLOCK, type SweepDeviceCurrents, type SweepResult, type Complex } from "../types.ts";
import { seqToPhase, toPhasor } from "./phasors.ts";

const overrideIndex = new WeakMap<SweepResult, Map<number, Float64Array>>();

const S3 = Math.sqrt(3) / 2;
/** |(x, y)|: Math.hypot guards against an overflow amperes cannot reach, at about ten times the cost (hot path). */
const mag = (x: number, y: number) => Math.sqrt(x * x + y * y);
// The last (sweep, bus, type) looked up, by a per-sweep number so that no sweep is kept alive here.
const sweepIds = new WeakMap<SweepResult, number>();
let nextSweepId = 1;
const last: { sweep: number; b: number; t: number; hit: Float64Array | undefined } = { sweep: 0, b: -1, t: -1, hit: undefined };
const reachIndex = new WeakMap<SweepResult, Uint8Array>();

/** Whether any converter's unit injection gives device d a non-zero current (per sweep, cached). */
function injReaches(sweep: SweepResult, d: number): boolean {
  let reach = reachIndex.get(sweep);
  if (!reach) {
    const dd = sweep.deviceData;
    const J = dd.nInj;
    const D = dd.base_A.length;
    reach = new Uint8Array(D);
    for (let k = 0; k < D; k++)
      for (let m = k * J * 6; m < (k + 1) * J * 6; m++)
        if (dd.injMap[m] !== 0) {
          reach[k] = 1;
          break;
        }
    reachIndex.set(sweep, reach);
  }
  return reach[d] === 1;
}

/**
 * Allocation-free read for hot loops: writes the device location's sequence currents in A as
 * [re0, im0, re1, im1, re2, im2] into out[0..5] and its phase-current magnitudes |Ia|, |Ib|, |Ic| into out[6..8].
 * Same arithmetic as sweepDeviceCurrents, which is built on it, except that the phase magnitudes are taken with a
 * plain square root (equal to Math.hypot's within a unit in the last place).
 */
export function sweepDeviceCurrentsInto(sweep: SweepResult, d: number, b: number, t: number, out: Float64Array): void {
  const T = sweep.types.length;
  const dd = sweep.deviceData;
  // callers loop over devices for one (bus, type): look the override up once per (sweep, bus, type)
  let id = sweepIds.get(sweep);
  if (id === undefined) {
    id = nextSweepId++;
    sweepIds.set(sweep, id);
  }
  if (id !== last.sweep || b !== last.b || t !== last.t) {
    let ov = overrideIndex.get(sweep);
    if (!ov) {
      ov = new Map(dd.overrides.map((o) => [o.b * T + o.t, o.seq_A]));
      overrideIndex.set(sweep, ov);
    }
    last.sweep = id;
    last.b = b;
    last.t = t;
    last.hit = ov.get(b * T + t);
  }
  const hit = last.hit;
  if (hit) {
    for (let k = 0; k < 6; k++) out[k] = hit[d * 6 + k];
  } else {
    // a device that no converter injection reaches skips the injection sum (its terms are exactly zero)
    const J = injReaches(sweep, d) ? dd.nInj : 0;
    const base = dd.base_A[d];
    // Positive sequence turns by the shift between the device's node and the faulted bus, negative by minus that.
    const shift = dd.shift_deg[d] - dd.busShift_deg[b];
    const rot = (shift * Math.PI) / 180;
    const cr = shift === 0 ? 1 : Math.cos(rot);
    const sr = shift === 0 ? 0 : Math.sin(rot);
    // -X_s[row(b), slot(d)] (see SweepDeviceData.transfer); zero for a bus or device location out of service
    const slot = dd.transferSlot[d];
    const row = dd.transferBusRow[b];
    const part = dd.transferRows * TRANSFER_BLOCK;
    const at = slot < 0 || row < 0 ? -1 : (slot - (slot % TRANSFER_BLOCK)) * 6 * dd.transferRows + row * TRANSFER_BLOCK + (slot % TRANSFER_BLOCK);
    const neg = dd.negative;
    for (let s = 0; s < 3; s++) {
      const f = (b * T + t) * 6 + 2 * s;
      let tr = 0;
      let ti = 0;
      if (at >= 0 && s === 2 && neg) {
        // X2 = X1 - W alpha (see SweepDeviceData.negative)
        let xr = dd.transfer[at + 2 * part];
        let xi = dd.transfer[at + 3 * part];
        const k = neg.rank;
        for (let h = 0; h < k; h++) {
          const wr = neg.w[(row * k + h) * 2];
          const wi = neg.w[(row * k + h) * 2 + 1];
          const ar = neg.alpha[(slot * k + h) * 2];
          const ai = neg.alpha[(slot * k + h) * 2 + 1];
          xr -= wr * ar - wi * ai;
          xi -= wr * ai + wi * ar;
        }
        tr = -xr;
        ti = -xi;
      } else if (at >= 0) {
        const o = at + 2 * s * part;
        tr = -dd.transfer[o];
        ti = -dd.transfer[o + part];
      }
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
      const c = s === 0 ? 1 : cr;
      const sn = s === 0 ? 0 : s === 1 ? sr : -sr;
      out[2 * s] = (re * c - im * sn) * base;
      out[2 * s + 1] = (re * sn + im * c) * base;
    }
  }
  // phases from sequences (a = 1 at 120 deg), as seqToPhase does
  const i0r = out[0], i0i = out[1], i1r = out[2], i1i = out[3], i2r = out[4], i2i = out[5];
  out[6] = mag(i0r + i1r + i2r, i0i + i1i + i2i);
  out[7] = mag(i0r + (-0.5 * i1r - -S3 * i1i) + (-0.5 * i2r - S3 * i2i), i0i + (-0.5 * i1i + -S3 * i1r) + (-0.5 * i2i + S3 * i2r));
  out[8] = mag(i0r + (-0.5 * i1r - S3 * i1i) + (-0.5 * i2r - -S3 * i2i), i0i + (-0.5 * i1i + S3 * i1r) + (-0.5 * i2i + -S3 * i2r));
}

const scratch = new Float64Array(9);

export function sweepDeviceCurrents(sweep: SweepResult, d: number, b: number, t: number): SweepDeviceCurrents {
  sweepDeviceCurrentsInto(sweep, d, b, t, scratch);
  const seq: [Complex, Complex, Complex] = [
    { re: scratch[0], im: scratch[1] },
    { re: scratch[2], im: scratch[3] },
    { re: scratch[4], im: scratch[5] },
  ];
  const ph = seqToPhase(seq);
  return { seq_A: seq, phase_A: [toPhasor(ph[0]), toPhasor(ph[1]), toPhasor(ph[2])] };
}
