import { describe, expect, it } from "vitest";
import { scaleLog } from "d3";
import { bandPath, linePath, regionAbovePath } from "../../../renderer/panes/tcc/bandPath.ts";
import type { CurvePoint } from "../../../renderer/panes/tcc/tccTypes.ts";

const id = (v: number) => v;

describe("tolerance band to SVG path", () => {
  const min: CurvePoint[] = [
    [1, 10],
    [2, 5],
  ];
  const max: CurvePoint[] = [
    [1.1, 11],
    [2.2, 5.5],
  ];

  it("runs along the fast edge, back along the slow edge, and closes", () => {
    // ring = min forward then max reversed (construction of a closed area between two curves)
    expect(bandPath(min, max, id, id)).toBe("M1,10L2,5L2.2,5.5L1.1,11Z");
  });

  it("drops points a log plot cannot show", () => {
    const withBad: CurvePoint[] = [[0, 3], [1, 10], [2, Number.POSITIVE_INFINITY], [2, 5]];
    expect(linePath(withBad, id, id)).toBe("M1,10L2,5");
  });

  it("is empty when an edge has fewer than two points", () => {
    expect(bandPath([[1, 1]], max, id, id)).toBe("");
  });

  it("places one decade of current over one decade of the axis on a log scale", () => {
    // d3 log scale over 10..1000 A onto 0..200 px: 100 A sits at 100 px (log10 midpoint)
    const x = scaleLog().domain([10, 1000]).range([0, 200]);
    const y = scaleLog().domain([0.01, 100]).range([400, 0]);
    // 1 s is half way between 0.01 and 100 s: 200 px from the bottom (log10 midpoint)
    expect(linePath([[100, 1], [1000, 0.01]], x, y)).toBe("M100,200L200,400");
  });
});

describe("equipment damage region", () => {
  it("closes the area above the withstand curve at the top of the plot", () => {
    const pts: CurvePoint[] = [
      [10, 50],
      [20, 30],
    ];
    // along the curve, up to the top row (y = 0), back to the first current (construction)
    expect(regionAbovePath(pts, id, id, 0)).toBe("M10,50L20,30L20,0L10,0Z");
  });
});
