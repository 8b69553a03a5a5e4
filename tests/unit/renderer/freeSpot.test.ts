import { describe, it, expect } from "vitest";
import { freeSpot, occupiedBoxes } from "../../../renderer/canvas/freeSpot.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { newElement } from "../../../renderer/canvas/newElement.ts";
import { SHUNT_BOX } from "../../../renderer/canvas/symbols/ElementSymbol.tsx";
import type { Element, Project } from "../../../src/model/schema.ts";

function withParts(): Project {
  const p = newProject("spots");
  p.elements.push(newElement("bus", p) as Element);
  p.elements.push(newElement("load", p) as Element);
  p.layout = { B1: { x: 200, y: 100, w: 240 }, LD1: { x: 200, y: 200 } };
  return p;
}

const apart = (a: { x: number; y: number; w: number; h: number }, b: { x: number; y: number; w: number; h: number }) =>
  Math.abs(a.x - b.x) * 2 >= a.w + b.w || Math.abs(a.y - b.y) * 2 >= a.h + b.h;

describe("a new part's place", () => {
  it("keeps the wanted spot when it is free", () => {
    expect(freeSpot(withParts(), { x: 600, y: 400 }, SHUNT_BOX)).toEqual({ x: 600, y: 400 });
  });

  it("moves off a taken spot to the nearest free one, overlapping no part", () => {
    const doc = withParts();
    const spot = freeSpot(doc, { x: 200, y: 200 }, SHUNT_BOX);
    expect(spot).not.toEqual({ x: 200, y: 200 });
    for (const b of occupiedBoxes(doc)) expect(apart({ ...spot, ...SHUNT_BOX }, b)).toBe(true);
    // nearest: within a few grid steps of the wanted place
    expect(Math.hypot(spot.x - 200, spot.y - 200)).toBeLessThan(200);
  });

  it("ten parts added at one spot never land on one another", () => {
    const doc = withParts();
    for (let k = 0; k < 10; k++) {
      const e = newElement("load", doc) as Element;
      doc.elements.push(e);
      doc.layout[e.id] = freeSpot(doc, { x: 200, y: 200 }, SHUNT_BOX);
    }
    const boxes = occupiedBoxes(doc);
    for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) expect(apart(boxes[i], boxes[j]), `${i} and ${j}`).toBe(true);
  });
});
