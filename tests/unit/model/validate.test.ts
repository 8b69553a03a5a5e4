import { describe, it, expect } from "vitest";
import { validateProject } from "../../../src/model/validate.ts";
import type { Message } from "../../../src/model/messages.ts";
import { smallDoc, elementById } from "./fixtures/smallProject.ts";

const errors = (ms: Message[]) => ms.filter((m) => m.severity === "error");
const warnings = (ms: Message[]) => ms.filter((m) => m.severity === "warning");

describe("validateProject on a sound project", () => {
  it("reports no errors and no warnings", () => {
    expect(validateProject(smallDoc())).toEqual([]);
  });
});

describe("schema-level errors", () => {
  it('name the element and field: Cable C12 "Dock feeder": length_km must be > 0 (got -3)', () => {
    const doc = smallDoc();
    elementById(doc, "C12").length_km = -3;
    const ms = validateProject(doc);
    // the wording the project's house rules give as the model message
    expect(ms).toContainEqual({ severity: "error", elementId: "C12", field: "length_km", text: 'Cable C12 "Dock feeder": length_km must be > 0 (got -3)' });
  });

  it("name the element by its position when it has no id", () => {
    const doc = smallDoc();
    delete elementById(doc, "LD").id;
    const texts = validateProject(doc).map((m) => m.text);
    expect(texts).toContain('Load (no id) "Dock load" (elements[7]): id is missing (expected a string)');
  });

  it("report an unknown element kind with the known kinds", () => {
    const doc = smallDoc();
    elementById(doc, "LD").kind = "capacitor";
    const [m] = validateProject(doc);
    expect(m.elementId).toBe("LD");
    expect(m.field).toBe("kind");
    expect(m.text).toMatch(/^Element of kind "capacitor" LD "Dock load": unknown kind "capacitor"; known kinds: "bus", "grid"/);
  });

  it("report a wrong type with the value received", () => {
    const doc = smallDoc();
    elementById(doc, "T1").uk_pct = "six";
    expect(validateProject(doc)).toContainEqual({
      severity: "error",
      elementId: "T1",
      field: "uk_pct",
      text: 'Transformer T1 "Main transformer": uk_pct must be a number (got "six")',
    });
  });

  it("report nested fields by their dotted path", () => {
    const doc = smallDoc();
    (elementById(doc, "RT").functions as Record<string, unknown>[])[1].pickup_A = 0;
    expect(validateProject(doc)).toContainEqual({
      severity: "error",
      elementId: "RT",
      field: "functions.1.pickup_A",
      text: 'Relay RT "Transformer relay": functions.1.pickup_A must be > 0 (got 0)',
    });
  });
});

describe("schema-level errors outside elements", () => {
  it("list the allowed values of a choice and name the settings block", () => {
    const doc = smallDoc();
    elementById(doc, "RT").ctSecondary_A = 2;
    doc.meta = { name: "x", frequency_Hz: 55 };
    doc.study = { lvTolerance_pct: 8 };
    const texts = validateProject(doc).map((m) => m.text);
    // allowed values as declared in schema.ts (CT secondaries 1 A / 5 A; 50/60 Hz; IEC 60909-0 LV tolerance 6 % / 10 %)
    expect(texts).toEqual([
      "Project settings (meta): frequency_Hz must be one of 50, 60 (got 55)",
      "Study settings (study): lvTolerance_pct must be one of 6, 10 (got 8)",
      'Relay RT "Transformer relay": ctSecondary_A must be one of 1, 5 (got 2)',
    ]);
  });

  it("name scenarios and layout entries", () => {
    const doc = smallDoc();
    doc.scenarios[0].limits = [];
    doc.layout = { MV: { x: "a", y: 0 } };
    expect(validateProject(doc)).toEqual([
      { severity: "error", elementId: "S1", field: "limits", text: 'Scenario S1 "Grid-tied": limits must have at least 1 item (got 0)' },
      { severity: "error", elementId: "MV", field: "x", text: 'Layout of MV: x must be a number (got "a")' },
    ]);
  });
});

describe("unique ids", () => {
  it("flags a second element with the same id", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "load", id: "LD", name: "Second load", bus: "DOCK", p_kW: 1, q_kvar: 0 });
    const ms = errors(validateProject(doc));
    expect(ms).toHaveLength(1);
    expect(ms[0]).toMatchObject({ elementId: "LD", field: "id" });
    expect(ms[0].text).toBe('Load LD "Second load": id "LD" is already used by elements[7] (ids must be unique; this is elements[10])');
  });

  it("flags duplicate scenario ids and duplicate function ids within a relay", () => {
    const doc = smallDoc();
    doc.scenarios.push({ id: "S1", name: "Copy" });
    (elementById(doc, "RT").functions as Record<string, unknown>[])[1].id = "f51";
    const texts = errors(validateProject(doc)).map((m) => m.text);
    expect(texts).toContain('Scenario S1 "Copy": id "S1" is used by more than one scenario');
    expect(texts).toContain('Relay RT "Transformer relay": functions.1.id "f51" is used by another function of this relay');
  });
});

describe("dangling references", () => {
  it("flags a bus field naming nothing", () => {
    const doc = smallDoc();
    elementById(doc, "C12").toBus = "NOWHERE";
    expect(errors(validateProject(doc))).toContainEqual({
      severity: "error",
      elementId: "C12",
      field: "toBus",
      text: 'Cable C12 "Dock feeder": toBus "NOWHERE" names no element in the project (dangling reference)',
    });
  });

  it("flags a bus field naming something that is not a bus", () => {
    const doc = smallDoc();
    elementById(doc, "LD").bus = "T1";
    expect(errors(validateProject(doc)).map((m) => m.text)).toContain('Load LD "Dock load": bus "T1" names a transformer, not a bus');
  });

  it("flags a device at a missing element, at a bus, and with the wrong end", () => {
    const doc = smallDoc();
    elementById(doc, "QF").at = { element: "C99", end: "from" };
    elementById(doc, "RT").at = { element: "T1", end: "terminal" };
    doc.elements.push({ kind: "fuse", id: "FU", name: "Gen fuse", at: { element: "GEN", end: "to" }, rating_A: 100 });
    doc.elements.push({ kind: "fuse", id: "FB", at: { element: "LV", end: "terminal" }, rating_A: 100 });
    const byId = Object.fromEntries(errors(validateProject(doc)).map((m) => [m.elementId, m]));
    expect(byId.QF).toMatchObject({ field: "at.element", text: 'LV breaker QF "Dock breaker": at.element "C99" names no element in the project (dangling reference)' });
    expect(byId.RT).toMatchObject({ field: "at.end", text: 'Relay RT "Transformer relay": at.end must be "from" or "to" for a transformer (Transformer T1 "Main transformer"), got "terminal"' });
    expect(byId.FU).toMatchObject({ field: "at.end", text: 'Fuse FU "Gen fuse": at.end must be "terminal" for a generator (Generator GEN "Genset"), got "to"' });
    expect(byId.FB).toMatchObject({ field: "at.element" });
    expect(byId.FB.text).toContain("names a bus; a protective device sits at a branch end or a shunt element's terminal");
  });

  it("lets a protective device sit at a breaker-type switch, and refuses a load switch, a disconnector and the terminal end", () => {
    const doc = smallDoc();
    const lv = "LV";
    doc.elements.push({ kind: "bus", id: "LV2", un_kV: elementById(doc, lv).un_kV });
    doc.elements.push({ kind: "switch", id: "CB", name: "Coupler", device: "breaker", busA: lv, busB: "LV2", closed: true });
    doc.elements.push({ kind: "switch", id: "LS", device: "switch", busA: lv, busB: "LV2", closed: false });
    doc.elements.push({ kind: "switch", id: "DS", device: "disconnector", busA: lv, busB: "LV2", closed: false });
    doc.elements.push({ kind: "lvbreaker", id: "Q-CB", at: { element: "CB", end: "from" }, in_A: 800, longTime: { ir_x: 1, tr_s: 10 } });
    doc.elements.push({ kind: "lvbreaker", id: "Q-LS", at: { element: "LS", end: "from" }, in_A: 800, longTime: { ir_x: 1, tr_s: 10 } });
    doc.elements.push({ kind: "relay", id: "R-DS", at: { element: "DS", end: "to" }, ctPrimary_A: 400, functions: [] });
    doc.elements.push({ kind: "fuse", id: "F-CB", at: { element: "CB", end: "terminal" }, rating_A: 100 });
    const byId = Object.fromEntries(errors(validateProject(doc)).map((m) => [m.elementId, m]));
    expect(byId["Q-CB"]).toBeUndefined();
    expect(byId["Q-LS"]).toMatchObject({ field: "at.element" });
    expect(byId["Q-LS"].text).toContain("is a load switch");
    expect(byId["R-DS"].text).toContain("is a disconnector");
    expect(byId["F-CB"]).toMatchObject({ field: "at.end" });
  });

  it("flags scenario references to missing elements and switch overrides on non-switches", () => {
    const doc = smallDoc();
    doc.scenarios[1].outOfService = ["G", "GHOST"];
    doc.scenarios[1].switchStates = { T1: false };
    const texts = errors(validateProject(doc)).map((m) => m.text);
    expect(texts).toContain('Scenario S2 "Islanded": outOfService.1 "GHOST" names no element in the project (dangling reference)');
    expect(texts).toContain('Scenario S2 "Islanded": switchStates.T1 names a transformer, not a switch');
  });

  it("flags criteria pairs that do not name protective devices", () => {
    const doc = smallDoc();
    doc.criteria = { pairCti: [{ primary: "QF", backup: "T1", cti_s: 0.2 }] };
    expect(errors(validateProject(doc)).map((m) => m.text)).toEqual(['Criteria (criteria): pairCti.0.backup "T1" names a transformer, not a protective device']);
  });
});

describe("the 10 % rated-voltage rule", () => {
  // 10 % band: common practice for equipment rating vs system nominal voltage (the rule the project sets)
  it("accepts a transformer LV rating of 0.42 kV on a 0.4 kV bus (5 %) and 0.44 kV (exactly 10 %)", () => {
    const doc = smallDoc();
    elementById(doc, "T1").urLv_kV = 0.42;
    expect(errors(validateProject(doc))).toEqual([]);
    elementById(doc, "T1").urLv_kV = 0.44;
    expect(errors(validateProject(doc))).toEqual([]);
  });

  it("rejects a transformer HV rating of 12.2 kV on an 11 kV bus (10.9 %)", () => {
    const doc = smallDoc();
    elementById(doc, "T1").urHv_kV = 12.2;
    expect(errors(validateProject(doc))).toEqual([
      {
        severity: "error",
        elementId: "T1",
        field: "urHv_kV",
        // |12.2 - 11| / 11 = 0.10909 (independent arithmetic)
        text: 'Transformer T1 "Main transformer": urHv_kV 12.2 kV differs from the nominal 11 kV of hvBus "MV" by 10.9091 % (more than 10 %)',
      },
    ]);
  });

  it("rejects a transformer connected the wrong way round", () => {
    const doc = smallDoc();
    Object.assign(elementById(doc, "T1"), { hvBus: "LV", lvBus: "MV" });
    expect(errors(validateProject(doc)).map((m) => m.field)).toEqual(["urHv_kV", "urLv_kV"]);
  });

  it("rejects a genset rated 0.48 kV on a 0.4 kV bus (20 %) but accepts 0.415 kV (3.75 %)", () => {
    const doc = smallDoc();
    elementById(doc, "GEN").ur_kV = 0.48;
    expect(errors(validateProject(doc))).toMatchObject([{ elementId: "GEN", field: "ur_kV" }]);
    elementById(doc, "GEN").ur_kV = 0.415;
    expect(errors(validateProject(doc))).toEqual([]);
  });

  it("applies to inverters and motors too", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "inverter", id: "PV", name: "PV", bus: "LV", sr_MVA: 0.1, ur_kV: 0.69 });
    doc.elements.push({ kind: "motor", id: "M", name: "Pump", bus: "DOCK", pr_kW: 30, ur_kV: 0.69 });
    expect(errors(validateProject(doc)).map((m) => `${m.elementId}.${m.field}`)).toEqual(["PV.ur_kV", "M.ur_kV"]);
  });

  it("requires a line to join buses of one nominal voltage", () => {
    const doc = smallDoc();
    elementById(doc, "C12").toBus = "MV";
    expect(errors(validateProject(doc))).toEqual([
      {
        severity: "error",
        elementId: "C12",
        field: "toBus",
        text: 'Cable C12 "Dock feeder": toBus "MV" is at 11 kV but fromBus "LV" is at 0.4 kV; a line joins buses of one nominal voltage',
      },
    ]);
  });
});

describe("record plausibility", () => {
  it("requires skMin_MVA <= skMax_MVA", () => {
    const doc = smallDoc();
    elementById(doc, "G").skMin_MVA = 120;
    expect(errors(validateProject(doc))).toEqual([
      { severity: "error", elementId: "G", field: "skMin_MVA", text: 'Grid feeder G "Utility": skMin_MVA 120 must be <= skMax_MVA 100' },
    ]);
  });

  it("rejects a branch with both ends on one bus", () => {
    const doc = smallDoc();
    elementById(doc, "C12").toBus = "LV";
    expect(errors(validateProject(doc))).toMatchObject([{ elementId: "C12", field: "toBus" }]);
  });
});

describe("topology warnings", () => {
  it("warns about a part of the network with no source in a scenario", () => {
    const doc = smallDoc();
    elementById(doc, "GEN").bus = "MV";
    elementById(doc, "GEN").ur_kV = 11;
    doc.scenarios[1].outOfService = ["G", "T1"];
    // with T1 out, LV and DOCK are cut off from the only source left (GEN on MV)
    expect(warnings(validateProject(doc))).toEqual([
      {
        severity: "warning",
        elementId: "S2",
        field: "outOfService",
        text: 'Scenario S2 "Islanded": buses LV "LV board", DOCK "Dock board" form a part of the network with no source in service (dead in this scenario; see outOfService and switchStates)',
      },
    ]);
  });

  it("treats an open switch as a cut and a scenario override as the switch's state", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "bus", id: "LV2", name: "LV section 2", un_kV: 0.4 });
    doc.elements.push({ kind: "switch", id: "BC", name: "Coupler", busA: "LV", busB: "LV2", closed: false });
    doc.elements.push({ kind: "load", id: "LD2", name: "Load 2", bus: "LV2", p_kW: 10, q_kvar: 0 });
    doc.scenarios = [{ id: "S1", name: "Coupler as drawn" }, { id: "S3", name: "Coupler closed", switchStates: { BC: true } }];
    const ws = warnings(validateProject(doc));
    expect(ws.map((m) => m.elementId)).toEqual(["S1"]);
    expect(ws[0].text).toContain('LV2 "LV section 2"');
  });

  it("warns about a bus connected to nothing", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "bus", id: "SPARE", name: "Spare way", un_kV: 0.4 });
    const ws = warnings(validateProject(doc));
    expect(ws[0]).toEqual({ severity: "warning", elementId: "SPARE", text: 'Bus SPARE "Spare way": connected to nothing (no branch, switch, source or load uses this bus)' });
  });

  it("warns about a network with no source at all", () => {
    const doc = smallDoc();
    doc.elements = doc.elements.filter((e) => e.kind !== "grid" && e.kind !== "generator");
    doc.scenarios = [{ id: "S1", name: "Any" }];
    expect(warnings(validateProject(doc)).map((m) => m.text)).toEqual(["Project file: elements has no source (grid feeder, generator or inverter); no fault current can flow"]);
  });

  it("warns about a layout position for an element that does not exist", () => {
    const doc = smallDoc();
    doc.layout = { MV: { x: 0, y: 0 }, OLD: { x: 1, y: 2 } };
    expect(warnings(validateProject(doc))).toMatchObject([{ elementId: "OLD", field: "layout.OLD" }]);
  });
});

describe("ids in messages", () => {
  it("are quoted when they hold spaces or quotes, so the message still reads unambiguously", () => {
    const doc = smallDoc();
    doc.elements.push({ kind: "load", id: "spare way 3", bus: "NOWHERE", p_kW: 1, q_kvar: 0 });
    doc.layout = { 'old "B"': { x: 0, y: 0 } };
    const texts = validateProject(doc).map((m) => m.text);
    expect(texts).toContain('Load "spare way 3": bus "NOWHERE" names no element in the project (dangling reference)');
    expect(texts).toContain('Layout of "old \\"B\\"": names no element in the project (a left-over position; it is kept but unused)');
  });
});
