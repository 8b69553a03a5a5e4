// Property tests of the loader against random and mutated files (fast-check). The properties are the
// format's guarantees: loading never throws; every error message names something the user can find
// (an element id or index, a path/field, or the JSON position); a load-save-load round trip changes nothing,
// unknown fields included.
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { readFileSync } from "node:fs";
import { loadProject, serializeProject, type LoadResult } from "../../../src/model/projectFile.ts";

const demoText = readFileSync(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8");
const demo = JSON.parse(demoText) as { elements: Record<string, unknown>[] } & Record<string, unknown>;

const SUBJECT =
  /^(Project file|Project settings \(meta\)|Study settings \(study\)|Criteria \(criteria\)|Layout of (?:\S+|"(?:[^"\\]|\\.)*")|Scenario (?:\S+|"(?:[^"\\]|\\.)*")|Bus|Grid feeder|Transformer|Cable|Overhead line|Generator|Inverter|Motor|Load|Switch|Relay|Fuse|LV breaker|Element(?: of kind "(?:[^"\\]|\\.)*")?)[ :]/;

/** A message is helpful when it starts with what it is about and then says what is wrong. */
function assertHelpful(r: LoadResult): void {
  if (r.ok) return;
  expect(r.error.messages.length).toBeGreaterThan(0);
  for (const m of r.error.messages) {
    expect(m, m).toMatch(SUBJECT);
    expect(m, m).toMatch(/: \S/);
    if (r.error.kind === "invalidJson") expect(m).toMatch(/line \d+, column \d+ \(character \d+\)/);
    if (r.error.kind === "invalidRecords" && !m.startsWith("Project file")) {
      // names an element (id or index) or a settings block together with a field
      expect(m, m).toMatch(/^(\S+ )+?(\S+|\(no id\)).*: \S/);
    }
  }
}

function assertRoundTrip(r: LoadResult): void {
  if (!r.ok) return;
  const text = serializeProject(r.project);
  const again = loadProject(text);
  expect(again.ok).toBe(true);
  if (!again.ok) return;
  expect(again.project).toEqual(r.project);
  expect(serializeProject(again.project)).toBe(text);
}

function safeLoad(text: string): LoadResult {
  let r: LoadResult | undefined;
  expect(() => {
    r = loadProject(text);
  }).not.toThrow();
  return r!;
}

// JSON values without -0 (JSON text cannot carry -0 through a save, and the loader is not asked to)
const jsonValue = fc.jsonValue().map((v) => JSON.parse(JSON.stringify(v)) as unknown);
const fieldValue = fc.oneof(
  jsonValue,
  fc.string(),
  fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => (x === 0 ? 0 : x)),
  fc.integer({ min: -5, max: 5 }),
  fc.constantFrom(null, true, false, "", [], {}),
);

type Mutation =
  | { op: "delete"; index: number; key: number }
  | { op: "set"; index: number; key: number; value: unknown }
  | { op: "add"; index: number; name: string; value: unknown }
  | { op: "top"; key: number; value: unknown };

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ op: fc.constant("delete" as const), index: fc.nat(), key: fc.nat() }),
  fc.record({ op: fc.constant("set" as const), index: fc.nat(), key: fc.nat(), value: fieldValue }),
  fc.record({ op: fc.constant("add" as const), index: fc.nat(), name: fc.string({ minLength: 1 }), value: jsonValue }),
  fc.record({ op: fc.constant("top" as const), key: fc.nat(), value: fieldValue }),
);

function mutate(m: Mutation, base: typeof demo = demo): { text: string; elementId?: string; field?: string } {
  const doc = structuredClone(base);
  if (!Array.isArray(doc.elements) || doc.elements.length === 0 || m.op === "top") {
    const keys = Object.keys(doc);
    const key = keys[(m.op === "top" ? m.key : 0) % keys.length];
    if (m.op === "top") doc[key] = m.value;
    return { text: JSON.stringify(doc) };
  }
  const element = doc.elements[m.index % doc.elements.length];
  if (typeof element !== "object" || element === null || Array.isArray(element)) return { text: JSON.stringify(doc) };
  const id = element.id as string;
  const keys = Object.keys(element);
  if (m.op === "add") {
    if (Object.hasOwn(element, m.name)) return { text: JSON.stringify(doc) };
    element[m.name] = m.value;
    return { text: JSON.stringify(doc), elementId: id, field: m.name };
  }
  const key = keys[m.key % keys.length];
  if (m.op === "delete") delete element[key];
  else element[key] = m.value;
  return { text: JSON.stringify(doc), elementId: id, field: key };
}

describe("loadProject on random input", () => {
  it("never throws on random text and explains every failure", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 200 }), (text) => {
        assertHelpful(safeLoad(text));
      }),
      { numRuns: 300 },
    );
  });

  it("never throws on random JSON and explains every failure", () => {
    fc.assert(
      fc.property(jsonValue, (value) => {
        assertHelpful(safeLoad(JSON.stringify(value) ?? "null"));
      }),
      { numRuns: 300 },
    );
  });

  it("never throws on random JSON inside an Islet envelope", () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), jsonValue), (extra) => {
        const r = safeLoad(JSON.stringify({ ...extra, format: "islet-project", formatVersion: 1 }));
        assertHelpful(r);
        assertRoundTrip(r);
      }),
      { numRuns: 200 },
    );
  });
});

describe("loadProject on mutated copies of the demo", () => {
  it("never throws, names the mutated element in schema errors and round-trips what it accepts", () => {
    fc.assert(
      fc.property(fc.array(mutation, { minLength: 1, maxLength: 3 }), (mutations) => {
        let text = JSON.stringify(demo);
        for (const m of mutations) text = mutate(m, JSON.parse(text)).text;
        const r = safeLoad(text);
        assertHelpful(r);
        assertRoundTrip(r);
      }),
      { numRuns: 150 },
    );
  });

  it("names the element and field of a single broken field", () => {
    fc.assert(
      fc.property(mutation, (m) => {
        const { text, elementId, field } = mutate(m);
        const r = safeLoad(text);
        assertHelpful(r);
        assertRoundTrip(r);
        if (!r.ok && r.error.kind === "invalidRecords" && elementId && field && field !== "id" && m.op !== "top") {
          expect(r.error.messages.some((msg) => msg.includes(elementId)), r.error.messages.join("\n")).toBe(true);
        }
      }),
      { numRuns: 400 },
    );
  });

  it("explains a truncated file by its position", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: demoText.length - 2 }), (cut) => {
        const r = safeLoad(demoText.slice(0, cut));
        expect(r.ok).toBe(false);
        if (!r.ok) {
          expect(r.error.kind).toBe("invalidJson");
          expect(r.error.messages[0]).toContain(`(character ${cut})`);
        }
      }),
      { numRuns: 200 },
    );
  });

  it("keeps an added unknown field with its exact value through load, save and load", () => {
    fc.assert(
      fc.property(fc.nat(), fc.string({ minLength: 1 }).filter((k) => k !== "__proto__"), jsonValue, (index, name, value) => {
        const doc = structuredClone(demo);
        const element = doc.elements[index % doc.elements.length];
        fc.pre(!Object.hasOwn(element, name));
        element[name] = value;
        const r = safeLoad(JSON.stringify(doc));
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        const back = loadProject(serializeProject(r.project));
        expect(back.ok && (back.project.elements[index % doc.elements.length] as Record<string, unknown>)[name]).toEqual(value);
      }),
      { numRuns: 200 },
    );
  });
});
