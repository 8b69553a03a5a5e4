import { describe, it, expect } from "vitest";
import { criteriaSchema, relaySchema, lvBreakerSchema, type ProtectiveDevice } from "../../../src/model/schema.ts";
import { selectivityVerdicts, pairCti_s } from "../../../src/study/verdicts/selectivity.ts";
import type { DeviceResponse, FaultCase, FaultChains } from "../../../src/study/types.ts";

const at = { element: "X", end: "from" as const };
const lv = (id: string): ProtectiveDevice => lvBreakerSchema.parse({ kind: "lvbreaker", id, at, in_A: 630, longTime: { ir_x: 1, tr_s: 10 } });
const relay = (id: string): ProtectiveDevice =>
  relaySchema.parse({ kind: "relay", id, at, ctPrimary_A: 100, functions: [{ id: "f1", ansi: "51", quantity: "phase", pickup_A: 100 }] });

function response(device: string, kind: DeviceResponse["deviceKind"], fast_s: number, t_s: number, slow_s: number): DeviceResponse {
  return {
    device, deviceName: device, deviceKind: kind, iPhase_A: 5000, iResidual_A: 0, iNegative_A: 0, direction: "forward", pickedUp: true,
    operatingElement: "x", tOperate_s: t_s, tClear_s: t_s, tClearMin_s: fast_s, tClearMax_s: slow_s, role: "primary", onPathsOf: ["G"],
  };
}
const fc: FaultCase = { id: "s|bus:B|3ph|max", scenario: "s", location: { kind: "bus", bus: "B" }, faultType: "3ph", limit: "max", label: "3ph fault on bus B" };
const chains: FaultChains = {
  caseId: fc.id,
  idealIsolation: ["P"],
  paths: [{ source: "G", sourceName: "G", sourceKind: "grid", elements: [], links: [
    { device: "P", deviceName: "P", depth: 0, role: "primary", current_A: 5000, tClear_s: 0.05, marginToNext_s: null },
    { device: "B", deviceName: "B", depth: 1, role: "backup", current_A: 5000, tClear_s: 0.25, marginToNext_s: null },
  ] }],
};

describe("coordination interval by device pair", () => {
  const criteria = criteriaSchema.parse({});
  // Primary band 0.02-0.06 s, backup band 0.20-0.30 s: the bands are 0.14 s apart.
  const responses = new Map([["P", response("P", "lvbreaker", 0.02, 0.05, 0.06)], ["B", response("B", "lvbreaker", 0.2, 0.25, 0.3)]]);

  it("accepts a clear space between the bands of two LV trip units", () => {
    // IEEE Std 242 (from memory): direct-acting LV trip-unit curves include operating and clearing time,
    // so coordination needs only a clear space between the bands, no added CTI.
    const devices = new Map([["P", lv("P")], ["B", lv("B")]]);
    expect(pairCti_s(criteria, "P", "B", devices)).toBe(0);
    const [v] = selectivityVerdicts(fc, chains, responses, devices, criteria);
    expect(v.status).toBe("pass");
    expect(v.numbers.margin_s).toBeCloseTo(0.14, 9);
  });

  it("still asks the relay CTI (0.3 s) when the backup is a relay", () => {
    // common practice: 0.3 s between a relay and the device it backs up
    const devices = new Map([["P", lv("P")], ["B", relay("B")]]);
    expect(pairCti_s(criteria, "P", "B", devices)).toBe(0.3);
    const [v] = selectivityVerdicts(fc, chains, responses, devices, criteria);
    expect(v.status).toBe("fail");
  });

  it("fails two LV trip units whose bands overlap", () => {
    const devices = new Map([["P", lv("P")], ["B", lv("B")]]);
    const overlapping = new Map([["P", response("P", "lvbreaker", 0.02, 0.05, 0.22)], ["B", response("B", "lvbreaker", 0.2, 0.25, 0.3)]]);
    const [v] = selectivityVerdicts(fc, chains, overlapping, devices, criteria);
    expect(v.status).toBe("warn"); // nominal 0.20 s apart, but the bands overlap by 0.02 s
    expect(v.numbers.margin_s).toBeCloseTo(-0.02, 9);
  });
});
