// Property: in a radial network fed from one grid, with no generator or converter in service, the expected
// isolation of every fault is exactly the first automatically tripping device met walking from the fault
// towards the grid (radial protection practice, IEEE Std 242 ch. 15, from memory). The reference walk below
// is written apart from the study's zone logic: a breadth-first tree from the grid, then the path up from the fault.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { generateRadialNetwork, GENERATED_SCENARIOS } from "../../../src/model/generateNetwork.ts";
import type { Project } from "../../../src/model/schema.ts";
import { planScenario } from "../../../src/study/pipeline/scenarioPlan.ts";
import { across, elementNode } from "../../../src/study/scenarioNetwork.ts";
import "../setup/fastCheckSeed.ts";

/** The generated site grid-tied with its generator and converters switched out. */
function gridOnly(seed: number, buses: number): Project {
  const p = generateRadialNetwork({ buses, devices: Math.max(4, Math.floor(buses / 4)), seed });
  const machines = p.elements.filter((e) => e.kind === "generator" || e.kind === "inverter").map((e) => e.id);
  const grid = p.scenarios.find((s) => s.id === GENERATED_SCENARIOS.gridTied)!;
  return { ...p, scenarios: [{ ...grid, outOfService: [...grid.outOfService, ...machines] }] };
}

describe("the expected isolation in radial networks fed from one grid", () => {
  it("is exactly the first tripping device upstream of every fault", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 12, max: 80 }), (seed, buses) => {
        const project = gridOnly(seed, buses);
        const relays = project.elements.filter((e) => e.kind === "relay");
        // non-directional protection only: the property is about position, not direction
        for (const r of relays) if (r.kind === "relay") for (const f of r.functions) expect(f.direction).toBe("non-directional");
        const sp = planScenario(project, project.scenarios[0], ["LG"], {});
        const net = sp.net;
        expect(net.sources.length).toBe(1);
        // reference: the edge leading one step towards the grid from every node
        const root = elementNode(net.sources[0]);
        const toward = new Map<string, number>([[root, -1]]);
        const queue = [root];
        for (let q = 0; q < queue.length; q++)
          for (const i of net.adjacency.get(queue[q]) ?? []) {
            const next = across(net.edges[i], queue[q]);
            if (!toward.has(next)) {
              toward.set(next, i);
              queue.push(next);
            }
          }
        const plans = sp.plans.get("LG")!;
        sp.nodes.forEach((node, k) => {
          let expected: string[] = [];
          for (let at = node; at !== root; ) {
            const i = toward.get(at);
            if (i === undefined) break;
            const devices = net.edges[i].devices;
            if (devices.length > 0) {
              expected = [...devices].sort();
              break;
            }
            at = across(net.edges[i], at);
          }
          expect([...plans[k].plan.devices].sort(), `fault at ${node}`).toEqual(expected);
        });
      }),
      { numRuns: 40 },
    );
  });
});
