// Symmetrical components (Fortescue 1918), used only to turn sequence data of a record into a phase matrix
// and to read phase results back as sequences. Independent of src/engine: plain mathjs complex arithmetic.
import { complex, multiply, inv, type Complex } from "mathjs";

export type CMatrix = Complex[][];

/** a = 1 at 120 degrees. */
export const A_OP = complex({ r: 1, phi: (2 * Math.PI) / 3 });
const a = A_OP;
const a2 = multiply(a, a) as Complex;
const one = complex(1, 0);

/** V_abc = A V_012 with A = [[1,1,1],[1,a^2,a],[1,a,a^2]] (phase sequence a-b-c). */
export const A_MATRIX: CMatrix = [
  [one, one, one],
  [one, a2, a],
  [one, a, a2],
];
export const A_INVERSE: CMatrix = inv(A_MATRIX) as unknown as CMatrix;

/** Phase matrix of an element given its sequence values: M_abc = A diag(m0, m1, m2) A^-1. */
export function sequenceToPhase(m0: Complex, m1: Complex, m2: Complex): CMatrix {
  const zero = complex(0, 0);
  const d: CMatrix = [
    [m0, zero, zero],
    [zero, m1, zero],
    [zero, zero, m2],
  ];
  return multiply(multiply(A_MATRIX, d), A_INVERSE) as unknown as CMatrix;
}

/** Phase impedance matrix of a transposed element: self (Z0 + 2 Z1)/3 on the diagonal, mutual (Z0 - Z1)/3 off it. */
export function selfMutual(z1: Complex, z0: Complex): CMatrix {
  const zs = multiply(1 / 3, complex(z0.re + 2 * z1.re, z0.im + 2 * z1.im)) as Complex;
  const zm = multiply(1 / 3, complex(z0.re - z1.re, z0.im - z1.im)) as Complex;
  return [
    [zs, zm, zm],
    [zm, zs, zm],
    [zm, zm, zs],
  ];
}

/** [I0, I1, I2] of a phase triple. */
export function phaseToSequence(v: Complex[]): Complex[] {
  return multiply(A_INVERSE, v) as unknown as Complex[];
}
