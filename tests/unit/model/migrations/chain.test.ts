// Meta-test of the migration chain: every step from 0 to FORMAT_VERSION exists once, in order,
// and a file of every older version is carried all the way up. The rule is the format's
// migration policy (README "Project file"): ids increase by one, each id is the version it produces.
import { describe, it, expect } from "vitest";
import { MIGRATIONS, runMigrations, MigrationError, type Migration } from "../../../../src/model/migrations/index.ts";
import { FORMAT_VERSION } from "../../../../src/model/schema.ts";
import { loadProject } from "../../../../src/model/projectFile.ts";

describe("the migration chain", () => {
  it("has exactly one step for each version 1..FORMAT_VERSION, in order", () => {
    expect(MIGRATIONS.map((m) => m.id)).toEqual(Array.from({ length: FORMAT_VERSION }, (_, k) => k + 1));
  });

  it("runs every step from 0 to FORMAT_VERSION in order on a version 0 file", () => {
    const seen: number[] = [];
    const spied: Migration[] = MIGRATIONS.map((m) => ({ ...m, up: (d) => (seen.push(m.id), m.up(d)) }));
    const run = runMigrations({ format: "islet-project", version: 0, project: { name: "x" }, elements: {}, scenarios: [] }, 0, spied);
    expect(seen).toEqual(MIGRATIONS.map((m) => m.id));
    expect(run.applied).toEqual(seen);
    expect(run.doc.formatVersion).toBe(FORMAT_VERSION);
  });

  it("runs nothing on a current file", () => {
    expect(runMigrations({ formatVersion: FORMAT_VERSION }, FORMAT_VERSION).applied).toEqual([]);
  });

  it("runs only the later steps when starting part way, in order", () => {
    const order: number[] = [];
    const fake: Migration[] = [1, 2, 3].map((id) => ({ id, summary: `to ${id}`, up: (d) => (order.push(id), { ...d, formatVersion: id }) }));
    expect(runMigrations({}, 1, fake, 3).applied).toEqual([2, 3]);
    expect(order).toEqual([2, 3]);
  });

  it("stops with a named error on a gap in the chain", () => {
    const gap: Migration[] = [{ id: 1, summary: "one", up: (d) => d }, { id: 3, summary: "three", up: (d) => d }];
    expect(() => runMigrations({}, 0, gap, 3)).toThrow(new MigrationError("no migration produces formatVersion 2"));
  });

  it("brings a version 0 file to a project that saves as the current version", () => {
    const r = loadProject(JSON.stringify({ format: "islet-project", version: 0, project: { name: "Old" }, elements: {}, scenarios: [] }));
    expect(r.ok && r.project.formatVersion).toBe(FORMAT_VERSION);
  });
});
