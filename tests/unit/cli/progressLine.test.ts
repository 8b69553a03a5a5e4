// The progress line as a unit, on a clock and a terminal of the test's own: throttled, erasing itself, never
// wider than the terminal, silent off a terminal. The erase is ECMA-48's EL with parameter 2 (8.3.41) after a
// carriage return, the sequence a terminal obeys to blank the current line.
import { describe, expect, it } from "vitest";
import { ERASE_LINE, estimateLeft_ms, formatDuration, formatProgress, ProgressLine, progressFor, silentProgress } from "../../../src/cli/progress/progressLine.ts";

function terminal(columns?: number) {
  let t = 0;
  const writes: string[] = [];
  const line = new ProgressLine({ label: "islet check", now: () => t, write: (s) => void writes.push(s), columns: () => columns });
  return { line, writes, advance: (ms: number) => void (t += ms) };
}

/** What the screen line shows after the writes: each erase blanks it (ECMA-48 EL 2 after CR). */
function screenLine(writes: string[]): string {
  let shown = "";
  for (const w of writes) {
    if (!w.startsWith(ERASE_LINE)) throw new Error(`a write that does not start by erasing: ${JSON.stringify(w)}`);
    shown = w.slice(ERASE_LINE.length);
  }
  return shown;
}

describe("progress line", () => {
  it("draws at most four times a second however often it is told (one update a millisecond for 2 s)", () => {
    const term = terminal();
    for (let ms = 0; ms < 2000; ms++) {
      term.line.update("fault cases", ms, 2000);
      term.advance(1);
    }
    // 250 ms apart: drawings at 250, 500, ..., 1750 ms (the first waits one interval, so a short run shows nothing)
    expect(term.line.drawings).toBe(7);
    expect(term.writes).toHaveLength(7);
  });

  it("shows nothing for a run shorter than one interval", () => {
    const term = terminal();
    for (let k = 0; k < 50; k++) {
      term.line.update("fault cases", k, 50);
      term.advance(4);
    }
    term.line.clear();
    expect(term.writes).toEqual([]);
  });

  it("redraws in place and erases itself when cleared, once", () => {
    const term = terminal();
    term.advance(300);
    term.line.update("fault cases", 100, 400);
    term.advance(300);
    term.line.update("fault cases", 200, 400);
    expect(screenLine(term.writes)).toMatch(/^islet check: fault cases 200 of 400 \(50%\)/);
    term.line.clear();
    term.line.clear();
    expect(term.writes.at(-1)).toBe(ERASE_LINE);
    expect(term.writes.filter((w) => w === ERASE_LINE)).toHaveLength(1);
    expect(screenLine(term.writes)).toBe("");
  });

  it("shows the phase, the cases done of total, elapsed time and the time left from the rate since the count began", () => {
    const term = terminal();
    // 4 s of loading before the first case: not part of the rate
    term.advance(4_000);
    term.line.update("fault cases", 0, 5_000);
    term.advance(10_000);
    term.line.update("fault cases", 1_250, 5_000);
    // 1,250 cases in 10 s: 3,750 left at the same rate take 30 s
    expect(screenLine(term.writes)).toBe("islet check: fault cases 1,250 of 5,000 (25%), 0:14 elapsed, about 0:30 left");
    // a new count (another total) starts a new rate: no estimate until a second of it has passed
    term.advance(300);
    term.line.update("timelines", 1, 4);
    expect(screenLine(term.writes)).toBe("islet check: timelines 1 of 4 (25%), 0:14 elapsed");
    expect(estimateLeft_ms(1_250, 5_000, 10_000)).toBe(30_000);
    expect(estimateLeft_ms(0, 5_000, 10_000)).toBeNull();
    expect(estimateLeft_ms(10, 5_000, 500)).toBeNull();
    expect(estimateLeft_ms(5_000, 5_000, 60_000)).toBeNull();
    expect(formatProgress({ label: "islet report", phase: "printing the PDF", done: 0, total: 0, elapsed_ms: 75_000, left_ms: null })).toBe("islet report: printing the PDF, 1:15 elapsed");
    expect(formatDuration(3_723_000)).toBe("1:02:03");
  });

  it("is never wider than the terminal less one column (a wrapped line could not be erased)", () => {
    const term = terminal(40);
    term.advance(2000);
    term.line.update("fault cases", 123_456, 999_999);
    expect(screenLine(term.writes).length).toBe(39);
  });

  it("is silent when stderr is not a terminal or with --quiet, and draws on a terminal", () => {
    const writes: string[] = [];
    const pipe = { isTTY: false, write: (s: string) => void writes.push(s) };
    expect(progressFor("islet study", pipe, false)).toBe(silentProgress);
    expect(progressFor("islet study", { ...pipe, isTTY: true }, true)).toBe(silentProgress);
    let t = 0;
    const tty = progressFor("islet study", { isTTY: true, columns: 100, write: (s: string) => void writes.push(s) }, false, () => t);
    tty.update("bus faults", 0, 10);
    t = 1000;
    tty.update("bus faults", 5, 10);
    tty.clear();
    expect(writes).toEqual([`${ERASE_LINE}islet study: bus faults 5 of 10 (50%), 0:01 elapsed, about 0:01 left`, ERASE_LINE]);
  });
});
