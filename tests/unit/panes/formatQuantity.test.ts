import { describe, expect, it } from "vitest";
import { formatCurrent_A, formatTime_s, trimNumber } from "../../../renderer/panes/shared/formatQuantity.ts";

describe("number formatting in the panes", () => {
  it("writes currents above 1000 A in kA to three significant digits", () => {
    // 12 437 A = 12.437 kA -> 12.4 kA (SI prefix, rounding by hand)
    expect(formatCurrent_A(12437)).toBe("12.4 kA");
    expect(formatCurrent_A(850)).toBe("850 A");
  });
  it("writes times under a second in ms", () => {
    expect(formatTime_s(0.0354)).toBe("35.4 ms");
    expect(formatTime_s(1.7194)).toBe("1.72 s");
  });
  it("writes a dash for a missing value", () => {
    expect(formatTime_s(null)).toBe("—");
    expect(formatCurrent_A(Number.NaN)).toBe("—");
  });
  it("trims trailing zeros", () => {
    expect(trimNumber(0.5, 3)).toBe("0.5");
  });
});
