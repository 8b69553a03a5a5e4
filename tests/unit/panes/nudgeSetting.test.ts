import { describe, expect, it } from "vitest";
import { nudgeSetting } from "../../../renderer/panes/tcc/nudgeSetting.ts";
import type { TccBand } from "../../../renderer/panes/tcc/tccTypes.ts";

const band: TccBand = {
  deviceId: "R1",
  functionId: "f51",
  deviceName: "R1",
  functionLabel: "51",
  pickup_A: 400,
  multiplier: 0.2,
  nominal: [],
  min: [],
  max: [],
  draggable: { pickup: true, multiplier: true },
};

describe("changing a setting from the keyboard", () => {
  it("raises the pickup by 5 % with Right and lowers it with Left", () => {
    // 400 * 1.05 = 420; 400 / 1.05 = 380.95 -> 381 (hand calculation, 3 significant digits)
    expect(nudgeSetting(band, "ArrowRight", false)).toEqual({ pickup_A: 420 });
    expect(nudgeSetting(band, "ArrowLeft", false)).toEqual({ pickup_A: 381 });
  });
  it("steps the multiplier by 25 % with Shift", () => {
    // 0.2 * 1.25 = 0.25; 0.2 / 1.25 = 0.16 (hand calculation)
    expect(nudgeSetting(band, "ArrowUp", true)).toEqual({ multiplier: 0.25 });
    expect(nudgeSetting(band, "ArrowDown", true)).toEqual({ multiplier: 0.16 });
  });
  it("does nothing a curve does not allow", () => {
    const fuse: TccBand = { ...band, multiplier: undefined, draggable: { pickup: true } };
    expect(nudgeSetting(fuse, "ArrowUp", false)).toBeNull();
    expect(nudgeSetting({ ...band, draggable: {} }, "ArrowRight", false)).toBeNull();
  });
  it("keeps the multiplier at or above its floor", () => {
    // default floor 0.01 (common practice: smallest TMS step of numerical relays)
    expect(nudgeSetting({ ...band, multiplier: 0.01 }, "ArrowDown", true)).toEqual({ multiplier: 0.01 });
  });
});
