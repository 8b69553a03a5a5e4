// PDF output goes through a printer the host provides: headless Chromium in the CLI, the desktop app's
// own web contents later. Both honour the report's CSS page size, margins and running header and footer.

export interface PdfPrintOptions {
  /** Use the @page size and margins of the report's style sheet. */
  preferCSSPageSize: true;
  /** Print background colours (the caution box, table heads). */
  printBackground: true;
}

export const REPORT_PDF_OPTIONS: PdfPrintOptions = { preferCSSPageSize: true, printBackground: true };

/** Renders the report's HTML to PDF bytes with the host's printer. */
export type PdfPrinter = (html: string, options: PdfPrintOptions) => Promise<Uint8Array>;

export async function printReportPdf(html: string, printer: PdfPrinter): Promise<Uint8Array> {
  const bytes = await printer(html, REPORT_PDF_OPTIONS);
  // every PDF starts with "%PDF-"; anything else means the printer failed quietly
  if (bytes.length < 5 || String.fromCharCode(...bytes.subarray(0, 5)) !== "%PDF-") throw new Error("the PDF printer returned something that is not a PDF");
  return bytes;
}
