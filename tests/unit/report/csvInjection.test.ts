// CSV cells a spreadsheet could evaluate as a formula are neutralised as the OWASP guidance on CSV injection
// says (OWASP, "CSV Injection": prepend a single quote to cells starting with =, +, -, @, tab or carriage return,
// and wrap them in double quotes); numbers stay numeric. Checked on the report's three CSV files with a
// project whose names and ids start with each such character.
import { describe, expect, it } from "vitest";
import { csvTable } from "../../../src/report/csvTable.ts";
import { buildReport, faultTable } from "../../../src/report/index.ts";
import { studyProject } from "../../../src/study/studyProject.ts";
import { projectSchema } from "../../../src/model/schema.ts";
import { smallDoc } from "../model/fixtures/smallProject.ts";
import { csvParse } from "./csvParse.ts";

const STARTS = ["=", "+", "-", "@", "\t", "\r", " =", "\t="];
/** True when a spreadsheet would take the cell for a formula (its first non-blank character starts one). */
// eslint-disable-next-line no-control-regex -- leading controls are part of what a spreadsheet skips
const formulaLike = (cell: string) => /^[\s\x00-\x1f]*[=+\-@]/.test(cell) || /^[\t\r]/.test(cell);

describe("CSV injection", () => {
  it("prefixes formula-like text with an apostrophe and quotes it; leaves numbers and plain text alone", () => {
    const text = csvTable(
      ["a", "b", "c", "d"],
      [
        ["=HYPERLINK(\"http://x\")", "+1", -3.5, "plain"],
        ["@SUM(A1)", "\tTAB", "-2", "\rCR"],
      ],
    );
    expect(csvParse(text)).toEqual([
      ["a", "b", "c", "d"],
      ["'=HYPERLINK(\"http://x\")", "'+1", "-3.5", "plain"],
      ["'@SUM(A1)", "'\tTAB", "'-2", "'\rCR"],
    ]);
    // the negative number is written bare, as a number
    expect(text.split("\r\n")[1].split(",")[2]).toBe("-3.5");
  });

  it("leaves no formula-like cell in the report's CSV files", async () => {
    const doc = smallDoc();
    doc.meta = { name: "=cmd|' /C calc'!A0" };
    doc.elements.forEach((e, k) => (e.name = `${STARTS[k % STARTS.length]}HYPERLINK("http://x/${k}")`));
    doc.scenarios.forEach((s, k) => (s.name = `${STARTS[(k + 3) % STARTS.length]}1+1`));
    const project = projectSchema.parse(doc);
    const study = await studyProject(project);
    const out = buildReport({ project, study, faults: faultTable(project), meta: { date: "2026-01-01", version: "t", fileName: "x.islet", fileSha256: "0".repeat(64) }, validationWarnings: [] });
    let names = 0;
    for (const csv of [out.faultsCsv, out.settingsCsv, out.verdictsCsv]) {
      const rows = csvParse(csv);
      for (const row of rows.slice(1))
        for (const cell of row) {
          expect(formulaLike(cell), cell).toBe(false);
          if (cell.startsWith("'") && formulaLike(cell.slice(1))) names++;
        }
    }
    expect(names).toBeGreaterThan(10);
    // numbers are still numbers: the fault table's currents parse as finite values
    const faults = csvParse(out.faultsCsv);
    const col = faults[0].indexOf("ikss_3ph_kA");
    for (const row of faults.slice(1)) expect(Number.isFinite(Number(row[col])) && row[col] !== "").toBe(true);
  });
});
