import { describe, expect, it } from "vitest";
import { printReportPdf, REPORT_PDF_OPTIONS } from "../../../src/report/printReportPdf.ts";

describe("printing the report to PDF through the host's printer", () => {
  it("asks for the CSS page size and background colours and returns the printer's bytes", async () => {
    const seen: unknown[] = [];
    // "%PDF-" is the header every PDF file starts with (ISO 32000-1, 7.5.2)
    const bytes = await printReportPdf("<p>x</p>", async (html, options) => {
      seen.push(html, options);
      return new TextEncoder().encode("%PDF-1.7\n");
    });
    expect(seen).toEqual(["<p>x</p>", REPORT_PDF_OPTIONS]);
    expect(REPORT_PDF_OPTIONS).toEqual({ preferCSSPageSize: true, printBackground: true });
    expect(bytes.length).toBe(9);
  });

  it("refuses output that is not a PDF", async () => {
    await expect(printReportPdf("<p>x</p>", async () => new TextEncoder().encode("<html>"))).rejects.toThrow(/not a PDF/);
  });
});
