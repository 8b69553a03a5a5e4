// Finds where a JSON text goes wrong. JSON.parse reports a position only in some engines,
// so this small scanner walks the grammar (RFC 8259) and stops at the first offending character.

export interface JsonSyntaxError {
  offset: number;
  line: number;
  column: number;
  /** e.g. "unexpected end of text", "unexpected character 'x'" */
  problem: string;
}

/** Returns null when the text is valid JSON. */
export function jsonSyntaxError(text: string): JsonSyntaxError | null {
  let i = 0;
  const fail = (problem?: string): never => {
    throw new ScanStop(i, problem ?? (i >= text.length ? "unexpected end of text" : `unexpected character ${quoteChar(text[i])}`));
  };
  const ws = () => {
    while (i < text.length && (text[i] === " " || text[i] === "\t" || text[i] === "\n" || text[i] === "\r")) i++;
  };
  const literal = (word: string) => {
    for (let k = 0; k < word.length; k++, i++) if (text[i] !== word[k]) fail();
  };
  const string = () => {
    i++; // opening quote
    for (;;) {
      if (i >= text.length) fail();
      const c = text.charCodeAt(i);
      if (c === 0x22) {
        i++;
        return;
      }
      if (c < 0x20) fail("control character inside a string");
      if (c === 0x5c) {
        i++;
        const e = text[i];
        if (e === "u") {
          i++;
          for (let k = 0; k < 4; k++, i++) if (!/[0-9a-fA-F]/.test(text[i] ?? "")) fail("bad \\u escape");
          continue;
        }
        if (e === undefined || !'"\\/bfnrt'.includes(e)) fail("bad escape in a string");
      }
      i++;
    }
  };
  const digits = () => {
    const start = i;
    while (i < text.length && text[i] >= "0" && text[i] <= "9") i++;
    if (i === start) fail();
  };
  const number = () => {
    if (text[i] === "-") i++;
    if (text[i] === "0") i++;
    else digits();
    if (text[i] === ".") {
      i++;
      digits();
    }
    if (text[i] === "e" || text[i] === "E") {
      i++;
      if (text[i] === "+" || text[i] === "-") i++;
      digits();
    }
  };
  const value = (depth: number): void => {
    if (depth > 2000) fail("nesting too deep");
    ws();
    const c = text[i];
    if (c === "{") {
      i++;
      ws();
      if (text[i] === "}") {
        i++;
        return;
      }
      for (;;) {
        ws();
        if (text[i] !== '"') fail();
        string();
        ws();
        if (text[i] !== ":") fail();
        i++;
        value(depth + 1);
        ws();
        if (text[i] === ",") {
          i++;
          continue;
        }
        if (text[i] === "}") {
          i++;
          return;
        }
        fail();
      }
    } else if (c === "[") {
      i++;
      ws();
      if (text[i] === "]") {
        i++;
        return;
      }
      for (;;) {
        value(depth + 1);
        ws();
        if (text[i] === ",") {
          i++;
          continue;
        }
        if (text[i] === "]") {
          i++;
          return;
        }
        fail();
      }
    } else if (c === '"') string();
    else if (c === "t") literal("true");
    else if (c === "f") literal("false");
    else if (c === "n") literal("null");
    else if (c === "-" || (c !== undefined && c >= "0" && c <= "9")) number();
    else fail();
  };
  try {
    if (text.charCodeAt(0) === 0xfeff) i = 1; // a UTF-8 byte-order mark is tolerated by the loader
    value(0);
    ws();
    if (i < text.length) fail("unexpected text after the end of the document");
    return null;
  } catch (err) {
    if (!(err instanceof ScanStop)) throw err;
    return { offset: err.offset, ...lineColumn(text, err.offset), problem: err.problem };
  }
}

class ScanStop {
  constructor(
    readonly offset: number,
    readonly problem: string,
  ) {}
}

function quoteChar(c: string | undefined): string {
  if (c === undefined) return "(end)";
  return JSON.stringify(c);
}

function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let col = 1;
  for (let k = 0; k < offset && k < text.length; k++) {
    if (text[k] === "\n") {
      line++;
      col = 1;
    } else col++;
  }
  return { line, column: col };
}
