// RFC 4180 CSV: CRLF line ends, fields with a comma, quote or line break wrapped in double quotes,
// quotes doubled. The first row is the header; no comment lines.
// Text that a spreadsheet would take for a formula (it starts with =, +, -, @, tab or CR, perhaps after blanks)
// gets a leading apostrophe and quotes, as the OWASP guidance on CSV injection says; numbers stay numbers.

export type CsvCell = string | number | null;

// eslint-disable-next-line no-control-regex -- leading controls are part of what a spreadsheet skips
const FORMULA_START = /^[\s\x00-\x1f]*[=+\-@]|^[\t\r]/;

function quote(cell: CsvCell): string {
  if (typeof cell === "string" && FORMULA_START.test(cell)) return `"'${cell.replace(/"/g, '""')}"`;
  const text = cell === null ? "" : typeof cell === "number" ? (Number.isFinite(cell) ? String(cell) : "") : cell;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvTable(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  for (const [k, row] of rows.entries())
    if (row.length !== header.length) throw new RangeError(`CSV row ${k + 1}: ${row.length} cells for ${header.length} columns`);
  return [header, ...rows].map((row) => row.map(quote).join(",")).join("\r\n") + "\r\n";
}
