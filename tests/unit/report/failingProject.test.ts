// A small feeder whose two relays have the same curve: the backup cannot be selective, so the study fails
// it, and the report must list every failed verdict the study found.
import { describe, expect, it } from "vitest";
import { projectSchema } from "../../../src/model/schema.ts";
import { studyProject } from "../../../src/study/studyProject.ts";
import { buildReport, faultTable } from "../../../src/report/index.ts";

const cable = { construction: "cable", length_km: 2, r1_ohmPerKm: 0.32, x1_ohmPerKm: 0.11, r0_ohmPerKm: 1.25, x0_ohmPerKm: 0.4, material: "Al", insulation: "XLPE", csa_mm2: 95, ampacity_A: 215 };
const relay = (id: string, line: string) => ({
  kind: "relay",
  id,
  name: `Feeder relay ${id}`,
  at: { element: line, end: "from" },
  ctPrimary_A: 200,
  ctSecondary_A: 1,
  functions: [{ id: "51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 100, multiplier: 0.1 }],
});

const project = projectSchema.parse({
  format: "islet-project",
  formatVersion: 1,
  meta: { name: "Two relays, one curve" },
  elements: [
    { kind: "bus", id: "B1", name: "Source bus", un_kV: 11 },
    { kind: "bus", id: "B2", name: "Middle bus", un_kV: 11 },
    { kind: "bus", id: "B3", name: "Far bus", un_kV: 11 },
    { kind: "grid", id: "G", name: "Supply", bus: "B1", skMax_MVA: 100, skMin_MVA: 80 },
    { kind: "line", id: "L1", name: "First section", fromBus: "B1", toBus: "B2", ...cable },
    { kind: "line", id: "L2", name: "Second section", fromBus: "B2", toBus: "B3", ...cable },
    { kind: "load", id: "LD", name: "Far load", bus: "B3", p_kW: 500, q_kvar: 200 },
    relay("R1", "L1"),
    relay("R2", "L2"),
  ],
  scenarios: [{ id: "base", name: "Base case" }],
  layout: { B1: { x: 200, y: 0, w: 200 }, G: { x: 200, y: -80 }, L1: { x: 200, y: 100 }, B2: { x: 200, y: 200, w: 200 }, L2: { x: 200, y: 300 }, B3: { x: 200, y: 400, w: 200 }, LD: { x: 200, y: 480 } },
});

describe("the report of a project with failing verdicts", () => {
  it("lists every failed verdict of the study, including the backup that cannot be selective", async () => {
    const study = await studyProject(project);
    const input = {
      project,
      study,
      faults: faultTable(project),
      meta: { date: "2026-02-01", version: "test", fileName: "two-relays.islet", fileSha256: "f".repeat(64) },
      validationWarnings: [],
    };
    const report = buildReport(input);
    const fails = study.verdicts.filter((v) => v.status === "fail");
    // equal curves give zero margin between primary and backup, below any CTI (common practice: CTI 0.2-0.4 s)
    const pair = fails.filter((v) => v.kind === "selectivity" && [v.device, v.other].sort().join(",") === "R1,R2");
    expect(pair.length).toBeGreaterThan(0);
    const rows = [...report.html.matchAll(/<tr class="fail" data-verdict="[^"]+">([\s\S]*?)<\/tr>/g)];
    expect(rows).toHaveLength(fails.length);
    for (const v of fails) expect(report.html).toContain(`data-verdict="${v.id.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;")}"`);
    // the open items group them, and every failed reference appears there as a link
    const open = report.html.slice(report.html.indexOf('id="open-items"'));
    for (let k = 1; k <= fails.length; k++) expect(open).toContain(`href="#v-F-${String(k).padStart(4, "0")}"`);
    // passed verdicts are summarised unless asked for in full
    const passes = study.verdicts.filter((v) => v.status === "pass").length;
    expect(passes).toBeGreaterThan(0);
    expect([...report.html.matchAll(/<tr class="pass" data-verdict=/g)]).toHaveLength(0);
    const full = buildReport({ ...input, listPasses: true });
    expect([...full.html.matchAll(/<tr class="pass" data-verdict=/g)]).toHaveLength(passes);
  }, 60_000);
});
