import { describe, expect, it } from "vitest";
import { cssString, reportCss } from "../../../src/report/reportCss.ts";
import { buildReport, faultTable } from "../../../src/report/index.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { studyProject } from "../../../src/study/studyProject.ts";

describe("report style sheet", () => {
  it("sets the page size, a landscape page for wide sections, and page numbers in the footer", () => {
    const css = reportCss("Letter", "Header", "2026-01-01");
    expect(css).toContain("size: Letter;");
    expect(css).toContain("@page wide { size: Letter landscape; }");
    expect(css).toContain('content: "Page " counter(page) " of " counter(pages)');
  });

  it("quotes header text so it cannot end the string or the style element", () => {
    // CSS Syntax Level 3, 4.3.7: "\22 " is the code point of '"', "\5c " of "\\", "\3c " of "<", "\3e " of ">"
    expect(cssString('Yard "A" \\ </style>')).toBe('"Yard \\22 A\\22  \\5c  \\3c /style\\3e "');
  });
});

describe("a project with nothing in it", () => {
  it("still gives a complete report with the caution and empty tables", async () => {
    const project = newProject("Empty site");
    const study = await studyProject(project);
    const out = buildReport({ project, study, faults: faultTable(project), meta: { date: "2026-01-01", version: "t", fileName: "e.islet", fileSha256: "a".repeat(64) }, validationWarnings: [] });
    expect(out.html).toContain("Empty site");
    expect(out.html).toContain("The study found no protection path");
    expect(out.html).toContain("Fuse current limitation");
    expect(out.faultsCsv.split("\r\n").filter(Boolean)).toHaveLength(1);
    expect(out.plots.map((p) => p.name)).toEqual(["oneline"]);
  });
});
