// Keys are built and parsed in one module: what the builders write, the parsers read back.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { caseId, openSetKey, parseCaseId, parseLocationKey, locationKey } from "../../../src/study/keys.ts";
import { FAULT_TYPES } from "../../../src/study/types.ts";
import "../setup/fastCheckSeed.ts";

const id = fc.stringMatching(/^[A-Za-z0-9_.:@ -]{1,12}$/).filter((s) => !s.includes("|"));

describe("study keys", () => {
  it("read back every case id they build, bus or line point", () => {
    fc.assert(
      fc.property(id, id, fc.constantFrom(...FAULT_TYPES), fc.constantFrom("max" as const, "min" as const), fc.boolean(), fc.integer({ min: 1, max: 99 }), (scenario, element, faultType, limit, onLine, pct) => {
        const location = onLine ? ({ kind: "line", line: element, pct } as const) : ({ kind: "bus", bus: element } as const);
        expect(parseCaseId(caseId(scenario, location, faultType, limit))).toEqual({ scenario, location, faultType, limit });
        expect(parseLocationKey(locationKey(location))).toEqual(location);
      }),
    );
  });

  it("give one key to an opened set whatever order its ends opened in, and refuse what is not a key", () => {
    const a = { element: "C1", end: "from" as const };
    const b = { element: "GEN1", end: "terminal" as const };
    expect(openSetKey([a, b])).toBe(openSetKey([b, a]));
    expect(openSetKey([a])).not.toBe(openSetKey([b]));
    expect(parseCaseId("not a case")).toBeNull();
    expect(parseLocationKey("node:X")).toBeNull();
  });
});
