// The project file contract: envelope, typed load errors, canonical text, round trips.
// Expected values come from the format's own specification (README "Project file") and from
// independent reasoning about the input (positions counted by hand in the inputs below).
import { describe, it, expect } from "vitest";
import { readFileSync } from "node:fs";
import { loadProject, serializeProject, newProject, PROJECT_FILE_EXTENSION } from "../../../src/model/projectFile.ts";
import { FORMAT_VERSION } from "../../../src/model/schema.ts";
import { smallDoc, elementById } from "./fixtures/smallProject.ts";

const demoText = readFileSync(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8");

function mustLoad(text: string) {
  const r = loadProject(text);
  if (!r.ok) throw new Error(`expected a load, got ${r.error.kind}: ${r.error.messages.join("; ")}`);
  return r;
}
function mustFail(text: string) {
  const r = loadProject(text);
  if (r.ok) throw new Error("expected the load to fail");
  return r.error;
}

describe("loadProject", () => {
  it("loads the demo project without warnings", () => {
    const r = mustLoad(demoText);
    expect(r.project.meta.name).toBe("Coastal dairy cooperative");
    expect(r.warnings).toEqual([]);
  });

  it("fills the schema's defaults for fields a file leaves out", () => {
    const r = mustLoad(JSON.stringify(smallDoc()));
    const t1 = r.project.elements.find((e) => e.id === "T1");
    expect(t1).toMatchObject({ vectorGroup: "Dyn11", ur_pct: 1, tap_pct: 0 }); // defaults written in schema.ts
    expect(r.project.meta.baseMVA).toBe(100);
  });

  it("accepts a UTF-8 byte-order mark", () => {
    expect(loadProject(`\uFEFF${JSON.stringify(smallDoc())}`).ok).toBe(true);
  });

  it("reports truncated JSON as invalidJson with the line, column and a truncation hint", () => {
    // cut inside the third line: `{\n  "format": "islet-project",\n  "formatV`
    const text = demoText.slice(0, demoText.indexOf("formatVersion") + 7);
    const err = mustFail(text);
    expect(err.kind).toBe("invalidJson");
    expect(err.messages).toEqual([`Project file: not valid JSON at line 3, column 11 (character ${text.length}): unexpected end of text. The file looks truncated (it ends too early).`]);
  });

  it("reports a stray character with its position", () => {
    const err = mustFail('{\n  "format": x\n}');
    // the x is character 14 (0-based), line 2, column 13
    expect(err).toEqual({ kind: "invalidJson", messages: ['Project file: not valid JSON at line 2, column 13 (character 14): unexpected character "x".'] });
  });

  it("refuses JSON that is not an Islet project", () => {
    expect(mustFail("[1, 2]")).toEqual({ kind: "notAProject", messages: ['Project file: expected a JSON object with format "islet-project", got an array of 2'] });
    expect(mustFail('{"format": "drawing"}')).toEqual({
      kind: "notAProject",
      messages: ['Project file: format must be "islet-project" (got "drawing"); this is not an Islet project file'],
    });
    expect(mustFail('{"format": "islet-project", "formatVersion": "1"}').kind).toBe("notAProject");
    expect(mustFail('{"format": "islet-project", "formatVersion": 1.5}').messages[0]).toContain("formatVersion must be a whole number >= 0 (got 1.5)");
  });

  it("refuses a file from a newer Islet, naming both versions", () => {
    const doc = { ...smallDoc(), formatVersion: FORMAT_VERSION + 1 };
    expect(mustFail(JSON.stringify(doc))).toEqual({
      kind: "tooNew",
      messages: [
        `Project file: made by a newer Islet: formatVersion ${FORMAT_VERSION + 1}, this build reads up to ${FORMAT_VERSION}. Open it with a newer Islet; the file is left unchanged.`,
      ],
    });
  });

  it("reports schema errors as invalidRecords naming element and field", () => {
    const doc = smallDoc();
    elementById(doc, "C12").length_km = -3;
    elementById(doc, "GEN").xdss_pu = "0.14";
    expect(mustFail(JSON.stringify(doc))).toEqual({
      kind: "invalidRecords",
      messages: ['Cable C12 "Dock feeder": length_km must be > 0 (got -3)', 'Generator GEN "Genset": xdss_pu must be a number (got "0.14")'],
    });
  });

  it("reports rule errors (dangling references) as invalidRecords and passes warnings through", () => {
    const doc = smallDoc();
    elementById(doc, "LD").bus = "B404";
    expect(mustFail(JSON.stringify(doc))).toEqual({
      kind: "invalidRecords",
      messages: ['Load LD "Dock load": bus "B404" names no element in the project (dangling reference)'],
    });
    const ok = smallDoc();
    ok.elements.push({ kind: "bus", id: "SPARE", un_kV: 0.4 });
    expect(mustLoad(JSON.stringify(ok)).warnings).toEqual(["Bus SPARE: connected to nothing (no branch, switch, source or load uses this bus)"]);
  });

  it("never throws on odd input", () => {
    for (const text of ["", " ", "null", "0", '"x"', "{}", '{"format":"islet-project"}', '{"format":"islet-project","formatVersion":1}', "[".repeat(5000)]) {
      const r = loadProject(text);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.messages.length).toBeGreaterThan(0);
    }
  });
});

describe("serializeProject", () => {
  it("writes the demo exactly as committed (canonical form is a fixed point)", () => {
    expect(serializeProject(mustLoad(demoText).project)).toBe(demoText);
  });

  it("uses a 2-space indent and a trailing newline", () => {
    const text = serializeProject(newProject("A"));
    expect(text.endsWith("}\n")).toBe(true);
    expect(text.split("\n")[1]).toBe('  "format": "islet-project",');
  });

  it("orders keys kind, id, name, then schema order, unknown fields last and sorted, whatever the input order", () => {
    const doc = smallDoc();
    const shuffled = { zeta: 1, toBus: "DOCK", alpha: { b: 1, a: 2 }, ...elementById(doc, "C12") };
    delete (shuffled as Record<string, unknown>).kind;
    doc.elements[5] = { length_km: 0.1, ...shuffled, kind: "line" };
    const text = serializeProject(mustLoad(JSON.stringify(doc)).project);
    const line = JSON.parse(text).elements[5];
    expect(Object.keys(line).slice(0, 5)).toEqual(["kind", "id", "name", "construction", "fromBus"]);
    expect(Object.keys(line).slice(-2)).toEqual(["alpha", "zeta"]);
    expect(Object.keys(line.alpha)).toEqual(["a", "b"]);
    expect(Object.keys(JSON.parse(text)).slice(0, 3)).toEqual(["format", "formatVersion", "meta"]);
  });

  it("keeps unknown fields at every level through load, save and load", () => {
    const doc = smallDoc() as Record<string, unknown> & ReturnType<typeof smallDoc>;
    doc.plugin = { colour: "teal" };
    (doc.meta as Record<string, unknown>).site = "north";
    elementById(doc, "QF").note = "checked";
    (elementById(doc, "QF").longTime as Record<string, unknown>).band = "B";
    doc.scenarios[0].tag = ["x"];
    const first = mustLoad(JSON.stringify(doc)).project as Record<string, unknown>;
    const second = mustLoad(serializeProject(first as never)).project;
    expect(second).toEqual(first);
    expect(first.plugin).toEqual({ colour: "teal" });
    expect((second.elements.find((e) => e.id === "QF") as Record<string, unknown>).note).toBe("checked");
  });
});

describe("newProject", () => {
  it("makes a valid empty project with one scenario that loads back unchanged", () => {
    const p = newProject("  Harbour kiosk ");
    expect(p.meta.name).toBe("Harbour kiosk");
    expect(p.formatVersion).toBe(FORMAT_VERSION);
    expect(p.elements).toEqual([]);
    expect(p.scenarios).toHaveLength(1);
    expect(mustLoad(serializeProject(p)).project).toEqual(p);
  });

  it("names an unnamed project", () => {
    expect(newProject("").meta.name).toBe("Untitled project");
  });

  it("uses the .islet extension", () => {
    expect(PROJECT_FILE_EXTENSION).toBe(".islet");
  });
});

describe("a field named __proto__", () => {
  it("is ignored with a warning naming its path, and pollutes nothing", () => {
    const doc = smallDoc();
    const text = JSON.stringify(doc).replace('"kind":"bus"', '"__proto__":{"polluted":1},"kind":"bus"');
    const r = mustLoad(text);
    expect(r.warnings).toEqual(['Project file: the field "__proto__" at elements[0].__proto__ is ignored (a reserved name in JavaScript; it is not kept on save)']);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.getPrototypeOf(r.project.elements[0])).toBe(Object.prototype);
  });
});
