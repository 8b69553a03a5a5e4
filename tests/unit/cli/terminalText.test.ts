// Terminal-safe text: every control character a terminal would obey is shown escaped. The controls checked here
// come from the standards that define them, not from the module: ECMA-48 (5th ed., 1991) for C0, C1 and the
// control sequences a terminal obeys (ESC [ ... as CSI, 5.4), Unicode Standard Annex #9, Table 4 for the explicit
// bidi formatting characters, and Unicode's line and paragraph separators (U+2028, U+2029).
import { describe, expect, it } from "vitest";
import { escapeControl, hasControls, jsonForTerminal, terminalField, terminalLines } from "../../../src/cli/terminalText.ts";
import { guardConsole } from "../../../src/cli/safeConsole.ts";
import { consoleOutput } from "../../../src/cli/session.ts";
import { vi } from "vitest";

// ECMA-48 8.3.41 EL (erase in line) and 8.3.22 CUU (cursor up): the sequences that hide a line of output
const ERASE_LINE = "\x1b[2K";
const CURSOR_UP = "\x1b[1A";
// ECMA-48 8.3.117 SGR 8: concealed characters
const CONCEAL = "\x1b[8m";
// ECMA-48 8.3.89 OSC: an operating system command (sets the window title, or a hyperlink, in many terminals)
const OSC_TITLE = "\x1b]0;owned\x07";
// UAX #9 Table 4: LRE, RLE, PDF, LRO, RLO, LRI, RLI, FSI, PDI, plus LRM, RLM (Table 4 note) and ALM
const BIDI = ["\u202a", "\u202b", "\u202c", "\u202d", "\u202e", "\u2066", "\u2067", "\u2068", "\u2069", "\u200e", "\u200f", "\u061c"];

/** No character a terminal would act on: C0 (but line feed where allowed), DEL, C1, bidi, separators. */
function isInert(text: string, allowLineFeed: boolean): boolean {
  for (const ch of text) {
    const c = ch.codePointAt(0)!;
    if (c === 0x0a && allowLineFeed) continue;
    if (c < 0x20 || (c >= 0x7f && c <= 0x9f)) return false;
    if (BIDI.includes(ch) || c === 0x2028 || c === 0x2029) return false;
  }
  return true;
}

describe("terminal-safe text", () => {
  it("shows ESC sequences, CR, BEL and backspace as text that does nothing", () => {
    const name = `Feeder 1${ERASE_LINE}${CURSOR_UP}\rALL CHECKS PASSED\x07\b${CONCEAL}`;
    const safe = terminalField(name);
    expect(isInert(safe, false)).toBe(true);
    expect(safe).toBe("Feeder 1\\x1B[2K\\x1B[1A\\x0DALL CHECKS PASSED\\x07\\x08\\x1B[8m");
    expect(terminalField(OSC_TITLE)).toBe("\\x1B]0;owned\\x07");
  });

  it("escapes C1 controls (ECMA-48 5.3: 0x80-0x9F, e.g. 0x9B is a one-byte CSI) and DEL", () => {
    expect(terminalField("a\u009b2Kb\u007f")).toBe("a\\u009B2Kb\\u007F");
    for (let c = 0x80; c <= 0x9f; c++) expect(isInert(terminalField(String.fromCharCode(c)), false)).toBe(true);
  });

  it("escapes every bidi control, which could reorder a verdict line on screen", () => {
    for (const ch of BIDI) expect(terminalField(`x${ch}y`)).toBe(`x\\u${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0")}y`);
    expect(terminalField("FAIL \u202eSSAP")).toBe("FAIL \\u202ESSAP");
    expect(terminalField("a\u2028b\u2029c")).toBe("a\\u2028b\\u2029c");
  });

  it("escapes a line feed in a field (a name cannot forge a line) but keeps the lines the CLI composed", () => {
    expect(terminalField("Bus A\n  every verdict passes")).toBe("Bus A\\x0A  every verdict passes");
    expect(terminalLines("line 1\nline 2\r\x1b[2K")).toBe("line 1\nline 2\\x0D\\x1B[2K");
  });

  it("leaves ordinary text, accents, other scripts and symbols as they are", () => {
    for (const s of ['Transformer 1 (1.6 MVA)', "Käserei Süd", "Σ I\"k 72.6 kA", "东区母线", "محطة", "tab-free text; 50 %"]) {
      expect(terminalField(s)).toBe(s);
      expect(hasControls(s)).toBe(false);
    }
    expect(hasControls("x\x1b")).toBe(true);
  });

  it("escapes each of the 65 Cc characters (C0, DEL, C1), and only these below U+00A0", () => {
    for (let c = 0; c < 0xa0; c++) {
      const ch = String.fromCharCode(c);
      const cc = c < 0x20 || (c >= 0x7f && c <= 0x9f);
      expect(terminalField(ch) === ch, `U+${c.toString(16)}`).toBe(!cc);
      if (cc) expect(terminalField(ch)).toBe(escapeControl(ch));
    }
  });

  it("makes JSON text inert while keeping the same value when parsed", () => {
    const value = { name: `x\x1b[2K\ry\x07\u009b\u202e\u2066z\u007f`, list: ["\u2028", "plain"] };
    const json = jsonForTerminal(JSON.stringify(value, null, 2));
    expect(isInert(json, true)).toBe(true);
    expect(JSON.parse(json)).toEqual(value);
    // ordinary JSON is unchanged, byte for byte
    const plain = JSON.stringify({ a: "Käserei", b: [1, 2.5], c: null }, null, 2);
    expect(jsonForTerminal(plain)).toBe(plain);
  });

  it("escapes everything printed through the console while a command runs, and restores the console after", () => {
    const printed: string[] = [];
    const print = (...a: unknown[]) => void printed.push(a.join(" "));
    const target = { log: print, info: print, warn: print, error: print };
    const original = target.log;
    const restore = guardConsole(target as unknown as Console);
    target.log("FAIL", `Q1${ERASE_LINE}\rPASS`);
    target.error(JSON.stringify({ name: "x\u202ey" }, null, 2));
    restore();
    expect(printed[0]).toBe("FAIL Q1\\x1B[2K\\x0DPASS");
    expect(JSON.parse(printed[1])).toEqual({ name: "x\u202ey" });
    expect(isInert(printed[1], true)).toBe(true);
    expect(target.log).toBe(original);
  });

  it("prints JSON Lines one value a line, inert and parsing back to the same values", () => {
    const lines: string[] = [];
    const spy = vi.spyOn(console, "log").mockImplementation((t: string) => void lines.push(t));
    try {
      const out = consoleOutput();
      const a = { kind: "verdict", device: `Q1\r${ERASE_LINE}\u202e`, t_s: 0.25 };
      out.jsonLine(a);
      out.jsonLine({ kind: "totals", fail: 0 });
      expect(lines).toHaveLength(2);
      for (const l of lines) expect(isInert(l, false)).toBe(true);
      expect(lines.map((l) => JSON.parse(l))).toEqual([a, { kind: "totals", fail: 0 }]);
    } finally {
      spy.mockRestore();
    }
  });
});
