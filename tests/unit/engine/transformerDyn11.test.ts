import { describe, expect, it } from "vitest";
import { complex, abs, add, multiply, type Complex as MComplex } from "mathjs";
import { compileNetwork, solveFault, transformerKT, type CompiledNetwork } from "../../../src/engine/index.ts";
import { buildProject, bus, toRect, wrapDeg } from "./helpers/projectBuilder.ts";

// Grid 11 kV, S"k max 250 MVA, R/X 0.1; transformer 1 MVA 11/0.4 kV, uk 6 %, ur 1 %, Dyn11, LV solidly earthed.
// Hand calculation referred to 0.4 kV (IEC 60909-0:2016, 6.2 and 6.3), with mathjs complex arithmetic:
//   ZQ = cQ UnLV^2 / S"k = 1.1 * 0.16 / 250 ohm, X = Z / sqrt(1 + 0.1^2), R = 0.1 X
//   ZT = uk UrLV^2 / Sr, RT = ur UrLV^2 / Sr, XT = sqrt(ZT^2 - RT^2); KT = 0.95 cmax / (1 + 0.6 xT), cmax 1.10 (LV, +10 %)
//   Z1 = ZQ + KT ZT; Z0 = KT ZT (the delta winding blocks the grid's zero sequence)
//   I"k3 = c Un / (sqrt3 |Z1|), I"k1 = 3 c Un / (sqrt3 |2 Z1 + Z0|), c = 1.10 at the LV fault
const un = 0.4;
const zq = 1.1 * 0.16 / 250;
const xq = zq / Math.sqrt(1.01);
const ZQ = complex(0.1 * xq, xq);
const zt = (0.06 * 0.16) / 1;
const rt = (0.01 * 0.16) / 1;
const xt = Math.sqrt(zt * zt - rt * rt);
const kt = transformerKT(Math.sqrt(0.06 ** 2 - 0.01 ** 2), 1.1);
const ZT = complex(rt * kt, xt * kt);
const Z1 = add(ZQ, ZT) as MComplex;
const I3_kA = (1.1 * un) / (Math.sqrt(3) * (abs(Z1) as unknown as number));
const I1_kA = (3 * 1.1 * un) / (Math.sqrt(3) * (abs(add(multiply(2, Z1), ZT) as MComplex) as unknown as number));

const p = buildProject([
  bus("HV", 11),
  bus("LV", 0.4),
  { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 250, skMin_MVA: 150, rx: 0.1 },
  { kind: "transformer", id: "T1", name: "Dock transformer", hvBus: "HV", lvBus: "LV", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 1, vectorGroup: "Dyn11" },
]);
const c = compileNetwork(p, { limit: "max" });
if (!c.ok) throw new Error("compile");
const net: CompiledNetwork = c.network;
const end = (r: ReturnType<typeof solveFault>, e: "from" | "to") => r.branchEnds.find((x) => x.element === "T1" && x.end === e)!;

describe("faults on the LV side of a Dyn11 transformer fed by a grid", () => {
  it("gives the hand-calculated three-phase current", () => {
    const r = solveFault(net, { kind: "bus", bus: "LV" }, "3ph");
    expect(r.ikss_kA).toBeCloseTo(I3_kA, 9); // hand calculation above
    expect(r.xr).toBeCloseTo(Z1.im / Z1.re, 9);
    expect(r.peakMethod).toBe("radial-branch-sum");
  });

  it("gives the hand-calculated line-to-earth current", () => {
    const r = solveFault(net, { kind: "bus", bus: "LV" }, "LG");
    expect(r.ikss_kA).toBeCloseTo(I1_kA, 9); // hand calculation above
  });

  it("carries no zero-sequence current on the delta side during an LV earth fault", () => {
    const r = solveFault(net, { kind: "bus", bus: "LV" }, "LG");
    const hv = end(r, "from");
    expect(hv.seq_A[0].mag).toBeLessThan(1e-9); // delta winding: zero sequence circulates inside it
    // Known pattern (e.g. any protection handbook's Dyn earth-fault table): two HV phases carry I_f (0.4/11)/sqrt3,
    // in opposite directions, the third none.
    const mags = hv.phase_A.map((x) => x.mag).sort((a, b) => a - b);
    const expected = (r.ikss_kA * 1000 * (0.4 / 11)) / Math.sqrt(3);
    expect(mags[0]).toBeLessThan(1e-6 * expected);
    expect(mags[1]).toBeCloseTo(expected, 6);
    expect(mags[2]).toBeCloseTo(expected, 6);
    const big = hv.phase_A.filter((x) => x.mag > 1);
    expect(Math.abs(wrapDeg(big[0].ang_deg - big[1].ang_deg))).toBeCloseTo(180, 6);
  });

  it("shifts the positive sequence by 30 degrees: LV leads HV for Dyn11", () => {
    // IEC 60076-1 clock notation: hour 11 means the LV phasor lags by 330 degrees, i.e. leads by 30 degrees.
    const r = solveFault(net, { kind: "bus", bus: "LV" }, "3ph");
    const hv = end(r, "from");
    const lv = end(r, "to");
    // Current flowing through: into the HV terminal, out of the LV terminal (= minus the LV end current).
    const through = wrapDeg(lv.seq_A[1].ang_deg + 180);
    expect(wrapDeg(through - hv.seq_A[1].ang_deg)).toBeCloseTo(30, 9);
    // Magnitudes follow the rated ratio (power balance of an ideal transformer).
    expect(hv.seq_A[1].mag).toBeCloseTo((lv.seq_A[1].mag * 0.4) / 11, 6);
  });

  it("refers angles to the faulted bus and rotates the negative sequence the other way", () => {
    const r = solveFault(net, { kind: "bus", bus: "LV" }, "LL");
    const hv = end(r, "from");
    const lv = end(r, "to");
    expect(wrapDeg(wrapDeg(lv.seq_A[1].ang_deg + 180) - hv.seq_A[1].ang_deg)).toBeCloseTo(30, 9);
    expect(wrapDeg(wrapDeg(lv.seq_A[2].ang_deg + 180) - hv.seq_A[2].ang_deg)).toBeCloseTo(-30, 9);
    // HV bus voltages keep a positive-sequence component shifted by -30 degrees from the LV side's reference.
    const hvBus = r.buses.find((b) => b.bus === "HV")!;
    expect(wrapDeg(hvBus.seq_pu[1].ang_deg)).toBeLessThan(0);
  });

  it("gives the earth current a solid LV neutral returns", () => {
    const r = solveFault(net, { kind: "bus", bus: "LV" }, "LG");
    const lv = end(r, "to");
    const i0 = toRect(lv.seq_A[0]);
    const f0 = toRect(r.faultSeq_kA[0]);
    // All zero-sequence current at the LV bus enters the transformer's earthed star (it is the only path).
    expect(Math.hypot(i0.re + f0.re * 1000, i0.im + f0.im * 1000)).toBeLessThan(1e-6 * lv.seq_A[0].mag);
  });

  it("gives c Un / (sqrt3 |Z1|) at the minimum limit with cmin 0.95 and S\"k min", () => {
    const cm = compileNetwork(p, { limit: "min" });
    if (!cm.ok) throw new Error("compile");
    // IEC 60909-0:2016: min uses cmin (0.95 LV), S"k min; KT stays as for max (as the project applies it).
    const zqMin = (1.0 * 0.16) / 150;
    const xqm = zqMin / Math.sqrt(1.01);
    const Z1m = add(complex(0.1 * xqm, xqm), ZT) as MComplex;
    const expected = (0.95 * un) / (Math.sqrt(3) * (abs(Z1m) as unknown as number));
    expect(solveFault(cm.network, { kind: "bus", bus: "LV" }, "3ph").ikss_kA).toBeCloseTo(expected, 9); // hand calculation
  });
});
