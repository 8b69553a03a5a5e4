import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, sweepFaults, sweepDeviceCurrents, sweepDeviceCurrentsInto } from "../../../src/engine/index.ts";
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

describe("allocation-free sweep read", () => {
  it("writes exactly the sequence currents, and the phase magnitudes to rounding, that the object read returns", () => {
    // Same network as above; the reference is sweepDeviceCurrents, whose phases follow from the
    // symmetrical-component transform Ia = I0 + I1 + I2, Ib = I0 + a^2 I1 + a I2, Ic = I0 + a I1 + a^2 I2 (Fortescue).
    const project = generateRadialNetwork({ buses: 60, devices: 30, seed: 5 });
    const r = compileNetwork(project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
    if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
    const sweep = sweepFaults(r.network, { inverterModel: "refined" });
    const out = new Float64Array(9);
    let checked = 0;
    for (let b = 0; b < sweep.busIds.length; b += 3)
      for (let t = 0; t < sweep.types.length; t++)
        for (let d = 0; d < sweep.devices.length; d++) {
          const ref = sweepDeviceCurrents(sweep, d, b, t);
          sweepDeviceCurrentsInto(sweep, d, b, t, out);
          for (let s = 0; s < 3; s++) {
            expect(out[2 * s]).toBe(ref.seq_A[s].re);
            expect(out[2 * s + 1]).toBe(ref.seq_A[s].im);
            // the magnitude by a plain square root, Math.hypot's to within rounding
            expect(Math.abs(out[6 + s] - ref.phase_A[s].mag)).toBeLessThanOrEqual(4e-16 * ref.phase_A[s].mag);
          }
          checked++;
        }
    expect(checked).toBeGreaterThan(500);
  });
});

describe("sweep of a few buses", () => {
  it("gives the same device currents, bit for bit, as the sweep of every bus", () => {
    // Internal consistency of the two storage layouts (rows of every node solved in place, or just the swept
    // buses' rows copied out); both are checked against the one-fault solver above.
    const project = generateRadialNetwork({ buses: 80, devices: 40, seed: 11 });
    const r = compileNetwork(project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
    if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
    const full = sweepFaults(r.network, { inverterModel: "refined" });
    const picked = [full.busIds[70], full.busIds[3], full.busIds[41]];
    const few = sweepFaults(r.network, { inverterModel: "refined", buses: picked });
    expect(few.deviceData.transferRows).toBe(3);
    expect(full.deviceData.transferRows).toBeGreaterThanOrEqual(full.busIds.length);
    const a = new Float64Array(9);
    const b = new Float64Array(9);
    let nonZero = 0;
    picked.forEach((bus, k) => {
      const bf = full.busIds.indexOf(bus);
      for (let t = 0; t < full.types.length; t++)
        for (let d = 0; d < full.devices.length; d++) {
          sweepDeviceCurrentsInto(full, d, bf, t, a);
          sweepDeviceCurrentsInto(few, d, k, t, b);
          for (let q = 0; q < 9; q++) expect(b[q]).toBe(a[q]);
          if (a[6] > 1) nonZero++;
        }
    });
    expect(nonZero).toBeGreaterThan(20);
  });
});

describe("sweep with the negative sequence derived from the positive", () => {
  it("gives a relay at the generator's terminal, and every other device, the one-by-one currents to 1e-9", () => {
    // The generated generator has X(2) != X"d: the two networks differ at its node only, so the sweep derives the
    // negative-sequence responses (negativeFromPositive.ts); a relay at the generator terminal also changes its own
    // combination between the sequences. Reference: the one-fault solver, which solves each sequence directly.
    const project = generateRadialNetwork({ buses: 90, devices: 30, seed: 29 });
    const relay = project.elements.find((e) => e.kind === "relay");
    if (!relay || relay.kind !== "relay") throw new Error("the generated network has no relay");
    project.elements.push({ ...relay, id: "rly-gen", name: "Generator relay", at: { element: "gen-1", end: "terminal" } });
    const r = compileNetwork(project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
    if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
    for (const inverterModel of ["iec", "refined"] as const) {
      const sweep = sweepFaults(r.network, { inverterModel });
      expect(sweep.deviceData.negative?.rank).toBe(1);
      const gen = sweep.devices.findIndex((d) => d.element === "gen-1");
      expect(gen).toBeGreaterThanOrEqual(0);
      let checked = 0;
      for (let b = 0; b < sweep.busIds.length; b += 5)
        for (let t = 0; t < sweep.types.length; t++) {
          const one = solveFault(r.network, { kind: "bus", bus: sweep.busIds[b] }, sweep.types[t], { inverterModel, detail: "devices" });
          const ends = new Map([...one.branchEnds, ...one.shunts].map((e) => [`${e.element}|${e.end}`, e]));
          sweep.devices.forEach((dev, d) => {
            const ref = ends.get(`${dev.element}|${dev.end}`);
            if (!ref) return;
            const got = sweepDeviceCurrents(sweep, d, b, t);
            for (let s = 0; s < 3; s++) {
              const scale = 1 + ref.seq_A[s].mag;
              expect(Math.abs(got.seq_A[s].re - ref.seq_A[s].mag * Math.cos((ref.seq_A[s].ang_deg * Math.PI) / 180)) / scale).toBeLessThan(1e-9);
              expect(Math.abs(got.seq_A[s].im - ref.seq_A[s].mag * Math.sin((ref.seq_A[s].ang_deg * Math.PI) / 180)) / scale).toBeLessThan(1e-9);
            }
            if (d === gen && ref.seq_A[2].mag > 1) checked++;
          });
        }
      // the generator relay sees negative-sequence current in the unbalanced faults
      expect(checked).toBeGreaterThan(20);
    }
  });
});
