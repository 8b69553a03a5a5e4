// The JSON error locator agrees with the engine's own JSON.parse (an independent implementation of
// RFC 8259) on which texts are valid, and points at the first bad character counted by hand.
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { jsonSyntaxError } from "../../../src/model/jsonSyntaxError.ts";

function parses(text: string): boolean {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
}

describe("jsonSyntaxError", () => {
  it("returns null exactly when JSON.parse accepts the text", () => {
    const jsonish = fc.oneof(
      fc.json(),
      fc.string(),
      fc.json().chain((j) => fc.nat({ max: Math.max(0, j.length - 1) }).map((n) => j.slice(0, n))),
      fc.tuple(fc.json(), fc.nat(), fc.constantFrom("x", "}", "]", ",", ":", '"', "\\", "\n", "-", ".", "e", "0")).map(([j, k, c]) => {
        const at = j.length === 0 ? 0 : k % j.length;
        return j.slice(0, at) + c + j.slice(at);
      }),
    );
    fc.assert(
      fc.property(jsonish, (text) => {
        expect(jsonSyntaxError(text) === null).toBe(parses(text));
      }),
      { numRuns: 1500 },
    );
  });

  it.each([
    ['{"a": 1,}', 8, 1, 9, 'unexpected character "}"'],
    ['{"a": tru}', 9, 1, 10, 'unexpected character "}"'],
    ["[1, 2", 5, 1, 6, "unexpected end of text"],
    ['{\n  "a": 01\n}', 10, 2, 9, 'unexpected character "1"'],
    ['"tab\there"', 4, 1, 5, "control character inside a string"],
    ["{} x", 3, 1, 4, "unexpected text after the end of the document"],
    ["", 0, 1, 1, "unexpected end of text"],
  ])("locates the error in %j at character %i (line %i, column %i)", (text, offset, line, column, problem) => {
    // positions counted by hand, 0-based characters, 1-based lines and columns
    expect(jsonSyntaxError(text)).toEqual({ offset, line, column, problem });
  });
});
