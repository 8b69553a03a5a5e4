// Text the CLI prints, made safe for a terminal. A project file's names and ids reach stdout and stderr; a name
// holding ESC sequences, CR, BEL or bidi controls could move the cursor, erase or recolour lines, or reorder what
// the reader sees (hiding a failing verdict). Every control character is shown escaped instead, as \xHH (C0) or
// \uHHHH (DEL, C1, bidi and line-separator controls), so that it is visible and does nothing. The \u form is also a
// JSON escape, and raw C0 never occurs in JSON text outside its layout's line feeds (JSON.stringify escapes it), so
// escaping JSON text leaves it valid and the same value when parsed.
//
// Three levels:
// - terminalField: one piece of user text inside a line (a name, an id, a message); a line feed is escaped too,
//   so a name cannot forge a line of its own.
// - terminalLines: a block of lines the CLI composed; its own line feeds stay, every other control is escaped.
// - jsonForTerminal: JSON text; JSON.stringify already escapes C0 controls inside strings, the rest (DEL, C1, bidi)
//   become \u escapes, which parse back to the same value.

// C0 controls, DEL and C1 controls (Unicode general category Cc).
const CC = "\\u0000-\\u001f\\u007f-\\u009f";
// Bidi controls (ALM, LRM, RLM, LRE..RLO, LRI..PDI) and the line and paragraph separators. Unicode Standard
// Annex #9 (bidirectional algorithm), Table 4; U+2028/U+2029 are Unicode's line and paragraph separators.
const BIDI_AND_SEPARATORS = "\\u061c\\u200e\\u200f\\u202a-\\u202e\\u2066-\\u2069\\u2028\\u2029";

const ALL_CONTROLS = new RegExp(`[${CC}${BIDI_AND_SEPARATORS}]`, "g");
const CONTROLS_BUT_LINE_FEED = new RegExp(`[\\u0000-\\u0009\\u000b-\\u001f\\u007f-\\u009f${BIDI_AND_SEPARATORS}]`, "g");
// In JSON text C0 controls can only be the layout's own line feeds (JSON.stringify escapes them inside strings).
const JSON_UNSAFE = new RegExp(`[\\u007f-\\u009f${BIDI_AND_SEPARATORS}]`, "g");

function hex(code: number, width: number): string {
  return code.toString(16).toUpperCase().padStart(width, "0");
}

/** The visible form of one control character: \x1B for ESC, \u009B for the one-byte CSI, \u202E for RLO. */
export function escapeControl(ch: string): string {
  const code = ch.codePointAt(0) ?? 0;
  return code < 0x20 ? `\\x${hex(code, 2)}` : `\\u${hex(code, 4)}`;
}

/** One piece of user text (name, id, message) for a terminal: every control escaped, line feeds included. */
export function terminalField(text: string): string {
  return text.replace(ALL_CONTROLS, escapeControl);
}

/** Lines the CLI composed: its line feeds kept, every other control escaped. */
export function terminalLines(text: string): string {
  return text.replace(CONTROLS_BUT_LINE_FEED, escapeControl);
}

/** JSON text for a terminal or a pipe: the same value when parsed, with no raw control that a terminal obeys. */
export function jsonForTerminal(json: string): string {
  return json.replace(JSON_UNSAFE, escapeControl);
}

/** True when the text holds a character that terminalField would escape. */
export function hasControls(text: string): boolean {
  ALL_CONTROLS.lastIndex = 0;
  return ALL_CONTROLS.test(text);
}
