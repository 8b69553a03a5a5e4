import { describe, it, expect } from "vitest";
import { checkLvOverload, deviceOverloadCurrents, BREAKER_CONVENTIONAL_FACTOR, FUSE_CONVENTIONAL_FACTOR } from "../../../src/protection/lvOverload.ts";
import { fuseSchema, lvBreakerSchema } from "../../../src/model/schema.ts";

// IEC 60364-4-43:2008, 433.1: IB <= In <= IZ (a) and I2 <= 1.45 IZ (b). // from memory (reference-checks.md)
describe("LV overload check of a conductor (IEC 60364-4-43, 433.1)", () => {
  it("a 250 A breaker set at In on a 280 A cable carrying 200 A passes: 200 <= 250 <= 280, 325 <= 406", () => {
    const f = checkLvOverload({ design_A: 200, rated_A: 250, conventionalTrip_A: 1.3 * 250, ampacity_A: 280 });
    expect(f.ok).toBe(true);
    expect(f.limit_A).toBeCloseTo(406, 9); // 1.45 x 280
    expect(f).toMatchObject({ designWithinRated: true, ratedWithinAmpacity: true, conventionalWithinLimit: true, problems: [] });
  });

  it("a 400 A breaker on a 280 A cable fails both conditions: 400 > 280 and 520 > 406", () => {
    const f = checkLvOverload({ rated_A: 400, conventionalTrip_A: 1.3 * 400, ampacity_A: 280 });
    expect(f.ok).toBe(false);
    expect(f.designWithinRated).toBeNull(); // no design current given: not judged
    expect(f.problems).toEqual(["rated-above-ampacity", "conventional-above-limit"]);
    expect(f.texts[0]).toContain("400 A");
    expect(f.texts[1]).toContain("406 A");
  });

  it("a design current above the setting fails condition a alone", () => {
    const f = checkLvOverload({ design_A: 260, rated_A: 250, conventionalTrip_A: 325, ampacity_A: 280 });
    expect(f.problems).toEqual(["design-above-rated"]);
  });

  it("at the boundaries In = IZ and I2 = 1.45 IZ the conductor is protected (both are 'less than or equal')", () => {
    expect(checkLvOverload({ design_A: 100, rated_A: 100, conventionalTrip_A: 145, ampacity_A: 100 }).ok).toBe(true);
    expect(checkLvOverload({ rated_A: 100, conventionalTrip_A: 145.01, ampacity_A: 100 }).problems).toEqual(["conventional-above-limit"]);
  });

  it("a fuse whose In is within IZ can still fail on I2: 1.6 In > 1.45 IZ when In > 0.906 IZ", () => {
    // IEC 60269-1 gG: conventional fusing current 1.6 In // from memory
    const f = checkLvOverload({ rated_A: 100, conventionalTrip_A: 160, ampacity_A: 100 });
    expect(f.problems).toEqual(["conventional-above-limit"]);
  });

  it("refuses figures that are not positive numbers, naming the field", () => {
    expect(() => checkLvOverload({ rated_A: 0, conventionalTrip_A: 1, ampacity_A: 1 })).toThrow(/rated_A/);
    expect(() => checkLvOverload({ rated_A: 1, conventionalTrip_A: 1, ampacity_A: Number.NaN })).toThrow(/ampacity_A/);
    expect(() => checkLvOverload({ design_A: -1, rated_A: 1, conventionalTrip_A: 1, ampacity_A: 1 })).toThrow(/design_A/);
  });

  it("a breaker's set current is Ir = ir_x In, and I2 = 1.30 Ir; a fuse's I2 is 1.6 In", () => {
    const cb = lvBreakerSchema.parse({ kind: "lvbreaker", id: "CB1", at: { element: "C1", end: "from" }, in_A: 400, longTime: { ir_x: 0.7, tr_s: 10 } });
    // IEC 60947-2, Table 6: conventional tripping current 1.30 x the current setting // from memory
    expect(BREAKER_CONVENTIONAL_FACTOR).toBe(1.3);
    expect(deviceOverloadCurrents(cb)).toEqual({ rated_A: 280, conventionalTrip_A: 1.3 * 280 });
    const fuse = fuseSchema.parse({ kind: "fuse", id: "F1", at: { element: "C1", end: "from" }, rating_A: 250 });
    expect(FUSE_CONVENTIONAL_FACTOR).toBe(1.6);
    expect(deviceOverloadCurrents(fuse)).toEqual({ rated_A: 250, conventionalTrip_A: 400 });
  });
});
