// The demo's report against the engine and the study computed here: every bus's I"k per fault type and
// scenario, every device's pickup and time multiplier, every failed verdict, and byte-identical output.
import { beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { loadProject } from "../../../src/model/projectFile.ts";
import type { Project } from "../../../src/model/schema.ts";
import { compileNetwork, solveFault, FAULT_TYPES, type FaultType, type Limit } from "../../../src/engine/index.ts";
import { studyProject } from "../../../src/study/studyProject.ts";
import type { StudyResult } from "../../../src/study/types.ts";
import { buildReport, faultTable, REPORT_CAUTION, type ReportInput, type ReportOutput } from "../../../src/report/index.ts";
import { csvRecords } from "./csvParse.ts";

const demoText = readFileSync(fileURLToPath(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url)), "utf8");
let project: Project;
let study: StudyResult;
let input: ReportInput;
let report: ReportOutput;

/** Cells of an HTML row, tags stripped and entities of the report's escaper undone. */
function cells(row: string): string[] {
  return [...row.matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((m) =>
    m[1].replace(/<[^>]+>/g, "").replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, "&"),
  );
}

beforeAll(async () => {
  const loaded = loadProject(demoText);
  if (!loaded.ok) throw new Error(loaded.error.messages.join("\n"));
  project = loaded.project;
  study = await studyProject(project);
  input = {
    project,
    study,
    faults: faultTable(project),
    meta: { date: "2026-01-15", version: "0.0.0-test", fileName: "dairy-coop.islet", fileSha256: "0".repeat(64) },
    validationWarnings: loaded.warnings,
  };
  report = buildReport(input);
}, 240_000);

describe("the demo's report", () => {
  it("has every section, the cover facts and the caution on the cover and in every page footer", () => {
    for (const id of ["cover", "assumptions", "oneline", "faults", "settings", "verdicts", "tcc", "timelines", "open-items"]) expect(report.html).toContain(`id="${id}"`);
    const cover = report.html.slice(report.html.indexOf('<section class="cover"'), report.html.indexOf("</section>"));
    for (const fact of ["Coastal dairy cooperative", "2026-01-15", "0.0.0-test", "0".repeat(64), REPORT_CAUTION.replace(/'/g, "&#39;")]) expect(cover).toContain(fact);
    // the print footer of every page (CSS @page margin box)
    expect(report.html).toMatch(new RegExp(`@bottom-left \\{ content: "${REPORT_CAUTION.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}"`));
    expect(report.html).toContain("IEC 60909-0:2016");
    expect(report.html).toContain("Fuse current limitation");
  });

  it("is self-contained: no scripts, links, images or other external requests", () => {
    expect(report.html).not.toMatch(/<script|<link|<img|<iframe|@import|url\(\s*['"]?http/i);
    const urls = [...report.html.matchAll(/https?:\/\/[^\s"')]+/g)].map((m) => m[0]);
    expect(new Set(urls)).toEqual(new Set(["http://www.w3.org/2000/svg"]));
  });

  it("lists every bus's I\"k per fault type, scenario and limit as the engine's own fault solution gives it", () => {
    const rows = [...report.html.matchAll(/<tr data-scenario="([^"]+)" data-bus="([^"]+)" data-limit="(max|min)">([\s\S]*?)<\/tr>/g)];
    const buses = project.elements.filter((e) => e.kind === "bus");
    const expected = project.scenarios.reduce((n, s) => n + s.limits.length * buses.filter((b) => !s.outOfService.includes(b.id)).length, 0);
    expect(rows).toHaveLength(expected);
    const byKey = new Map(rows.map((m) => [`${m[1]}|${m[2]}|${m[3]}`, cells(m[4])] as const));
    const csv = new Map(csvRecords(report.faultsCsv).map((r) => [`${r.scenario_id}|${r.bus_id}|${r.limit}`, r] as const));
    const column: Record<FaultType, number> = { "3ph": 4, LL: 5, LG: 6, LLG: 7 };
    for (const s of project.scenarios)
      for (const limit of s.limits as Limit[]) {
        const compiled = compileNetwork(project, { scenario: s.id, limit });
        if (!compiled.ok) throw new Error(compiled.errors.map((e) => e.text).join("; "));
        for (const b of buses.filter((x) => !s.outOfService.includes(x.id))) {
          const row = byKey.get(`${s.id}|${b.id}|${limit}`)!;
          const rec = csv.get(`${s.id}|${b.id}|${limit}`)!;
          for (const t of FAULT_TYPES) {
            // independent path through the engine: one fault solved on its own (not the all-bus sweep)
            const ref = solveFault(compiled.network, { kind: "bus", bus: b.id }, t).ikss_kA;
            expect(Math.abs(Number(row[column[t]]) - ref), `${s.id} ${b.id} ${t} ${limit} HTML`).toBeLessThanOrEqual(0.0005 + 1e-6 * ref);
            expect(Math.abs(Number(rec[`ikss_${t}_kA`]) - ref), `${s.id} ${b.id} ${t} ${limit} CSV`).toBeLessThanOrEqual(0.00005 + 1e-6 * ref);
          }
          const three = solveFault(compiled.network, { kind: "bus", bus: b.id }, "3ph");
          expect(Math.abs(Number(row[8]) - three.ip_kA)).toBeLessThanOrEqual(0.0005 + 1e-6 * three.ip_kA);
          expect(Math.abs(Number(rec.xr_3ph) - three.xr)).toBeLessThanOrEqual(0.00005 + 1e-6 * three.xr);
        }
      }
  });

  it("agrees with the fault current the study used in its bus cases (3ph, LL and LG, where I\"k is the largest phase current)", () => {
    const csv = new Map(csvRecords(report.faultsCsv).map((r) => [`${r.scenario_id}|${r.bus_id}|${r.limit}`, r] as const));
    let compared = 0;
    for (const c of study.cases) {
      const loc = c.faultCase.location;
      if (loc.kind !== "bus" || c.faultCase.faultType === "LLG") continue;
      const rec = csv.get(`${c.faultCase.scenario}|${loc.bus}|${c.faultCase.limit}`)!;
      const table_kA = Number(rec[`ikss_${c.faultCase.faultType}_kA`]);
      // IEC 60909 defines the LG I"k as 3I0, which is the faulted phase's current; 3ph and LL are line currents
      expect(Math.abs(table_kA - c.iFault_A / 1000), c.faultCase.id).toBeLessThanOrEqual(0.001 + 1e-3 * table_kA);
      compared++;
    }
    expect(compared).toBeGreaterThan(100);
  });

  it("gives every relay function's pickup (primary and secondary) and time multiplier, and every LV region and fuse", () => {
    const recs = csvRecords(report.settingsCsv);
    const html = new Map([...report.html.matchAll(/<tr data-device="([^"]+)" data-element="([^"]+)">([\s\S]*?)<\/tr>/g)].map((m) => [`${m[1]}|${m[2]}`, cells(m[3])] as const));
    let relays = 0;
    for (const e of project.elements) {
      if (e.kind === "relay")
        for (const f of e.functions) {
          const r = recs.find((x) => x.device_id === e.id && x.element === f.id)!;
          expect(Number(r.pickup_primary_A)).toBeCloseTo(f.pickup_A, 6);
          // secondary amperes = primary x CT secondary / CT primary (CT ratio arithmetic, independent computation)
          expect(Number(r.pickup_secondary_A)).toBeCloseTo((f.pickup_A * e.ctSecondary_A) / e.ctPrimary_A, 5);
          expect(r.ct_ratio).toBe(`${e.ctPrimary_A}/${e.ctSecondary_A}`);
          expect(r.ieee_c37_2).toBe(f.ansi);
          if (f.curve !== "definite-time") expect(Number(r.multiplier)).toBeCloseTo(f.multiplier, 6);
          else expect(Number(r.delay_s)).toBeCloseTo(f.delay_s, 6);
          const row = html.get(`${e.id}|${f.id}`)!;
          expect(Number(row[5].replace(/,/g, ""))).toBeCloseTo(f.pickup_A, 6);
          if (f.curve !== "definite-time") expect(Number(row[7])).toBeCloseTo(f.multiplier, 3);
          relays++;
        }
      if (e.kind === "lvbreaker") {
        const lt = recs.find((x) => x.device_id === e.id && x.element === "long-time")!;
        // Ir = ir_x x In; Isd = isd_x x Ir; Ii = ii_x x In (trip-unit setting convention, from memory)
        expect(Number(lt.pickup_primary_A)).toBeCloseTo(e.longTime.ir_x * e.in_A, 6);
        if (e.shortTime) expect(Number(recs.find((x) => x.device_id === e.id && x.element === "short-time")!.pickup_primary_A)).toBeCloseTo(e.shortTime.isd_x * e.longTime.ir_x * e.in_A, 6);
        if (e.instantaneous) expect(Number(recs.find((x) => x.device_id === e.id && x.element === "instantaneous")!.pickup_primary_A)).toBeCloseTo(e.instantaneous.ii_x * e.in_A, 6);
        if (e.groundFault) expect(Number(recs.find((x) => x.device_id === e.id && x.element === "ground-fault")!.pickup_primary_A)).toBeCloseTo(e.groundFault.ig_A, 6);
      }
      if (e.kind === "fuse") expect(Number(recs.find((x) => x.device_id === e.id)!.pickup_primary_A)).toBe(e.rating_A);
    }
    expect(relays).toBe(12);
  });

  it("lists every failed and warned verdict, failures first, and counts the passed ones", () => {
    const failRows = [...report.html.matchAll(/<tr class="fail" data-verdict="([^"]+)">/g)].map((m) => m[1].replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, "&"));
    const warnRows = [...report.html.matchAll(/<tr class="warn" data-verdict="/g)];
    const fails = study.verdicts.filter((v) => v.status === "fail");
    expect(fails.length).toBeGreaterThan(0);
    expect(failRows).toHaveLength(fails.length);
    expect(new Set(failRows)).toEqual(new Set(fails.map((v) => v.id)));
    expect(warnRows).toHaveLength(study.verdicts.filter((v) => v.status === "warn").length);
    expect(report.html.indexOf('id="verdicts-fail"')).toBeLessThan(report.html.indexOf('id="verdicts-warn"'));
    expect(report.html.indexOf('id="verdicts-warn"')).toBeLessThan(report.html.indexOf('id="verdicts-pass"'));
    expect(report.html).toContain(`Passed (${study.verdicts.filter((v) => v.status === "pass").length})`);
    // verdicts.csv has them all, passes included
    expect(csvRecords(report.verdictsCsv)).toHaveLength(study.verdicts.length);
  });

  it("draws the one-line with every bus and a time-current plot per protection path", () => {
    const oneLine = report.plots.find((p) => p.name === "oneline")!;
    for (const b of project.elements.filter((e) => e.kind === "bus")) expect(oneLine.svg).toContain(`>${b.id}  `);
    const paths = report.plots.filter((p) => p.name.startsWith("path-"));
    expect(paths.length).toBeGreaterThan(5);
    for (const p of paths) {
      expect(p.svg.startsWith("<svg")).toBe(true);
      expect(report.html).toContain(`id="${p.name}"`);
    }
  });

  it("keeps earth-fault plots to the primary device's voltage, where residual current refers without a transformer", () => {
    const kvOf = (id: string) => {
      const d = project.elements.find((e) => e.id === id)!;
      if (d.kind !== "relay" && d.kind !== "fuse" && d.kind !== "lvbreaker") throw new Error(id);
      const host = project.elements.find((e) => e.id === d.at.element)!;
      const bus = host.kind === "transformer" ? (d.at.end === "to" ? host.lvBus : host.hvBus) : host.kind === "line" ? (d.at.end === "to" ? host.toBus : host.fromBus) : "bus" in host ? host.bus : "";
      return (project.elements.find((e) => e.id === bus) as { un_kV: number }).un_kV;
    };
    const earth = report.plots.filter((p) => p.name.endsWith("-earth"));
    expect(earth.length).toBeGreaterThan(0);
    let left = 0;
    for (const p of earth) {
      const ids = p.title.replace(/^.*: /, "").split(" → ");
      for (const id of ids)
        if (kvOf(id) !== kvOf(ids[0])) {
          expect(p.svg, `${p.name} ${id}`).not.toContain(`>${id} (`);
          left++;
        } else expect(p.svg, `${p.name} ${id}`).toContain(`>${id} (`);
    }
    expect(left).toBeGreaterThan(0);
  });

  it("shows the clearing timeline of every case the study singled out: not isolated, or with unwanted operations, or the slowest of its zone", () => {
    const section = report.html.slice(report.html.indexOf('id="timelines"'), report.html.indexOf('id="open-items"'));
    const label = (id: string) => study.cases.find((c) => c.faultCase.id === id)!.faultCase.label.replace(/&/g, "&amp;").replace(/'/g, "&#39;").replace(/"/g, "&quot;");
    const shown = study.timelines;
    expect(shown.length).toBeGreaterThan(0);
    const byId = new Map(study.cases.map((c) => [c.faultCase.id, c] as const));
    // each scenario's kept timelines lead with its worst: a case not isolated or with an unwanted operation
    for (const t of shown) {
      const c = byId.get(t.caseId)!;
      expect(t.isolated).toBe(c.operation.isolated_s !== null);
      expect(t.clearedAt_s).toBe(c.operation.isolated_s);
    }
    for (const t of shown) expect(section).toContain(`<h3>${label(t.caseId)}</h3>`);
    expect([...section.matchAll(/<div class="timeline-block">/g)]).toHaveLength(shown.length);
  });

  it("is byte-identical when built twice from the same input", () => {
    const again = buildReport(input);
    expect(again.html).toBe(report.html);
    expect(again.faultsCsv).toBe(report.faultsCsv);
    expect(again.settingsCsv).toBe(report.settingsCsv);
    expect(again.verdictsCsv).toBe(report.verdictsCsv);
    expect(again.plots).toEqual(report.plots);
  });
});
