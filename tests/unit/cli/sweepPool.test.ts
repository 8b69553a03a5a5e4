import { afterAll, describe, expect, it } from "vitest";
import { sweepFaults, sweepDeviceCurrentsInto } from "../../../src/engine/index.ts";
import { generateRadialNetwork, GENERATED_SCENARIOS } from "../../../src/model/generateNetwork.ts";
import { SweepPool } from "../../../src/cli/parallel/sweepPool.ts";

const pool = new SweepPool(3);
// Only workers: the shares are claimed by two worker threads, so their path is certainly exercised.
const workersOnly = new SweepPool(3, { callerWorks: false });
afterAll(() => Promise.all([pool.close(), workersOnly.close()]));

describe("sweep shared among threads", () => {
  for (const [inverterModel, p, who] of [
    ["refined", pool, "the caller and two workers"],
    ["iec", pool, "the caller and two workers"],
    ["refined", workersOnly, "two workers"],
  ] as const)
    it(`gives the single-thread sweep's result bit for bit (${inverterModel} converter model, ${who})`, async () => {
      // Internal consistency: the threads run the same arithmetic on claimed shares of the work; the single-thread
      // sweep itself is checked against the one-fault solver (tests/unit/engine/sweepGenerated.test.ts).
      const project = generateRadialNetwork({ buses: 300, devices: 90, seed: 23 });
      const net = p.load("p300", project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
      const one = sweepFaults(net.network, { inverterModel });
      const par = await p.sweep(net, { inverterModel });
      expect(par.busIds).toEqual(one.busIds);
      expect(par.devices).toEqual(one.devices);
      expect(par.messages).toEqual(one.messages);
      for (const k of ["ikss_kA", "maxPhase_kA", "ip_kA", "xr"] as const) expect(Array.from(par[k])).toEqual(Array.from(one[k]));
      const a = new Float64Array(9);
      const b = new Float64Array(9);
      let nonZero = 0;
      for (let bus = 0; bus < one.busIds.length; bus += 7)
        for (let t = 0; t < one.types.length; t++)
          for (let d = 0; d < one.devices.length; d++) {
            sweepDeviceCurrentsInto(one, d, bus, t, a);
            sweepDeviceCurrentsInto(par, d, bus, t, b);
            expect(Array.from(b)).toEqual(Array.from(a));
            if (a[6] > 1) nonZero++;
          }
      expect(nonZero).toBeGreaterThan(1000);
    });

  it("says which network is missing instead of hanging", async () => {
    const project = generateRadialNetwork({ buses: 20, devices: 5, seed: 1 });
    const net = pool.load("small", project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
    await expect(pool.sweep({ ...net, key: "never-loaded" })).rejects.toThrow(/never-loaded/);
  });
});
