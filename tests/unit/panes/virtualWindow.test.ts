import { describe, expect, it } from "vitest";
import { virtualWindow } from "../../../renderer/panes/verdicts/virtualWindow.ts";

describe("rendering only the visible lines of a long list", () => {
  it("renders the lines in view plus the overscan", () => {
    // scrolled 240 px with 24 px lines: first visible line 10; 120 px shows 5 lines (+1 partly) -> 10..16, overscan 2 -> 8..18
    const w = virtualWindow(240, 120, 24, 1000, 2);
    expect(w).toEqual({ start: 8, end: 18, padTop_px: 8 * 24, padBottom_px: (1000 - 18) * 24 });
  });
  it("keeps the total height of the list", () => {
    const w = virtualWindow(5000, 300, 24, 4000, 8);
    // padding plus rendered lines add up to count x line height (conservation)
    expect(w.padTop_px + (w.end - w.start) * 24 + w.padBottom_px).toBe(4000 * 24);
  });
  it("clamps at the end of the list", () => {
    const w = virtualWindow(1e6, 300, 24, 50, 4);
    expect(w.end).toBe(50);
    expect(w.padBottom_px).toBe(0);
  });
  it("renders nothing for an empty list", () => {
    expect(virtualWindow(0, 300, 24, 0)).toEqual({ start: 0, end: 0, padTop_px: 0, padBottom_px: 0 });
  });
});
