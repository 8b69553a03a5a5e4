import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { buildChains } from "../../../src/study/chains.ts";
import { deviceResponse } from "../../../src/study/deviceResponse.ts";
import { deviceSides } from "../../../src/study/deviceSides.ts";
import { protectionModel } from "../../../src/study/protectionModel.ts";
import { scenarioNetwork } from "../../../src/study/scenarioNetwork.ts";
import { findSourcePaths } from "../../../src/study/sourcePaths.ts";
import { makeProject, reading3ph } from "./fixtures.ts";

// Random radial networks: bus 0 holds the grid; bus k > 0 hangs from a random earlier bus through line Lk,
// which may carry a relay at its sending end. The nearest device to a fault at bus f is found independently
// by climbing the parent pointers from f towards bus 0 and taking the first line with a relay.
const treeArb = fc
  .integer({ min: 2, max: 25 })
  .chain((n) =>
    fc.record({
      parents: fc.tuple(...Array.from({ length: n - 1 }, (_, k) => fc.integer({ min: 0, max: k }))),
      relays: fc.array(fc.boolean(), { minLength: n - 1, maxLength: n - 1 }),
      fault: fc.integer({ min: 0, max: n - 1 }),
    }),
  );

describe("primary/backup chains on random radial networks", () => {
  it("always start at the device nearest the fault on the way to the source", () => {
    const model = protectionModel();
    fc.assert(
      fc.property(treeArb, ({ parents, relays, fault }) => {
        const n = parents.length + 1;
        const elements: unknown[] = [{ kind: "grid", id: "G", bus: "b0", skMax_MVA: 100, skMin_MVA: 80 }];
        for (let k = 0; k < n; k++) elements.push({ kind: "bus", id: `b${k}`, un_kV: 11 });
        parents.forEach((p, j) => {
          const k = j + 1;
          elements.push({ kind: "line", id: `L${k}`, fromBus: `b${p}`, toBus: `b${k}`, length_km: 1, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.3, x0_ohmPerKm: 0.3, csa_mm2: 95, ampacity_A: 200 });
          if (relays[j])
            elements.push({
              kind: "relay", id: `R${k}`, at: { element: `L${k}`, end: "from" }, ctPrimary_A: 200,
              functions: [{ id: "51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 100, multiplier: 0.1 }],
            });
        });
        const project = makeProject(elements);
        const net = scenarioNetwork(project, project.scenarios[0]);
        const loc = { kind: "bus" as const, bus: `b${fault}` };
        const paths = findSourcePaths(net, loc);
        const responses = new Map([...net.devices.values()].map((d) => [d.id, deviceResponse(d, reading3ph(1000, "forward"), model)] as const));
        const { chains } = buildChains("c", net, paths, responses, deviceSides(net));
        // independent walk up the tree
        const expected: string[] = [];
        for (let b = fault; b !== 0; b = parents[b - 1]) if (relays[b - 1]) expected.push(`R${b}`);
        expect(chains.paths).toHaveLength(1);
        expect(chains.paths[0].links.map((l) => l.device)).toEqual(expected);
        if (expected.length) expect(chains.paths[0].links[0].role).toBe("primary");
        expect(chains.idealIsolation).toEqual(expected.slice(0, 1));
      }),
      { numRuns: 200, seed: 20261202 },
    );
  });
});
