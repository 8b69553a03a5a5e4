// RFC 4180 CSV: CRLF line ends, fields with a comma, quote or line break wrapped in double quotes,
// quotes doubled. The first row is the header; no comment lines.

export type CsvCell = string | number | null;

function quote(cell: CsvCell): string {
  const text = cell === null ? "" : typeof cell === "number" ? (Number.isFinite(cell) ? String(cell) : "") : cell;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvTable(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  for (const [k, row] of rows.entries())
    if (row.length !== header.length) throw new RangeError(`CSV row ${k + 1}: ${row.length} cells for ${header.length} columns`);
  return [header, ...rows].map((row) => row.map(quote).join(",")).join("\r\n") + "\r\n";
}
