import { describe, it, expect } from "vitest";
import { toOverlay } from "../../../renderer/fault/toOverlay.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import type { FaultResult, Phasor } from "../../../src/engine/index.ts";

const ph = (mag: number): Phasor => ({ mag, ang_deg: 0 });
const triple = (a: number, b: number, c: number): [Phasor, Phasor, Phasor] => [ph(a), ph(b), ph(c)];

function result(): FaultResult {
  return {
    location: { kind: "bus", bus: "B2" },
    faultType: "LG",
    ikss_kA: 12.5,
    buses: [
      { bus: "B1", un_kV: 11, phase_kV: triple(0, 0, 0), phase_pu: triple(0.95, 0.97, 0.99), seq_pu: triple(0.02, 0.96, 0.02), energized: true },
      { bus: "B2", un_kV: 0.4, phase_kV: triple(0, 0, 0), phase_pu: triple(0, 1.02, 1.01), seq_pu: triple(0.33, 0.66, 0.33), energized: true },
    ],
    branchEnds: [
      { element: "T1", end: "from", bus: "B1", seq_A: triple(0, 1, 0), phase_A: triple(300, 120, 150) },
      { element: "T1", end: "to", bus: "B2", seq_A: triple(0, 1, 0), phase_A: triple(8000, 10, 10) },
      { element: "C9", end: "from", bus: "B2", seq_A: triple(0, 0, 0), phase_A: triple(0.1, 0.1, 0.1) },
    ],
    shunts: [{ element: "G1", end: "terminal", bus: "B2", seq_A: triple(0, 1, 0), phase_A: triple(900, 400, 400) }],
  } as unknown as FaultResult;
}

describe("the fault overlay drawn on the one-line", () => {
  const overlay = toOverlay(newProject("t"), result(), null);

  it("takes each bus's lowest phase voltage", () => {
    expect(overlay.busVoltages_pu).toEqual({ B1: 0.95, B2: 0 });
  });

  it("points a branch's current from the end whose voltage held up towards the faulted end", () => {
    expect(overlay.flows.T1).toEqual({ i_A: 300, towards: "b" });
  });

  it("shows a source's current flowing into its bus and leaves out currents below half an ampere", () => {
    expect(overlay.flows.G1).toEqual({ i_A: 900, towards: "a" });
    expect(overlay.flows.C9).toBeUndefined();
  });

  it("labels the fault with its type and place and carries I\"k", () => {
    expect(overlay.ikss_kA).toBe(12.5);
    expect(overlay.label).toBe("LG fault on bus B2");
  });
});
