import { describe, expect, it } from "vitest";
import { evaluate } from "mathjs";
import { dragAxis, roundSignificant, settingFromDrag } from "../../../renderer/panes/tcc/dragSetting.ts";

// IEC 60255-151:2009, Table 1, standard inverse: t = TMS * 0.14 / ((I/Is)^0.02 - 1)
const iecSi = (i_A: number, pickup_A: number, tms: number) => evaluate("tms * 0.14 / ((i / is) ^ 0.02 - 1)", { tms, i: i_A, is: pickup_A }) as number;
// IEEE C37.112-2018, Table 1, very inverse: t = TD * (19.61 / (M^2 - 1) + 0.491)
const ieeeVi = (i_A: number, pickup_A: number, td: number) => evaluate("td * (19.61 / ((i / is) ^ 2 - 1) + 0.491)", { td, i: i_A, is: pickup_A }) as number;

describe("dragging a curve sideways changes its pickup", () => {
  it("moves the IEC standard inverse curve so it passes through the pointer", () => {
    const pickup_A = 400;
    const tms = 0.2;
    const i0 = 2000;
    const t0 = iecSi(i0, pickup_A, tms);
    const patch = settingFromDrag("pickup", { pickup_A, multiplier: tms, current0_A: i0, time0_s: t0 }, 2600, t0);
    // by the IEC formula t depends on I / Is only, so Is x 2600/2000 keeps t0 at 2600 A
    expect(patch.pickup_A).toBe(520);
    expect(patch.multiplier).toBeUndefined();
    expect(iecSi(2600, patch.pickup_A!, tms)).toBeCloseTo(t0, 9);
  });

  it("rounds the new pickup to three significant digits", () => {
    const patch = settingFromDrag("pickup", { pickup_A: 400, current0_A: 1000, time0_s: 1 }, 1234.5678, 1);
    // 400 * 1.2345678 = 493.827 -> 494 (hand calculation)
    expect(patch.pickup_A).toBe(494);
  });

  it("stays inside the pickup limits", () => {
    const patch = settingFromDrag("pickup", { pickup_A: 400, current0_A: 1000, time0_s: 1 }, 10, 1, { pickupMin_A: 50 });
    expect(patch.pickup_A).toBe(50);
  });
});

describe("dragging a curve up or down changes its time multiplier", () => {
  it("moves the IEC standard inverse curve so it passes through the pointer", () => {
    const i0 = 2000;
    const t0 = iecSi(i0, 400, 0.2);
    const patch = settingFromDrag("multiplier", { pickup_A: 400, multiplier: 0.2, current0_A: i0, time0_s: t0 }, i0, 1.5 * t0);
    // IEC 60255-151: t is proportional to TMS, so 1.5 x t0 needs TMS 0.3
    expect(patch.multiplier).toBeCloseTo(0.3, 12);
    expect(iecSi(i0, 400, patch.multiplier!)).toBeCloseTo(1.5 * t0, 9);
  });

  it("does the same for the IEEE very inverse curve (time dial)", () => {
    const i0 = 1500;
    const t0 = ieeeVi(i0, 300, 2);
    const patch = settingFromDrag("multiplier", { pickup_A: 300, multiplier: 2, current0_A: i0, time0_s: t0 }, i0, t0 / 4);
    // IEEE C37.112: t is proportional to TD, so a quarter of the time needs TD 0.5
    expect(patch.multiplier).toBe(0.5);
    expect(ieeeVi(i0, 300, 0.5)).toBeCloseTo(t0 / 4, 9);
  });

  it("keeps the multiplier at or above its lower limit", () => {
    const patch = settingFromDrag("multiplier", { pickup_A: 300, multiplier: 0.05, current0_A: 1000, time0_s: 1 }, 1000, 0.001);
    // default floor 0.01 (common practice: the smallest TMS step of numerical relays)
    expect(patch.multiplier).toBe(0.01);
  });
});

describe("which setting a drag changes", () => {
  const both = { pickup: true, multiplier: true };
  it("waits until the pointer has moved a few pixels", () => {
    expect(dragAxis(2, 1, both)).toBeNull();
  });
  it("follows the dominant direction", () => {
    expect(dragAxis(12, 3, both)).toBe("pickup");
    expect(dragAxis(-2, -9, both)).toBe("multiplier");
  });
  it("uses the only setting a curve allows, whatever the direction", () => {
    expect(dragAxis(0, 20, { pickup: true })).toBe("pickup");
    expect(dragAxis(20, 0, { multiplier: true })).toBe("multiplier");
    expect(dragAxis(20, 0, {})).toBeNull();
  });
});

describe("significant-digit rounding", () => {
  it("rounds to the given number of significant digits", () => {
    // hand calculation
    expect(roundSignificant(0.123456, 3)).toBe(0.123);
    expect(roundSignificant(98765, 2)).toBe(99000);
  });
});
