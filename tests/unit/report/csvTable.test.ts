import { describe, expect, it } from "vitest";
import { csvTable } from "../../../src/report/csvTable.ts";
import { csvParse } from "./csvParse.ts";

describe("CSV tables (RFC 4180)", () => {
  it("ends every record with CRLF and starts with the header row", () => {
    // RFC 4180, section 2, rules 1 and 3: records end with CRLF; an optional header line comes first
    expect(csvTable(["a_A", "b_s"], [[1, 2]])).toBe("a_A,b_s\r\n1,2\r\n");
  });

  it("quotes fields with commas, quotes or line breaks and doubles inner quotes", () => {
    // RFC 4180, section 2, rules 6 and 7
    const text = csvTable(["name", "note"], [['Bus "A"', "x, y"], ["line\nbreak", "plain"]]);
    expect(text).toBe('name,note\r\n"Bus ""A""","x, y"\r\n"line\nbreak",plain\r\n');
    expect(csvParse(text)).toEqual([["name", "note"], ['Bus "A"', "x, y"], ["line\nbreak", "plain"]]);
  });

  it("writes null and non-finite numbers as empty fields", () => {
    expect(csvTable(["a", "b", "c"], [[null, Infinity, 0.5]])).toBe("a,b,c\r\n,,0.5\r\n");
  });

  it("refuses a row whose length does not match the header", () => {
    expect(() => csvTable(["a", "b"], [[1]])).toThrow(/row 1: 1 cells for 2 columns/);
  });
});
