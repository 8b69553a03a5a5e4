import { describe, it, expect } from "vitest";
import { stableItems } from "../../../renderer/canvas/stableItems.ts";

describe("reusing unchanged nodes between renders", () => {
  const el = { id: "B1" };
  it("keeps the previous object when position and data are equal", () => {
    const prev = [{ id: "a", position: { x: 1, y: 2 }, data: { element: el, marks: { R1: { role: "primary" } } } }];
    const next = [{ id: "a", position: { x: 1, y: 2 }, data: { element: el, marks: { R1: { role: "primary" } } } }];
    expect(stableItems(prev, next)[0]).toBe(prev[0]);
  });
  it("takes the new object when anything it draws changed", () => {
    type N = { id: string; position: { x: number; y: number }; selected?: boolean; data: { element: Record<string, unknown> } };
    const prev: N[] = [{ id: "a", position: { x: 1, y: 2 }, data: { element: el } }];
    expect(stableItems<N>(prev, [{ id: "a", position: { x: 1, y: 3 }, data: { element: el } }])[0]).not.toBe(prev[0]);
    expect(stableItems<N>(prev, [{ id: "a", position: { x: 1, y: 2 }, data: { element: { id: "B1", name: "Dock" } } }])[0]).not.toBe(prev[0]);
    expect(stableItems<N>(prev, [{ id: "a", position: { x: 1, y: 2 }, selected: true, data: { element: el } }])[0]).not.toBe(prev[0]);
  });
});
