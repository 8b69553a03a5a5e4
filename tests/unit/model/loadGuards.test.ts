// Checks before the schema: a hostile nesting depth is a clear load error (not a stack overflow), and bytes
// that were not UTF-8 (replaced by U+FFFD when the host decoded the file) give a warning naming the lines.
import { describe, expect, it } from "vitest";
import { loadProject } from "../../../src/model/projectFile.ts";
import { smallDoc } from "./fixtures/smallProject.ts";

describe("load errors before the schema", () => {
  it("reports 100,000-deep nesting as a clear error naming the field, not a stack overflow", () => {
    const deep = "[".repeat(100000) + "]".repeat(100000);
    const r = loadProject(`{"format":"islet-project","formatVersion":1,"meta":{"name":"x"},"elements":[],"scenarios":[],"extra":${deep}}`);
    expect(r).toEqual({
      ok: false,
      error: { kind: "notAProject", messages: ['Project file: values nest 100001 levels deep under the field "extra"; a project nests far less (this build reads up to 64 levels), so the file is not read'] },
    });
  });

  it("warns about bytes that were not UTF-8, naming the lines", () => {
    const text = JSON.stringify(smallDoc(), null, 2);
    const bytes = Buffer.from(text, "utf8");
    // put a lone continuation byte (0x80) and a truncated two-byte sequence (0xC3) into names on two lines
    const at = (s: string) => bytes.indexOf(Buffer.from(s, "utf8"));
    bytes[at("MV board") + 2] = 0x80;
    bytes[at("Dock board") + 4] = 0xc3;
    const lineOf = (s: string) => text.slice(0, text.indexOf(s)).split("\n").length;
    const r = loadProject(bytes.toString("utf8"));
    expect(r.ok).toBe(true);
    if (r.ok)
      expect(r.warnings).toContain(
        `Project file: lines ${lineOf("MV board")}, ${lineOf("Dock board")} hold the replacement character U+FFFD: bytes there were not valid UTF-8 and were replaced when the file was read (or the character was typed on purpose). Check the text there; saving writes U+FFFD, not the original bytes`,
      );
  });
});
