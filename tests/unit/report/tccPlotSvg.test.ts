import { describe, expect, it } from "vitest";
import { tccPlotSvg, type TccPlotInput } from "../../../src/report/tccPlotSvg.ts";

const base: TccPlotInput = {
  title: "Test path",
  reference_kV: 0.4,
  iMin_A: 10,
  iMax_A: 10000,
  tMin_s: 0.01,
  tMax_s: 1000,
  curves: [],
  references: [],
  marks: [],
  points: [],
};

describe("time-current plot SVG", () => {
  it("labels every decade of current and time", () => {
    const svg = tccPlotSvg(base);
    for (const label of ["10", "100", "1000", "10000", "0.01", "0.1", "1", "1000"]) expect(svg).toContain(`>${label}</text>`);
    expect(svg).toContain("Current in A at 0.4 kV");
  });

  it("places a point at its log-log position", () => {
    // independent computation: plot area left 64, top 40, width 560, height 470 (tccPlotSvg layout);
    // 100 A on 10..10000 A is 1/3 of three decades; 1 s on 0.01..1000 s is 2/5 of five decades
    const svg = tccPlotSvg({ ...base, points: [{ label: "inrush", current_A: 100, time_s: 1 }] });
    const x = 64 + 560 / 3;
    const y = 40 + 470 - (2 / 5) * 470;
    const r = (v: number) => String(Math.round(v * 10) / 10);
    expect(svg).toContain(`M${r(x - 4)} ${r(y - 4)}L${r(x + 4)} ${r(y + 4)}`);
  });

  it("draws a band between the fast and slow edges and the nominal curve", () => {
    const svg = tccPlotSvg({
      ...base,
      curves: [{ label: "R1 (primary)", color: "#123456", nominal: [[100, 10], [1000, 1]], min: [[90, 9], [900, 0.9]], max: [[110, 11], [1100, 1.1]] }],
    });
    expect(svg).toMatch(/<path d="M[^"]+Z" fill="#123456" fill-opacity="0.16"/);
    expect(svg).toMatch(/<path d="M[^"]+" fill="none" stroke="#123456" stroke-width="1.8"\/>/);
    expect(svg).toContain("R1 (primary)");
  });

  it("escapes text", () => {
    expect(tccPlotSvg({ ...base, title: "A<B & C" })).toContain("A&lt;B &amp; C");
  });
});
