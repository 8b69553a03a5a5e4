import { describe, it, expect } from "vitest";
import * as math from "mathjs";
import { directionOf, operatingTime, measurementFromSequence } from "../../../src/protection/index.ts";
import type { SequenceQuantities, Phasor } from "../../../src/protection/index.ts";
import { relay } from "./devices.ts";

const P = (c: math.Complex): Phasor => ({ re: c.re, im: c.im });
const zero = { re: 0, im: 0 };

/** Sequence set where I1 sits at `angle_deg` from the quadrature polarising voltage -jV1. */
function phaseCase(angle_deg: number): SequenceQuantities {
  const v1 = math.complex({ r: 0.6, phi: 0.3 });
  const pol = math.multiply(math.complex(0, -1), v1) as math.Complex;
  const i1 = math.complex({ r: 800, phi: (math.arg(pol) as number) + (angle_deg * Math.PI) / 180 });
  return { i0_A: zero, i1_A: P(i1), i2_A: zero, v0_pu: zero, v1_pu: P(v1), v2_pu: zero };
}

describe("67 phase directional element (I1 against -jV1)", () => {
  const fn = { quantity: "phase" as const, rca_deg: 45 };

  it("is forward at the characteristic angle and reverse opposite it", () => {
    expect(directionOf(fn, phaseCase(45)).direction).toBe("forward"); // maximum torque at rca (definition)
    expect(directionOf(fn, phaseCase(45 + 180)).direction).toBe("reverse"); // opposite of rca
  });

  it("switches at rca +/- 90 degrees", () => {
    // torque ~ cos(angle - rca): positive inside +/-90 deg, negative outside (definition of the cosine characteristic)
    expect(directionOf(fn, phaseCase(45 + 89)).direction).toBe("forward");
    expect(directionOf(fn, phaseCase(45 - 89)).direction).toBe("forward");
    expect(directionOf(fn, phaseCase(45 + 91)).direction).toBe("reverse");
    expect(directionOf(fn, phaseCase(45 - 91)).direction).toBe("reverse");
  });

  it("decides a three-phase fault on a radial feeder from the network, computed independently with mathjs", () => {
    // Source E = 1 pu behind Zs, relay at the bus looking into a line ZL (angle 70 deg); fault at the line end.
    const zs = math.complex(0.01, 0.1);
    const zl = math.complex({ r: 0.2, phi: (70 * Math.PI) / 180 });
    const i1 = math.divide(1, math.add(zs, zl)) as math.Complex; // forward: flows from the bus into the line
    const v1 = math.multiply(i1, zl) as math.Complex; // voltage at the relay bus
    const fwd: SequenceQuantities = { i0_A: zero, i1_A: P(math.multiply(i1, 1000) as math.Complex), i2_A: zero, v0_pu: zero, v1_pu: P(v1), v2_pu: zero };
    expect(directionOf(fn, fwd).direction).toBe("forward"); // I1 lags V1 by 70 deg: leads -jV1 by 20 deg, within 45 +/- 90
    // Fault behind the relay fed from a remote source through the line: current flows out of the line into the bus.
    const rev: SequenceQuantities = { ...fwd, i1_A: P(math.multiply(i1, -1000) as math.Complex) };
    expect(directionOf(fn, rev).direction).toBe("reverse");
  });

  it("operates a forward-set 67 on a forward fault and not on a reverse fault", () => {
    const r = relay([{ id: "D", ansi: "67", quantity: "phase", curve: "definite-time", pickup_A: 300, delay_s: 0.1, direction: "forward", rca_deg: 45 }]);
    const fwd = measurementFromSequence(phaseCase(30));
    const rev = measurementFromSequence(phaseCase(30 + 180));
    expect(operatingTime(r, fwd).trip_s).toBe(0.1);
    const res = operatingTime(r, rev);
    expect(res.picked).toBe(false);
    expect(res.reason).toContain("sees reverse");
  });

  it("is undetermined without polarising voltage (no memory), so the element does not operate", () => {
    const seq = { ...phaseCase(45), v1_pu: zero };
    expect(directionOf(fn, seq).direction).toBe("undetermined"); // project choice: no voltage memory
  });
});

describe("67N residual directional element", () => {
  const fn = { quantity: "residual" as const, rca_deg: -60 };

  it("uses -3V0 polarisation when V0 is present", () => {
    // Solidly earthed source behind the relay: -3V0 = 3I0 * Z0s, so 3I0 lags -3V0 by the Z0s angle (75 deg here).
    const i0 = math.complex({ r: 100, phi: -0.5 });
    const z0s = math.complex({ r: 0.002, phi: (75 * Math.PI) / 180 });
    const v0 = math.multiply(math.multiply(i0, z0s), -1) as math.Complex; // V0 = -I0 Z0s for a forward fault
    const seq: SequenceQuantities = { i0_A: P(i0), i1_A: zero, i2_A: zero, v0_pu: P(v0), v1_pu: { re: 1, im: 0 }, v2_pu: zero };
    const d = directionOf(fn, seq);
    expect(d.polarisation).toBe("3I0 against -3V0");
    expect(d.angle_deg).toBeCloseTo(-75, 9); // angle of 3I0 relative to -3V0 = -arg(Z0s) (mathjs computation above)
    expect(d.direction).toBe("forward");
    expect(directionOf(fn, { ...seq, i0_A: P(math.multiply(i0, -1) as math.Complex) }).direction).toBe("reverse");
  });

  it("falls back to negative-sequence polarisation (I2 against -V2) when V0 is too small", () => {
    const i2 = math.complex({ r: 50, phi: -1.2 });
    const v2 = math.complex({ r: 0.1, phi: -1.2 + Math.PI + (60 * Math.PI) / 180 }); // -V2 leads I2 by 60 deg
    const seq: SequenceQuantities = { i0_A: { re: 30, im: 0 }, i1_A: zero, i2_A: P(i2), v0_pu: { re: 0.001, im: 0 }, v1_pu: { re: 1, im: 0 }, v2_pu: P(v2) };
    const d = directionOf(fn, seq);
    expect(d.polarisation).toContain("I2 against -V2");
    expect(d.angle_deg).toBeCloseTo(-60, 9); // constructed angle
    expect(d.direction).toBe("forward");
  });
});

describe("measurement from sequence quantities", () => {
  it("reproduces the handbook single line-to-ground fault: I0 = I1 = I2 = -j3.034 pu gives Ia = -j9.102 pu, Ib = Ic = 0", () => {
    const i = { re: 0, im: -3.034 }; // The Electric Power Engineering Handbook, fault analysis example (reference-checks)
    const m = measurementFromSequence({ i0_A: i, i1_A: i, i2_A: i, v0_pu: zero, v1_pu: zero, v2_pu: zero });
    expect(m.phase_A[0]).toBeCloseTo(9.102, 9);
    expect(m.phase_A[1]).toBeCloseTo(0, 9);
    expect(m.phase_A[2]).toBeCloseTo(0, 9);
    expect(m.residual_A).toBeCloseTo(9.102, 9); // |3 I0|
    expect(m.negative_A).toBeCloseTo(3.034, 9);
  });

  it("agrees with the symmetrical-component transform computed with mathjs", () => {
    const a = math.complex({ r: 1, phi: (2 * Math.PI) / 3 });
    const seq = [math.complex(10, -5), math.complex(300, -200), math.complex(-40, 25)];
    const a2 = math.multiply(a, a) as math.Complex;
    const rows = [
      [1, 1, 1],
      [1, a2, a],
      [1, a, a2],
    ] as const;
    const abc = rows.map((row) => row.reduce<math.Complex>((acc, coef, k) => math.add(acc, math.multiply(coef, seq[k]) as math.Complex) as math.Complex, math.complex(0, 0)));
    const m = measurementFromSequence({ i0_A: P(seq[0]), i1_A: P(seq[1]), i2_A: P(seq[2]), v0_pu: zero, v1_pu: zero, v2_pu: zero });
    abc.forEach((c, k) => expect(m.phase_A[k]).toBeCloseTo(math.abs(c) as unknown as number, 9));
  });
});
