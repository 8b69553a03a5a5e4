// Values the engine cannot compute with are refused at load, naming the element and the field, instead of
// reaching the engine and coming back as 0 A or a crash (the cases of the hardening report: S"k 1e308 MVA,
// uk 1e-300 %, a base of 1e-300 MVA, a pickup of 1e-300 A, 10,000 line points, 2,000 scenarios).
// The demo still loads, so the ranges hold real data.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { loadProject } from "../../../src/model/projectFile.ts";
import { MAX_LINE_POINTS, MAX_SCENARIOS } from "../../../src/model/schema.ts";
import { elementById, smallDoc } from "./fixtures/smallProject.ts";

const load = (doc: unknown) => loadProject(JSON.stringify(doc));
const messages = (doc: unknown): string[] => {
  const r = load(doc);
  return r.ok ? [] : r.error.messages;
};
const escape = (t: string) => t.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
/** A message naming `element`, then the field (perhaps with a human label around it), then `rule`. */
const naming = (element: string, field: string, rule: string) => expect.stringMatching(new RegExp(`^${escape(element)}.*${escape(field)}.* ${escape(rule)}$`));

describe("physical ranges", () => {
  it("loads the demo with its ranges", () => {
    const r = loadProject(readFileSync("assets/demo/dairy-coop.islet", "utf8"));
    expect(r.ok).toBe(true);
  });

  it('refuses an S"k of 1e308 MVA', () => {
    const doc = smallDoc();
    Object.assign(elementById(doc, "G"), { skMax_MVA: 1e308 });
    expect(messages(doc)).toEqual([naming('Grid feeder G "Utility"', "skMax_MVA", 'must be <= 1000000000000 (got 1e+308)')]);
  });

  it("refuses a uk of 1e-300 %", () => {
    const doc = smallDoc();
    Object.assign(elementById(doc, "T1"), { uk_pct: 1e-300 });
    expect(messages(doc)).toEqual([naming('Transformer T1 "Main transformer"', "uk_pct", 'must be >= 0.1 (got 1e-300)')]);
  });

  it("refuses a base of 1e-300 MVA", () => {
    const doc = smallDoc();
    (doc.meta as Record<string, unknown>).baseMVA = 1e-300;
    expect(messages(doc)).toEqual([naming("Project ", "baseMVA", "must be >= 0.001 (got 1e-300)")]);
  });

  it("refuses a relay pickup of 1e-300 A", () => {
    const doc = smallDoc();
    (elementById(doc, "RT").functions as Record<string, unknown>[])[0].pickup_A = 1e-300;
    expect(messages(doc)).toEqual([naming('Relay RT "Transformer relay"', "functions.0.pickup_A", 'must be >= 0.001 (got 1e-300)')]);
  });

  it("still says > 0 for zero and negative quantities", () => {
    const doc = smallDoc();
    Object.assign(elementById(doc, "C12"), { length_km: -3 });
    expect(messages(doc)).toEqual([naming('Cable C12 "Dock feeder"', "length_km", 'must be > 0 (got -3)')]);
  });

  it("refuses impedances and ratings far outside any real plant", () => {
    const doc = smallDoc();
    Object.assign(elementById(doc, "C12"), { x1_ohmPerKm: 1e300 });
    Object.assign(elementById(doc, "GEN"), { xdss_pu: 1e-300 });
    expect(messages(doc)).toEqual([naming('Cable C12 "Dock feeder"', "x1_ohmPerKm", 'must be <= 1000 (got 1e+300)'), naming('Generator GEN "Genset"', "xdss_pu", 'must be >= 0.001 (got 1e-300)')]);
  });

  it(`bounds the line points at ${MAX_LINE_POINTS} and the scenarios at ${MAX_SCENARIOS}`, () => {
    const doc = smallDoc();
    doc.criteria = { linePoints_pct: Array.from({ length: 10000 }, (_, k) => (k + 1) / 101) };
    doc.scenarios = Array.from({ length: 2000 }, (_, k) => ({ id: `s${k}`, name: `Scenario ${k}` }));
    expect(messages(doc)).toEqual([naming("Criteria", "linePoints_pct", `must have at most ${MAX_LINE_POINTS} items (got 10000)`), naming("Project", "scenarios", `must have at most ${MAX_SCENARIOS} items (got 2000)`)]);
    doc.criteria = { linePoints_pct: Array.from({ length: MAX_LINE_POINTS }, (_, k) => 5 * (k + 1)) };
    doc.scenarios = doc.scenarios.slice(0, MAX_SCENARIOS);
    expect(load(doc).ok).toBe(true);
  });
});
