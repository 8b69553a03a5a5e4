import { describe, expect, it } from "vitest";
import { distanceToPolyline, distanceToSegment, hitTest, insidePolygon } from "../../../renderer/panes/tcc/hitTest.ts";

describe("distance from the pointer to a curve", () => {
  it("is the perpendicular distance inside a segment", () => {
    // point (3, 4) above segment (0,0)-(10,0): distance 4 (hand calculation)
    expect(distanceToSegment(3, 4, 0, 0, 10, 0)).toBe(4);
  });
  it("is the distance to the nearer end beyond the segment", () => {
    // (13, 4) to end (10, 0): sqrt(3^2 + 4^2) = 5 (Pythagoras)
    expect(distanceToSegment(13, 4, 0, 0, 10, 0)).toBe(5);
  });
  it("takes the nearest segment of a polyline", () => {
    const line: [number, number][] = [
      [0, 0],
      [10, 0],
      [10, 10],
    ];
    // (12, 5) is 2 px from the vertical segment x = 10 (hand calculation)
    expect(distanceToPolyline(12, 5, line)).toBe(2);
  });
});

describe("point in a tolerance band", () => {
  const square: [number, number][] = [
    [0, 0],
    [10, 0],
    [10, 10],
    [0, 10],
  ];
  it("finds points inside and outside", () => {
    expect(insidePolygon(5, 5, square)).toBe(true);
    expect(insidePolygon(15, 5, square)).toBe(false);
  });
});

describe("which curve is under the pointer", () => {
  const a = { index: 0, nominal: [[0, 0], [100, 0]] as [number, number][], band: [[0, -20], [100, -20], [100, 20], [0, 20]] as [number, number][] };
  const b = { index: 1, nominal: [[0, 10], [100, 10]] as [number, number][], band: [] };

  it("picks the nearest line within the tolerance", () => {
    // y = 7 is 7 px from a and 3 px from b
    expect(hitTest(50, 7, [a, b], 6)).toBe(1);
  });
  it("falls back to the band that contains the pointer", () => {
    // y = -15 is 15 px from a's line and 25 px from b's, but inside a's band
    expect(hitTest(50, -15, [a, b], 6)).toBe(0);
  });
  it("finds nothing far from every curve", () => {
    expect(hitTest(50, 60, [a, b], 6)).toBeNull();
  });
});
