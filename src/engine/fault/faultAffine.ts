// The fault-point conditions of faultEquations.ts as a linear map, for the all-bus sweep: with the positive and
// negative-sequence networks seen as Thevenin sources (E1, Z1), (E2, Z2) and the zero sequence as (0, Z0) or
// floating without a current source, the currents drawn into the fault are linear in the open-circuit voltages:
//   I_s = A[s][1] E1 + A[s][2] E2,   s = 0, 1, 2.
// A follows from the same formulas (series connection for LG and LL, the Norton form for LLG); loading it costs a
// few complex divisions and, unlike faultEquations, allocates nothing: the sweep loads it once per bus and fault
// type and applies it several times (no injection, unit changes of E1 and E2, the final injections).
import type { Cx } from "../network/model.ts";
import type { FaultType } from "../types.ts";

const TINY = 1e-12;
const S3 = Math.sqrt(3) / 2;

export class FaultAffine {
  /** A as [(s * 2 + q) * 2 + re/im], q = 0 for E1, 1 for E2. */
  readonly a = new Float64Array(12);
  /** False when the fault is undetermined (LLG with no admittance at all): then every current is zero. */
  consistent = true;

  /** `z0` null: the zero-sequence network floats at the fault (no shunt path, no current source). */
  load(type: FaultType, z0: Cx | null, z1: Cx, z2: Cx, zf: Cx): void {
    const a = this.a;
    a.fill(0);
    this.consistent = true;
    switch (type) {
      case "3ph": {
        // I1 = E1 / (Z1 + zf), I2 = E2 / (Z2 + zf)
        inverse(z1.re + zf.re, z1.im + zf.im, a, 4);
        inverse(z2.re + zf.re, z2.im + zf.im, a, 10);
        break;
      }
      case "LG": {
        // I0 = I1 = I2 = (E1 + E2) / (Z0 + Z1 + Z2 + 3 zf); no current when the zero sequence floats
        if (!z0) break;
        inverse(z0.re + z1.re + z2.re + 3 * zf.re, z0.im + z1.im + z2.im + 3 * zf.im, a, 0);
        for (let k = 2; k < 12; k += 2) {
          a[k] = a[0];
          a[k + 1] = a[1];
        }
        break;
      }
      case "LL": {
        // I1 = (E1 - E2) / (Z1 + Z2 + zf), I2 = -I1
        inverse(z1.re + z2.re + zf.re, z1.im + z2.im + zf.im, a, 4);
        a[6] = -a[4];
        a[7] = -a[5];
        a[8] = -a[4];
        a[9] = -a[5];
        a[10] = a[4];
        a[11] = a[5];
        break;
      }
      case "LLG": {
        // Norton form: y_s = 1/Z_s, j_s = E_s y_s; k0 = 1 / (1 + 3 zf y0); V = (j1 + j2) / (y1 + y2 + y0 k0);
        // I1 = j1 - y1 V, I2 = j2 - y2 V, I0 = -y0 k0 V.
        const w = this.w;
        inverse(z1.re, z1.im, w, 0); // y1
        inverse(z2.re, z2.im, w, 2); // y2
        let y0k0r = 0;
        let y0k0i = 0;
        if (z0) {
          inverse(z0.re, z0.im, w, 4); // y0
          const y0r = w[4];
          const y0i = w[5];
          // k0 = 1 / (1 + 3 zf y0)
          inverse(1 + 3 * (zf.re * y0r - zf.im * y0i), 3 * (zf.re * y0i + zf.im * y0r), w, 6);
          y0k0r = y0r * w[6] - y0i * w[7];
          y0k0i = y0r * w[7] + y0i * w[6];
        }
        const dr = w[0] + w[2] + y0k0r;
        const di = w[1] + w[3] + y0k0i;
        if (Math.hypot(dr, di) < TINY) {
          // undetermined unless nothing drives it; faultEquations leaves every current zero either way
          this.consistent = false;
          break;
        }
        inverse(dr, di, w, 8); // 1/den
        // V = (y1 E1 + y2 E2) / den: dV/dE1 = y1/den, dV/dE2 = y2/den
        const v1r = w[0] * w[8] - w[1] * w[9];
        const v1i = w[0] * w[9] + w[1] * w[8];
        const v2r = w[2] * w[8] - w[3] * w[9];
        const v2i = w[2] * w[9] + w[3] * w[8];
        // I1 = y1 E1 - y1 V;  I2 = y2 E2 - y2 V;  I0 = -y0 k0 V
        mulInto(-w[0], -w[1], v1r, v1i, a, 4);
        a[4] += w[0];
        a[5] += w[1];
        mulInto(-w[0], -w[1], v2r, v2i, a, 6);
        mulInto(-w[2], -w[3], v1r, v1i, a, 8);
        mulInto(-w[2], -w[3], v2r, v2i, a, 10);
        a[10] += w[2];
        a[11] += w[3];
        mulInto(-y0k0r, -y0k0i, v1r, v1i, a, 0);
        mulInto(-y0k0r, -y0k0i, v2r, v2i, a, 2);
        break;
      }
    }
  }

  private readonly w = new Float64Array(10);

  /** Sequence currents for E1, E2 into out[0..5] as [re0, im0, re1, im1, re2, im2]. */
  apply(e1r: number, e1i: number, e2r: number, e2i: number, out: Float64Array): void {
    const a = this.a;
    for (let s = 0; s < 3; s++) {
      const o = s * 4;
      out[2 * s] = a[o] * e1r - a[o + 1] * e1i + (a[o + 2] * e2r - a[o + 3] * e2i);
      out[2 * s + 1] = a[o] * e1i + a[o + 1] * e1r + (a[o + 2] * e2i + a[o + 3] * e2r);
    }
  }
}

function inverse(re: number, im: number, out: Float64Array, at: number): void {
  const m = re * re + im * im;
  out[at] = re / m;
  out[at + 1] = -im / m;
}

function mulInto(ar: number, ai: number, br: number, bi: number, out: Float64Array, at: number): void {
  out[at] = ar * br - ai * bi;
  out[at + 1] = ar * bi + ai * br;
}

/**
 * The reported I"k (in the same unit as the currents) and the largest phase current, from sequence currents
 * [re0, im0, re1, im1, re2, im2]: as faultMagnitudes, with plain square roots and no allocation.
 */
export function faultMagnitudesOf(type: FaultType, i: Float64Array, out: { ikss: number; maxPhase: number }): void {
  const i0r = i[0], i0i = i[1], i1r = i[2], i1i = i[3], i2r = i[4], i2i = i[5];
  const ar = i0r + i1r + i2r;
  const ai = i0i + i1i + i2i;
  // b = i0 + a^2 i1 + a i2, c = i0 + a i1 + a^2 i2 (a = 1 at 120 degrees)
  const br = i0r + (-0.5 * i1r + S3 * i1i) + (-0.5 * i2r - S3 * i2i);
  const bi = i0i + (-0.5 * i1i - S3 * i1r) + (-0.5 * i2i + S3 * i2r);
  const cr = i0r + (-0.5 * i1r - S3 * i1i) + (-0.5 * i2r + S3 * i2i);
  const ci = i0i + (-0.5 * i1i + S3 * i1r) + (-0.5 * i2i - S3 * i2r);
  const mb = Math.sqrt(br * br + bi * bi);
  out.maxPhase = Math.max(Math.sqrt(ar * ar + ai * ai), mb, Math.sqrt(cr * cr + ci * ci));
  switch (type) {
    case "3ph":
      out.ikss = Math.sqrt(i1r * i1r + i1i * i1i);
      break;
    case "LL":
      out.ikss = mb;
      break;
    case "LG":
    case "LLG":
      out.ikss = 3 * Math.sqrt(i0r * i0r + i0i * i0i);
      break;
  }
}
