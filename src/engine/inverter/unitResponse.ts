// The network's response at the inverter units' nodes, V = a + M x, for the refined iteration: voltages with no
// converter injection (a) and their change with the injections x (positive and negative sequence per unit).
// Two forms: a dense map (2J x J per sequence, sampled by network solutions when nothing better is known), and the
// fault-coupled form a bus fault gives in closed form,
//   V1 = a1 + Z1_UU x1 - z1 (g11 y1 + g12 y2),   V2 = a2 + Z2_UU x2 - z2 (g21 y1 + g22 y2),
//   y1 = z1^T x1, y2 = z2^T x2, z_s[j] = Z_s[u_j, k],
// where the g's are how the fault currents change with the open-circuit voltages at the fault. That form needs no
// per-fault matrix: Z_UU is the same for every faulted bus, and the rest is O(J).

/** Unit voltages (positive v1, negative v2) written by a response. */
export interface UnitVoltages {
  v1r: Float64Array;
  v1i: Float64Array;
  v2r: Float64Array;
  v2i: Float64Array;
}

export interface UnitResponse {
  readonly J: number;
  /** Voltages at the unit nodes with no converter injection. */
  readonly a1r: Float64Array;
  readonly a1i: Float64Array;
  readonly a2r: Float64Array;
  readonly a2i: Float64Array;
  /** V = a + M x into out (x: positive x1, negative x2 injections per unit). */
  evaluate(out: UnitVoltages, x1r: Float64Array, x1i: Float64Array, x2r: Float64Array, x2i: Float64Array): void;
}

/** The dense map: [q * J + j] is the response of unit j's V1 (M1) / V2 (M2) to injection q (q < J positive of unit q, else negative). */
export interface AffineMap {
  a1r: Float64Array;
  a1i: Float64Array;
  a2r: Float64Array;
  a2i: Float64Array;
  M1r: Float64Array;
  M1i: Float64Array;
  M2r: Float64Array;
  M2i: Float64Array;
}

export class DenseResponse implements UnitResponse {
  readonly J: number;
  readonly a1r: Float64Array;
  readonly a1i: Float64Array;
  readonly a2r: Float64Array;
  readonly a2i: Float64Array;
  constructor(private readonly map: AffineMap) {
    this.J = map.a1r.length;
    this.a1r = map.a1r;
    this.a1i = map.a1i;
    this.a2r = map.a2r;
    this.a2i = map.a2i;
  }
  evaluate(out: UnitVoltages, x1r: Float64Array, x1i: Float64Array, x2r: Float64Array, x2i: Float64Array): void {
    const J = this.J;
    const { M1r, M1i, M2r, M2i } = this.map;
    const { v1r, v1i, v2r, v2i } = out;
    v1r.set(this.a1r);
    v1i.set(this.a1i);
    v2r.set(this.a2r);
    v2i.set(this.a2i);
    for (let q = 0; q < 2 * J; q++) {
      const xr = q < J ? x1r[q] : x2r[q - J];
      const xi = q < J ? x1i[q] : x2i[q - J];
      if (xr === 0 && xi === 0) continue;
      const o = q * J;
      for (let j = 0; j < J; j++) {
        const a = M1r[o + j];
        const b = M1i[o + j];
        const c = M2r[o + j];
        const d = M2i[o + j];
        v1r[j] += a * xr - b * xi;
        v1i[j] += a * xi + b * xr;
        v2r[j] += c * xr - d * xi;
        v2i[j] += c * xi + d * xr;
      }
    }
  }
}

/** Z among the units, [q * J + j] = Z[u_q, u_j], positive (z1) and negative (z2) sequence. */
export interface UnitBlock {
  z1r: Float64Array;
  z1i: Float64Array;
  z2r: Float64Array;
  z2i: Float64Array;
}

/**
 * The fault-coupled form. Mutable on purpose: a sweep keeps one per island and reloads it for every bus
 * (`setBus`) and fault type (`setFault`), so the iteration allocates nothing.
 */
export class FaultCoupledResponse implements UnitResponse {
  readonly a1r: Float64Array;
  readonly a1i: Float64Array;
  readonly a2r: Float64Array;
  readonly a2i: Float64Array;
  /** Z_s[u_j, k] for the faulted node k. */
  readonly z1r: Float64Array;
  readonly z1i: Float64Array;
  readonly z2r: Float64Array;
  readonly z2i: Float64Array;
  private g11r = 0;
  private g11i = 0;
  private g12r = 0;
  private g12i = 0;
  private g21r = 0;
  private g21i = 0;
  private g22r = 0;
  private g22i = 0;

  constructor(
    readonly J: number,
    private readonly block: UnitBlock,
  ) {
    const f = () => new Float64Array(J);
    this.a1r = f();
    this.a1i = f();
    this.a2r = f();
    this.a2i = f();
    this.z1r = f();
    this.z1i = f();
    this.z2r = f();
    this.z2i = f();
  }

  /**
   * The fault: c the source voltage, I0 the fault currents (positive, negative) with no injection, and G the change
   * of those currents per unit open-circuit voltage at the fault: column 1 for E1, column 2 for E2. z must be set.
   */
  setFault(c: number, i01r: number, i01i: number, i02r: number, i02i: number, g: Float64Array): void {
    this.g11r = g[0];
    this.g11i = g[1];
    this.g21r = g[2];
    this.g21i = g[3];
    this.g12r = g[4];
    this.g12i = g[5];
    this.g22r = g[6];
    this.g22i = g[7];
    const { z1r, z1i, z2r, z2i } = this;
    for (let j = 0; j < this.J; j++) {
      // a1 = c - Z[j,k] I0_1, a2 = -Z[j,k] I0_2
      this.a1r[j] = c - (z1r[j] * i01r - z1i[j] * i01i);
      this.a1i[j] = -(z1r[j] * i01i + z1i[j] * i01r);
      this.a2r[j] = -(z2r[j] * i02r - z2i[j] * i02i);
      this.a2i[j] = -(z2r[j] * i02i + z2i[j] * i02r);
    }
  }

  evaluate(out: UnitVoltages, x1r: Float64Array, x1i: Float64Array, x2r: Float64Array, x2i: Float64Array): void {
    const J = this.J;
    const { z1r, z1i, z2r, z2i } = this;
    const { v1r, v1i, v2r, v2i } = out;
    // y = z^T x (Z[k, q] = Z[q, k]: the sequence networks are reciprocal).
    let y1r = 0;
    let y1i = 0;
    let y2r = 0;
    let y2i = 0;
    for (let q = 0; q < J; q++) {
      y1r += z1r[q] * x1r[q] - z1i[q] * x1i[q];
      y1i += z1r[q] * x1i[q] + z1i[q] * x1r[q];
      y2r += z2r[q] * x2r[q] - z2i[q] * x2i[q];
      y2i += z2r[q] * x2i[q] + z2i[q] * x2r[q];
    }
    const f1r = this.g11r * y1r - this.g11i * y1i + (this.g12r * y2r - this.g12i * y2i);
    const f1i = this.g11r * y1i + this.g11i * y1r + (this.g12r * y2i + this.g12i * y2r);
    const f2r = this.g21r * y1r - this.g21i * y1i + (this.g22r * y2r - this.g22i * y2i);
    const f2i = this.g21r * y1i + this.g21i * y1r + (this.g22r * y2i + this.g22i * y2r);
    // Z_UU x: Z_UU is symmetric (reciprocity), so row j is contiguous at j * J; positive sequence accumulated in
    // registers row by row. The negative-sequence injections are mostly zero (only grid-forming units and units
    // with negative-sequence control make them): column by column, skipping zeros.
    const b = this.block;
    const zr1 = b.z1r;
    const zi1 = b.z1i;
    for (let j = 0; j < J; j++) {
      let sr = this.a1r[j] - (z1r[j] * f1r - z1i[j] * f1i);
      let si = this.a1i[j] - (z1r[j] * f1i + z1i[j] * f1r);
      const o = j * J;
      for (let q = 0; q < J; q++) {
        const zr = zr1[o + q];
        const zi = zi1[o + q];
        const pr = x1r[q];
        const pi = x1i[q];
        sr += zr * pr - zi * pi;
        si += zr * pi + zi * pr;
      }
      v1r[j] = sr;
      v1i[j] = si;
      v2r[j] = this.a2r[j] - (z2r[j] * f2r - z2i[j] * f2i);
      v2i[j] = this.a2i[j] - (z2r[j] * f2i + z2i[j] * f2r);
    }
    for (let q = 0; q < J; q++) {
      const nr = x2r[q];
      const ni = x2i[q];
      if (nr !== 0 || ni !== 0) {
        const o = q * J;
        for (let j = 0; j < J; j++) {
          const zr = b.z2r[o + j];
          const zi = b.z2i[o + j];
          v2r[j] += zr * nr - zi * ni;
          v2i[j] += zr * ni + zi * nr;
        }
      }
    }
  }
}
