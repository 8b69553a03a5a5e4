// A small RFC 4180 reader for the tests, written apart from the report's writer so each checks the other.
export function csvParse(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = "";
  let quoted = false;
  for (let k = 0; k < text.length; k++) {
    const ch = text[k];
    if (quoted) {
      if (ch === '"' && text[k + 1] === '"') {
        cell += '"';
        k++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") {
      row.push(cell);
      cell = "";
    } else if (ch === "\r" && text[k + 1] === "\n") {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = "";
      k++;
    } else cell += ch;
  }
  if (cell !== "" || row.length) {
    row.push(cell);
    rows.push(row);
  }
  return rows;
}

/** Rows as objects keyed by the header row. */
export function csvRecords(text: string): Record<string, string>[] {
  const [header, ...rows] = csvParse(text);
  return rows.map((r) => Object.fromEntries(header.map((h, k) => [h, r[k]])));
}
