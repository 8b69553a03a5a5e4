import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, sweepFaults, sweepDeviceCurrents } from "../../../src/engine/index.ts";
import { generateRadialNetwork, GENERATED_SCENARIOS } from "../../../src/model/generateNetwork.ts";

describe("all-bus sweep on a generated network with converters", () => {
  for (const inverterModel of ["iec", "refined"] as const) {
    it(`gives every device the currents of the one-by-one solution to 1e-9 (${inverterModel} inverter model)`, () => {
      const project = generateRadialNetwork({ buses: 120, devices: 60, seed: 17 });
      const r = compileNetwork(project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
      if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
      const net = r.network;
      const sweep = sweepFaults(net, { inverterModel });
      expect(sweep.devices.length).toBeGreaterThan(20);
      let checked = 0;
      for (let b = 0; b < sweep.busIds.length; b += 9) {
        for (let t = 0; t < sweep.types.length; t++) {
          // Reference: the one-fault solver (column solves per fault, checked against the phase-domain solver in
          // tests/unit/engine/abc); the sweep uses reciprocity, block solves and the compact iteration instead.
          const one = solveFault(net, { kind: "bus", bus: sweep.busIds[b] }, sweep.types[t], { inverterModel, detail: "devices" });
          expect(sweep.ikss_kA[b * sweep.types.length + t]).toBeCloseTo(one.ikss_kA, 9);
          const ends = new Map([...one.branchEnds, ...one.shunts].map((e) => [`${e.element}|${e.end}`, e]));
          sweep.devices.forEach((dev, d) => {
            const ref = ends.get(`${dev.element}|${dev.end}`);
            if (!ref) return;
            const got = sweepDeviceCurrents(sweep, d, b, t);
            for (let p = 0; p < 3; p++) {
              const scale = 1 + ref.phase_A[p].mag;
              expect(Math.abs(got.phase_A[p].mag - ref.phase_A[p].mag) / scale).toBeLessThan(1e-9);
            }
            checked++;
          });
        }
      }
      expect(checked).toBeGreaterThan(500);
    });
  }
});
