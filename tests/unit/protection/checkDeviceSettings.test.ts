import { describe, it, expect } from "vitest";
import { checkDeviceSettings, operatingTime, balancedMeasurement, sampleCurve, accumulate, initialTravel, SettingsError, TMS_RANGE, TD_RANGE } from "../../../src/protection/index.ts";
import { breaker, fn51, fuse, relay } from "./devices.ts";

const fieldsOf = (msgs: ReturnType<typeof checkDeviceSettings>, severity: "error" | "warning") => msgs.filter((m) => m.severity === severity).map((m) => m.field);

describe("settings check", () => {
  it("accepts a sound relay without messages", () => {
    expect(checkDeviceSettings(relay([fn51()]))).toEqual([]);
  });

  it("names element id, name, field and value for a non-positive pickup", () => {
    const r = relay([fn51()]);
    r.functions[0].pickup_A = 0;
    const [m] = checkDeviceSettings(r);
    expect(m).toMatchObject({ severity: "error", elementId: "R1", elementName: "Dock feeder", field: "functions[0].pickup_A" });
    expect(m.text).toBe('Relay R1 "Dock feeder": functions[0].pickup_A (function F51) must be > 0 (got 0)');
  });

  it("refuses tMin_s above tMax_s", () => {
    expect(fieldsOf(checkDeviceSettings(relay([fn51({ tMin_s: 2, tMax_s: 1 })])), "error")).toEqual(["functions[0].tMin_s"]);
  });

  it("warns on a TMS or time dial outside the usual range", () => {
    // IEC TMS 0.01-1.5, IEEE TD 0.1-15 // common practice
    expect(TMS_RANGE).toEqual({ min: 0.01, max: 1.5 });
    expect(TD_RANGE).toEqual({ min: 0.1, max: 15 });
    expect(fieldsOf(checkDeviceSettings(relay([fn51({ multiplier: 2 })])), "warning")).toEqual(["functions[0].multiplier"]);
    expect(fieldsOf(checkDeviceSettings(relay([fn51({ curve: "ieee-very-inverse", multiplier: 20 })])), "warning")).toEqual(["functions[0].multiplier"]);
    expect(checkDeviceSettings(relay([fn51({ curve: "ieee-very-inverse", multiplier: 2 })]))).toEqual([]);
  });

  it("refuses a negative or NaN multiplier and a repeated function id", () => {
    const r = relay([fn51(), fn51({ curve: "ieee-very-inverse" })]);
    r.functions[0].multiplier = Number.NaN;
    const errs = fieldsOf(checkDeviceSettings(r), "error");
    expect(errs).toContain("functions[0].multiplier");
    expect(errs).toContain("functions[1].id");
  });

  it("warns when a function measures an unusual quantity for its device number", () => {
    expect(fieldsOf(checkDeviceSettings(relay([fn51({ ansi: "51N" })])), "warning")).toEqual(["functions[0].quantity"]); // IEEE C37.2: 51N is residual
  });

  it("refuses a fuse with a missing or too short curve", () => {
    const f = fuse({ kind: "points", melt: [[100, 10], [200, 1]], clear: [[100, 10], [200, 1]] });
    (f.curve as { clear: unknown }).clear = [[100, 10]];
    expect(fieldsOf(checkDeviceSettings(f), "error")).toEqual(["curve.clear"]);
  });

  it("refuses a non-positive fuse rating and a breaker tr_s of 0", () => {
    const f = fuse();
    f.rating_A = -5;
    expect(checkDeviceSettings(f)[0].text).toBe('Fuse FU1 "Pump fuse": rating_A must be > 0 (got -5)');
    const b = breaker();
    b.longTime.tr_s = 0;
    expect(fieldsOf(checkDeviceSettings(b), "error")).toEqual(["longTime.tr_s"]);
  });

  it("makes every computation throw SettingsError and keeps the device untouched", () => {
    const r = relay([fn51({ tMin_s: 3, tMax_s: 1 })]);
    const copy = JSON.parse(JSON.stringify(r));
    expect(() => operatingTime(r, balancedMeasurement(500))).toThrow(SettingsError);
    expect(() => sampleCurve(r)).toThrow(SettingsError);
    expect(() => accumulate(initialTravel(), r, balancedMeasurement(500), 0.1)).toThrow(SettingsError);
    expect(JSON.parse(JSON.stringify(r))).toEqual(copy);
  });
});
