import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, FAULT_TYPES, type CompiledNetwork } from "../../../src/engine/index.ts";
import { generateMeshedNetwork, generateRadialNetwork, GENERATED_SCENARIOS } from "../../../src/model/generateNetwork.ts";
import type { Project } from "../../../src/model/schema.ts";

function compile(project: Project): CompiledNetwork {
  const r = compileNetwork(project, { scenario: GENERATED_SCENARIOS.gridTied, limit: "max" });
  if (!r.ok) throw new Error(r.errors.map((e) => e.text).join("; "));
  return r.network;
}

const deviceLocations = (p: Project) =>
  p.elements.flatMap((e) => (e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker" ? [`${e.at.element}|${e.at.end}`] : []));

describe('fault results with detail "devices"', () => {
  const cases: [string, Project][] = [
    ["radial", generateRadialNetwork({ buses: 80, devices: 40, seed: 3 })],
    ["meshed", generateMeshedNetwork({ buses: 60, devices: 40, seed: 5 })],
  ];
  for (const [label, project] of cases) {
    it(`list exactly the device branch ends, with the values of the full result (${label} generated network)`, () => {
      const net = compile(project);
      const wanted = new Set(deviceLocations(project).filter((k) => !k.endsWith("|terminal")));
      expect(wanted.size).toBeGreaterThan(5);
      const nb = net.nodes.length;
      for (const i of [0, Math.floor(nb / 2), nb - 1]) {
        const bus = net.nodes[i].buses[0];
        for (const type of FAULT_TYPES) {
          for (const inverterModel of ["iec", "refined"] as const) {
            // Reference: the default full result (itself checked against the phase-domain solver in tests/unit/engine/abc).
            const full = solveFault(net, { kind: "bus", bus }, type, { inverterModel });
            const slim = solveFault(net, { kind: "bus", bus }, type, { inverterModel, detail: "devices" });
            const fullEnds = full.branchEnds.filter((e) => wanted.has(`${e.element}|${e.end}`));
            expect(slim.branchEnds.length).toBe(fullEnds.length);
            expect(slim.branchEnds).toEqual(fullEnds);
            expect(slim.shunts).toEqual(full.shunts);
            const { branchEnds: _a, buses: _b, ...restSlim } = slim;
            const { branchEnds: _c, buses: _d, ...restFull } = full;
            expect(restSlim).toEqual(restFull);
            // Voltages: the faulted bus and every listed end's bus, the same as in the full result.
            const fullBuses = new Map(full.buses.map((b) => [b.bus, b]));
            expect(slim.buses.some((b) => b.bus === bus)).toBe(true);
            for (const e of slim.branchEnds) expect(slim.buses.some((b) => b.bus === e.bus)).toBe(true);
            for (const b of slim.buses) expect(b).toEqual(fullBuses.get(b.bus));
          }
        }
      }
    });
  }
});
