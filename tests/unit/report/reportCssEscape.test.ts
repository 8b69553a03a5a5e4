// User text in the report's style sheet (the project name in the running header) cannot leave its CSS string:
// checked with every control character and a crafted name that, before, ended the string with a carriage
// return and hid every section behind "ALL CHECKS PASSED". The string token is read back with the rules of
// CSS Syntax Level 3 (4.3.5 consume a string token, 4.3.7 consume an escaped code point) written out here,
// and the sheet's structure is compared with postcss's parse of the same sheet for a plain name.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import postcss from "postcss";
import { cssString, reportCss } from "../../../src/report/reportCss.ts";

/** CSS Syntax Level 3, 4.3.5: the string token starting at `css[start]` (a quote): its value and where it ends. */
function readCssString(css: string, start: number): { value: string; end: number; bad: boolean } {
  const quote = css[start];
  let value = "";
  for (let k = start + 1; k < css.length; ) {
    const cp = css.codePointAt(k)!;
    const ch = String.fromCodePoint(cp);
    if (ch === quote) return { value, end: k + 1, bad: false };
    if (ch === "\n" || ch === "\r" || ch === "\f") return { value, end: k, bad: true }; // newline: bad-string token
    if (ch === "\\") {
      const hex = /^[0-9a-fA-F]{1,6}/.exec(css.slice(k + 1))?.[0];
      if (hex) {
        k += 1 + hex.length;
        if (/[ \t\n\f]/.test(css[k] ?? "")) k += 1;
        const n = parseInt(hex, 16);
        value += n === 0 || (n >= 0xd800 && n <= 0xdfff) || n > 0x10ffff ? "\ufffd" : String.fromCodePoint(n);
        continue;
      }
      value += css[k + 1];
      k += 2;
      continue;
    }
    value += ch;
    k += ch.length;
  }
  return { value, end: css.length, bad: true };
}

const CONTROL = [...Array.from({ length: 0x20 }, (_, k) => k), ...Array.from({ length: 0x21 }, (_, k) => 0x7f + k), 0x2028, 0x2029, 0x202e, 0x2066, 0xfeff].map((c) => String.fromCodePoint(c));
const structure = (css: string) => {
  const out: string[] = [];
  postcss.parse(css).walk((n) => void out.push(n.type === "rule" ? `rule ${n.selector}` : n.type === "atrule" ? `@${n.name} ${n.params}` : n.type === "decl" ? `decl ${n.prop}` : n.type));
  return out;
};

describe("CSS strings in the report", () => {
  it("hold every control character as an escape, read back unchanged (NUL as U+FFFD, as CSS reads it)", () => {
    for (const c of CONTROL) {
      const text = `A${c}B`;
      const lit = cssString(text);
      expect(lit).toMatch(/^"[A-Za-z0-9 .,:;!?()'/@#%&+=_\\-]*"$/);
      const read = readCssString(lit, 0);
      expect(read).toEqual({ value: c === "\0" ? "A\ufffdB" : text, end: lit.length, bad: false });
    }
  });

  it("read back any text unchanged", () => {
    fc.assert(
      fc.property(fc.string({ unit: "grapheme", maxLength: 40 }), (text) => {
        const lit = cssString(text);
        expect(readCssString(lit, 0)).toEqual({ value: text.replaceAll("\0", "\ufffd"), end: lit.length, bad: false });
      }),
      { numRuns: 500 },
    );
  });

  it("keep a crafted project name inside the header: the sheet parses to the same rules as for a plain name", () => {
    const crafted = 'Site\r} section, table, .caution { display: none } body::before { content: "ALL CHECKS PASSED" } @page { @top-left { content: "x\f</style><script>';
    const plain = structure(reportCss("A4", "Site", "2026-01-01"));
    for (const name of [crafted, ...CONTROL.map((c) => `Site${c}} body { display: none } x{`)]) {
      const css = reportCss("A4", name, "2026-01-01");
      expect(structure(css)).toEqual(plain);
      expect(css).not.toMatch(/<\/style/i);
      const at = css.indexOf("@top-left { content: ") + "@top-left { content: ".length;
      expect(readCssString(css, at).value).toBe(name.replaceAll("\0", "\ufffd"));
    }
  });
});
