import { describe, expect, it } from "vitest";
import { autoCurrentDomain } from "../../../renderer/panes/tcc/autoCurrentDomain.ts";
import type { CurvePoint, TccBand } from "../../../renderer/panes/tcc/tccTypes.ts";

const band = (start_A: number, end_A: number): TccBand => {
  const pts: CurvePoint[] = [
    [start_A, 100],
    [end_A, 0.1],
  ];
  return { deviceId: "d", functionId: "f", deviceName: "d", functionLabel: "", pickup_A: 1, nominal: pts, min: pts, max: pts };
};

describe("current range of the time-current plot", () => {
  it("runs from half the lowest curve start to three times the largest fault current", () => {
    // lo 0.5 * 160 = 80 A -> 10 A decade; hi max(3 * 20 kA, 10 * 320 A) = 60 kA -> 100 kA decade (hand calculation)
    const d = autoCurrentDomain([band(160, 5000), band(320, 9000)], [], [{ id: "m", label: "", current_A: 20000 }], []);
    expect(d).toEqual([10, 100000]);
  });

  it("keeps a curve that starts above a small islanded fault current in view up to its knee", () => {
    // fault 2 kA -> 6 kA, but a curve starting at 11 kA needs 110 kA -> 1 MA decade (hand calculation)
    const d = autoCurrentDomain([band(11000, 200000)], [], [{ id: "m", label: "", current_A: 2000 }], []);
    expect(d[1]).toBe(1e6);
  });

  it("lets equipment widen the range downwards but never upwards", () => {
    // a cable withstand at 0.4 kV from 9.6 kA up to 264 kA: only its lowest current counts (0.8 * 9600 = 7680 A)
    const cable = { id: "c", name: "c", kind: "cable-damage" as const, points: [[9600, 5], [264000, 0.01]] as CurvePoint[] };
    const withCable = autoCurrentDomain([band(300, 3000)], [cable], [{ id: "m", label: "", current_A: 2000 }], []);
    const without = autoCurrentDomain([band(300, 3000)], [], [{ id: "m", label: "", current_A: 2000 }], []);
    expect(withCable).toEqual(without);
  });

  it("falls back to 10 A .. 10 kA with nothing to draw", () => {
    expect(autoCurrentDomain([], [], [], [])).toEqual([10, 10000]);
  });
});
