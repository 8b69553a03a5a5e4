import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { generateRadialNetwork, generateMeshedNetwork, GENERATED_SCENARIOS } from "../../../src/model/generateNetwork.ts";
import { projectSchema, elementBuses, type Element, type Project } from "../../../src/model/schema.ts";
import { compileNetwork } from "../../../src/engine/index.ts";
import { validateProject } from "../../../src/model/validate.ts";

const byKind = <K extends Element["kind"]>(p: Project, kind: K) => p.elements.filter((e): e is Extract<Element, { kind: K }> => e.kind === kind);

/** Number of connected components of the bus graph (union-find over lines and transformers). */
function components(p: Project): number {
  const buses = byKind(p, "bus").map((b) => b.id);
  const parent = new Map(buses.map((b) => [b, b]));
  const find = (x: string): string => {
    while (parent.get(x) !== x) x = parent.get(x) as string;
    return x;
  };
  for (const e of p.elements) {
    if (e.kind !== "line" && e.kind !== "transformer") continue;
    const [a, b] = elementBuses(e);
    parent.set(find(a), find(b));
  }
  return new Set(buses.map(find)).size;
}

describe("generateRadialNetwork", () => {
  it("returns a project that the document schema accepts, for any size and seed", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 120 }), fc.integer({ min: 0, max: 60 }), fc.integer(), (buses, devices, seed) => {
        const p = generateRadialNetwork({ buses, devices, seed });
        expect(() => projectSchema.parse(p)).not.toThrow();
      }),
      { numRuns: 40 },
    );
  });

  it("is deterministic: the same seed gives the same project and another seed a different one", () => {
    const a = generateRadialNetwork({ buses: 200, devices: 50, seed: 11 });
    const b = generateRadialNetwork({ buses: 200, devices: 50, seed: 11 });
    const c = generateRadialNetwork({ buses: 200, devices: 50, seed: 12 });
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
    expect(JSON.stringify(a)).not.toBe(JSON.stringify(c));
  });

  it("has exactly the requested buses, a tree of branches (buses - 1, one component) and unique ids", () => {
    for (const buses of [2, 37, 1000]) {
      const p = generateRadialNetwork({ buses, devices: 100, seed: buses });
      expect(byKind(p, "bus").length).toBe(buses);
      expect(byKind(p, "line").length + byKind(p, "transformer").length).toBe(buses - 1); // a tree on n nodes has n - 1 edges (graph theory)
      expect(components(p)).toBe(1);
      const ids = p.elements.map((e) => e.id);
      expect(new Set(ids).size).toBe(ids.length);
    }
  });

  it("places at most the requested number of devices, all at ends of existing branches", () => {
    const p = generateRadialNetwork({ buses: 1000, devices: 500, seed: 5 });
    const devices = p.elements.filter((e) => e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker");
    expect(devices.length).toBe(500);
    const branches = new Set(p.elements.filter((e) => e.kind === "line" || e.kind === "transformer").map((e) => e.id));
    for (const d of devices) if ("at" in d) expect(branches.has(d.at.element)).toBe(true);
    expect(generateRadialNetwork({ buses: 10, devices: 500, seed: 5 }).elements.filter((e) => e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker").length).toBeLessThanOrEqual(2 * 9);
  });

  it("connects every element to existing buses of the matching voltage", () => {
    const p = generateRadialNetwork({ buses: 500, devices: 100, seed: 9 });
    const un = new Map(byKind(p, "bus").map((b) => [b.id, b.un_kV]));
    for (const e of p.elements) for (const b of elementBuses(e)) expect(un.has(b)).toBe(true);
    for (const t of byKind(p, "transformer")) {
      expect(un.get(t.hvBus)).toBe(t.urHv_kV);
      expect(un.get(t.lvBus)).toBe(t.urLv_kV);
    }
    for (const g of [...byKind(p, "generator"), ...byKind(p, "inverter")]) expect(un.get(g.bus)).toBe(g.ur_kV);
  });

  it("offers a grid-tied and an islanded scenario, the islanded one with the grid feeder out and a generator left", () => {
    const p = generateRadialNetwork({ buses: 50, devices: 10, seed: 1 });
    const island = p.scenarios.find((s) => s.id === GENERATED_SCENARIOS.islanded);
    expect(p.scenarios.map((s) => s.id)).toContain(GENERATED_SCENARIOS.gridTied);
    expect(island?.outOfService).toEqual(byKind(p, "grid").map((g) => g.id));
    expect(byKind(p, "generator").length).toBeGreaterThan(0);
  });

  it("sets relay phase pickups that a three-phase fault at the far end of the relay's cable exceeds by 1.5x, even islanded", () => {
    // Independent check: complex series impedance from the generator (the weaker source) to the cable's far bus,
    // I"k = c U / (sqrt(3) |Z|) with c = 0.95 (IEC 60909-0:2016 three-phase formula; cmin of Table 1 for LV, below cmin for MV).
    // Margin 1.5 // common practice: end-of-zone fault current at least 1.5-2x pickup.
    const p = generateRadialNetwork({ buses: 300, devices: 120, seed: 21 });
    const sBase = p.meta.baseMVA;
    const gen = byKind(p, "generator")[0];
    const zgX = (gen.xdss_pu * sBase) / gen.sr_MVA;
    const zIn = new Map<string, [number, number]>([[gen.bus, [gen.rx * zgX, zgX]]]);
    const un = new Map(byKind(p, "bus").map((b) => [b.id, b.un_kV]));
    const branches = p.elements.filter((e) => e.kind === "line" || e.kind === "transformer");
    // branches are listed parent-first, so one pass accumulates the path impedance
    for (const br of branches) {
      const [a, b] = elementBuses(br);
      const za = zIn.get(a) as [number, number];
      let dz: [number, number];
      if (br.kind === "line") {
        const zb = (un.get(a) as number) ** 2 / sBase;
        dz = [(br.r1_ohmPerKm * br.length_km) / zb, (br.x1_ohmPerKm * br.length_km) / zb];
      } else {
        const z = ((br.uk_pct / 100) * sBase) / br.sr_MVA;
        const r = ((br.ur_pct / 100) * sBase) / br.sr_MVA;
        dz = [r, Math.sqrt(z * z - r * r)];
      }
      zIn.set(b, [za[0] + dz[0], za[1] + dz[1]]);
    }
    const relays = byKind(p, "relay");
    expect(relays.length).toBeGreaterThan(10);
    for (const r of relays) {
      const br = branches.find((e) => e.id === r.at.element) as Element;
      const far = elementBuses(br)[1];
      const z = zIn.get(far) as [number, number];
      const u = un.get(far) as number;
      const ik_A = (0.95 * (sBase * 1000)) / (Math.sqrt(3) * u) / Math.hypot(z[0], z[1]);
      const phase = r.functions.find((f) => f.quantity === "phase");
      expect(phase).toBeDefined();
      expect(ik_A / (phase?.pickup_A ?? Infinity)).toBeGreaterThanOrEqual(1.5);
    }
  });

  it("passes the project's validation rules without an error or a warning", () => {
    for (const p of [generateRadialNetwork({ buses: 400, devices: 150, seed: 13 }), generateMeshedNetwork({ buses: 300, devices: 100, seed: 13 })]) {
      expect(validateProject(p).filter((m) => m.severity !== "info")).toEqual([]);
    }
  });

  it("compiles in both scenarios with every bus fed by a source (no dead island, no input error)", () => {
    for (const p of [generateRadialNetwork({ buses: 300, devices: 60, seed: 3 }), generateMeshedNetwork({ buses: 200, devices: 60, seed: 3 })]) {
      for (const scenario of [GENERATED_SCENARIOS.gridTied, GENERATED_SCENARIOS.islanded]) {
        for (const limit of ["max", "min"] as const) {
          const r = compileNetwork(p, { scenario, limit });
          expect(r.ok, `${p.meta.name} ${scenario} ${limit}: ${r.ok ? "" : r.errors.map((e) => e.text).join("; ")}`).toBe(true);
          if (r.ok) expect(r.network.messages.filter((m) => m.code === "dead-island")).toEqual([]);
        }
      }
    }
  });

  it("lays out every element at a finite position, buses deeper in the tree lower on the page", () => {
    const p = generateRadialNetwork({ buses: 2000, devices: 300, seed: 4 });
    for (const e of p.elements) {
      const pos = p.layout[e.id];
      expect(pos, e.id).toBeDefined();
      expect(Number.isFinite(pos.x) && Number.isFinite(pos.y)).toBe(true);
    }
    for (const l of byKind(p, "line")) expect(p.layout[l.toBus].y).toBeGreaterThan(p.layout[l.fromBus].y);
    // no two buses on the same spot
    const spots = new Set(byKind(p, "bus").map((b) => `${p.layout[b.id].x},${p.layout[b.id].y}`));
    expect(spots.size).toBe(2000);
  });

  it("refuses bad options with a message naming the option", () => {
    expect(() => generateRadialNetwork({ buses: 1, devices: 0, seed: 1 })).toThrow(/buses must be an integer >= 2 \(got 1\)/);
    expect(() => generateRadialNetwork({ buses: 10, devices: -1, seed: 1 })).toThrow(/devices/);
    expect(() => generateRadialNetwork({ buses: 10, devices: 1, seed: Number.NaN })).toThrow(/seed/);
  });
});

describe("generateMeshedNetwork", () => {
  it("adds tie cables that close loops: branches = buses - 1 + ties, still one component, schema-valid", () => {
    const p = generateMeshedNetwork({ buses: 500, devices: 100, seed: 8, ties: 25 });
    projectSchema.parse(p);
    const ties = byKind(p, "line").filter((l) => l.id.startsWith("tie-"));
    expect(ties.length).toBe(25);
    expect(byKind(p, "line").length + byKind(p, "transformer").length).toBe(500 - 1 + 25); // cyclomatic number = ties (graph theory)
    expect(components(p)).toBe(1);
    for (const t of ties) expect(t.fromBus).not.toBe(t.toBus);
  });
});
