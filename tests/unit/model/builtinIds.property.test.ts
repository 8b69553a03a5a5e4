// Ids are the user's words: an id that happens to name a property of Object.prototype ("constructor",
// "toString", "__proto__", ...) must mean what any other id means. The check is a relabelling invariance:
// renaming elements and scenarios (fast-check draws which element gets which name, fixed seed) changes
// no computed figure, no island and no drawn position. The reference is the same project with plain ids.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { loadProject } from "../../../src/model/projectFile.ts";
import type { Project } from "../../../src/model/schema.ts";
import { findIslands } from "../../../src/model/topology.ts";
import { busFaultTable } from "../../../src/engine/index.ts";
import { engineSolver } from "../../../src/study/engineSolver.ts";
import { oneLineSvg } from "../../../src/report/oneLineSvg.ts";
import { toFlow } from "../../../renderer/canvas/toFlow.ts";

const BUILTIN_NAMES = ["constructor", "toString", "hasOwnProperty", "__proto__", "valueOf", "isPrototypeOf", "propertyIsEnumerable", "toLocaleString", "__defineGetter__"];

/** LV-A and LV-B joined by a normally open coupler; a genset on each side, a grid behind a transformer on A. */
function baseDoc() {
  return {
    format: "islet-project",
    formatVersion: 1,
    meta: { name: "Built-in ids" },
    elements: [
      { kind: "bus", id: "MV", name: "MV board", un_kV: 11 },
      { kind: "bus", id: "LVA", name: "LV section A", un_kV: 0.4 },
      { kind: "bus", id: "LVB", name: "LV section B", un_kV: 0.4 },
      { kind: "grid", id: "G", name: "Utility", bus: "MV", skMax_MVA: 100, skMin_MVA: 60 },
      { kind: "transformer", id: "T1", name: "Main transformer", hvBus: "MV", lvBus: "LVA", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 },
      { kind: "switch", id: "BC", name: "Coupler", busA: "LVA", busB: "LVB", closed: false },
      { kind: "generator", id: "GA", name: "Genset A", bus: "LVA", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.14, x2_pu: 0.14, x0_pu: 0.06 },
      { kind: "generator", id: "GB", name: "Genset B", bus: "LVB", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.14, x2_pu: 0.14, x0_pu: 0.06 },
      { kind: "relay", id: "RT", name: "Transformer relay", at: { element: "T1", end: "to" }, ctPrimary_A: 1500, functions: [{ id: "f51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 1500, multiplier: 0.1 }] },
      { kind: "relay", id: "RC", name: "Genset B relay", at: { element: "GB", end: "terminal" }, ctPrimary_A: 1000, functions: [{ id: "f51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 800, multiplier: 0.1 }] },
    ],
    scenarios: [
      { id: "S1", name: "Coupler as drawn" },
      { id: "S2", name: "Coupler closed", switchStates: { BC: true } },
    ],
    layout: {
      MV: { x: 300, y: 60, w: 200 },
      LVA: { x: 200, y: 300, w: 240 },
      LVB: { x: 600, y: 300, w: 240 },
      G: { x: 300, y: -40 },
      T1: { x: 300, y: 180 },
      BC: { x: 400, y: 300 },
      GA: { x: 150, y: 420 },
      GB: { x: 650, y: 420 },
    },
  };
}
const ELEMENT_IDS = baseDoc().elements.map((e) => e.id);
const SCENARIO_IDS = ["S1", "S2"];

/** The document with ids renamed: every string equal to an old id and every layout / switchStates key. */
function relabel(rename: Map<string, string>): string {
  const map = (v: unknown): unknown => {
    if (typeof v === "string") return rename.get(v) ?? v;
    if (Array.isArray(v)) return v.map(map);
    if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, k === "name" || k === "kind" ? x : map(x)]));
    return v;
  };
  const doc = baseDoc();
  const out = { ...doc, elements: map(doc.elements), scenarios: doc.scenarios.map((s) => ({ ...(map(s) as object), switchStates: Object.fromEntries(Object.entries(s.switchStates ?? {}).map(([k, x]) => [rename.get(k) ?? k, x])) })) };
  // JSON text, as a file holds it: a "__proto__" key is then an ordinary (own) key for the loader to see
  const layoutText = Object.entries(doc.layout).map(([k, p]) => `${JSON.stringify(rename.get(k) ?? k)}:${JSON.stringify(p)}`).join(",");
  const text = JSON.stringify(out);
  return `${text.slice(0, -1)},"layout":{${layoutText}}}`;
}

function load(rename: Map<string, string>): Project {
  const r = loadProject(relabel(rename));
  if (!r.ok) throw new Error(r.error.messages.join("\n"));
  return r.project;
}

// Element ids are keys of layout and switchStates, so "__proto__" is refused there (checked below); scenario ids are not keys.
const ELEMENT_NAMES = BUILTIN_NAMES.filter((n) => n !== "__proto__");
const renames = fc
  .tuple(
    fc.subarray(ELEMENT_IDS, { maxLength: ELEMENT_NAMES.length }).chain((ids) => fc.shuffledSubarray(ELEMENT_NAMES, { minLength: ids.length, maxLength: ids.length }).map((names) => ids.map((id, k) => [id, names[k]] as const))),
    fc.subarray(SCENARIO_IDS).chain((ids) => fc.shuffledSubarray(BUILTIN_NAMES, { minLength: ids.length, maxLength: ids.length }).map((names) => ids.map((id, k) => [id, names[k]] as const))),
  )
  .map(([elements, scenarios]) => new Map([...elements, ...scenarios]))
  .filter((m) => m.size > 0 && new Set(m.values()).size === m.size);

describe("ids that name Object.prototype properties", () => {
  const plain = load(new Map());
  const plainTable = busFaultTable(plain);

  it("the plain project has an open coupler: LVA's three-phase I\"k differs as drawn and with the coupler closed", () => {
    const lva = (run: number) => plainTable.runs[run].buses.find((b) => b.bus === "LVA")!.ikss_kA["3ph"];
    // S1 (max, min) then S2 (max, min); closing the coupler adds genset B's infeed
    expect(lva(2)).toBeGreaterThan(lva(0) * 1.05);
  });

  it("give the same islands, fault currents, device readings and drawn positions as plain ids", () => {
    fc.assert(
      fc.property(renames, (rename) => {
        const back = new Map([...rename].map(([a, b]) => [b, a]));
        const orig = (id: string) => back.get(id) ?? id;
        const p = load(rename);
        // islands
        for (const [k, s] of p.scenarios.entries()) {
          const islands = findIslands(p, s).map((i) => ({ buses: i.buses.map(orig), sources: i.sources.map(orig) }));
          expect(islands).toEqual(findIslands(plain, plain.scenarios[k]));
        }
        // bus fault table
        const table = busFaultTable(p);
        expect(table.runs.map((r) => ({ ...r, scenario: orig(r.scenario), buses: r.buses.map((b) => ({ ...b, bus: orig(b.bus) })), messages: [] }))).toEqual(
          plainTable.runs.map((r) => ({ ...r, messages: [] })),
        );
        // the study's device readings at every bus
        const solver = engineSolver(p);
        const plainSolver = engineSolver(plain);
        for (const [k, s] of p.scenarios.entries()) {
          const at = (q: Project) => q.elements.filter((e) => e.kind === "bus").map((e) => ({ kind: "bus" as const, bus: e.id }));
          const got = solver.solveMany(s, at(p), "3ph", "max");
          const want = plainSolver.solveMany(plain.scenarios[k], at(plain), "3ph", "max");
          expect(got.map((g) => g.iFault_A)).toEqual(want.map((w) => w.iFault_A));
          expect(got.map((g) => Object.fromEntries(Object.entries(g.readings).map(([id, r]) => [orig(id), r.m.phase_A])))).toEqual(
            want.map((w) => Object.fromEntries(Object.entries(w.readings).map(([id, r]) => [id, r.m.phase_A]))),
          );
        }
        // the report's one-line and the studio's canvas place every element at finite coordinates
        expect(oneLineSvg(p)).not.toMatch(/NaN|undefined|Infinity/);
        const nodes = toFlow(p, [], null).nodes;
        for (const node of nodes) expect(Number.isFinite(node.position.x) && Number.isFinite(node.position.y)).toBe(true);
        const plainNodes = new Map(toFlow(plain, [], null).nodes.map((nd) => [nd.id, nd.position]));
        for (const node of nodes) expect(node.position).toEqual(plainNodes.get(orig(node.id)));
      }),
      // the cases of the report this test answers: the open coupler named "constructor", a bus named "toString"
      { numRuns: 40, examples: [[new Map([["BC", "constructor"]])], [new Map([["LVB", "toString"]])], [new Map([["GB", "hasOwnProperty"], ["S2", "__proto__"]])]] },
    );
  });

  it("refuses an element id \"__proto__\", naming the element and the field", () => {
    const r = loadProject(relabel(new Map([["LVB", "__proto__"]])));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.messages).toContain('Bus __proto__ "LV section B": id "__proto__" is reserved (as a key of layout and switchStates it would not be kept); choose another id');
  });
});
