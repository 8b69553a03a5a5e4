// The coordination interval a primary/backup pair must keep, judged from the simulated operation: the backup's
// trip time with the primary's breaker stuck, against the primary's trip time.
import { describe, expect, it } from "vitest";
import { criteriaSchema } from "../../../src/model/schema.ts";
import { runStudy } from "../../../src/study/runStudy.ts";
import { protectionModel } from "../../../src/study/protectionModel.ts";
import { pairCti_s } from "../../../src/study/verdicts/selectivity.ts";
import { makeProject, NO_TOLERANCE, reading3ph, tableSolver } from "./fixtures.ts";

const cable = { length_km: 0.05, r1_ohmPerKm: 0.1, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.4, x0_ohmPerKm: 0.3, csa_mm2: 240, ampacity_A: 400 };
/** An LV trip unit whose short-time element (pickup 2 x 630 A) operates after tsd_s. */
const lv = (id: string, element: string, tsd_s: number, tolerance: unknown = NO_TOLERANCE) => ({
  kind: "lvbreaker",
  id,
  at: { element, end: "from" },
  in_A: 630,
  longTime: { ir_x: 1, tr_s: 10 },
  shortTime: { isd_x: 2, tsd_s },
  clearing_s: 0.03,
  tolerance,
});
/** Grid, bus S, cable L1 (backup B at S) to M, cable L2 (primary P at M) to E; a fault at E gives both 5 kA. */
function pair(backup: unknown, primary: unknown) {
  return makeProject([
    { kind: "bus", id: "S", un_kV: 0.4 },
    { kind: "bus", id: "M", un_kV: 0.4 },
    { kind: "bus", id: "E", un_kV: 0.4 },
    { kind: "grid", id: "G", bus: "S", skMax_MVA: 20, skMin_MVA: 20 },
    { kind: "line", id: "L1", fromBus: "S", toBus: "M", ...cable },
    { kind: "line", id: "L2", fromBus: "M", toBus: "E", ...cable },
    backup,
    primary,
  ]);
}
const solver = tableSolver((_s, loc) => (loc.kind === "bus" && loc.bus === "E" ? { P: reading3ph(5000, "forward"), B: reading3ph(5000, "forward") } : {}));
const study = (project: ReturnType<typeof pair>) => runStudy(project, { solver, model: protectionModel() }, { faultTypes: ["3ph"], buses: ["E"], linePoints: false });
const ID = "selectivity|P>B|s1|bus:E|3ph|max";

describe("coordination interval by device pair", () => {
  const criteria = criteriaSchema.parse({});

  it("accepts a clear space between the bands of two LV trip units", async () => {
    // IEEE Std 242 (from memory): direct-acting LV trip-unit curves include operating and clearing time,
    // so coordination needs only a clear space between the bands, no added CTI.
    const r = await study(pair(lv("B", "L1", 0.2), lv("P", "L2", 0.05)));
    const v = r.verdicts.find((x) => x.id === ID)!;
    expect(pairCti_s(criteria, "P", "B", new Map())).toBe(0.3);
    expect(v.numbers.cti_s).toBe(0);
    // no tolerance: B clears at 0.2 + 0.03 s, P at 0.05 + 0.03 s, 0.15 s apart; trip times 0.2 and 0.05 s
    expect(v.numbers.bandMargin_s).toBeCloseTo(0.15, 9);
    expect(v.numbers.margin_s).toBeCloseTo(0.15, 9);
    expect(v.status).toBe("pass");
  });

  it("still asks the relay CTI (0.3 s) when the backup is a relay", async () => {
    // common practice: 0.3 s between a relay and the device it backs up
    const relay = { kind: "relay", id: "B", at: { element: "L1", end: "from" }, ctPrimary_A: 1000, breakerTime_s: 0.06, tolerance: NO_TOLERANCE, functions: [{ id: "50", ansi: "50", quantity: "phase", curve: "definite-time", pickup_A: 1000, delay_s: 0.25 }] };
    const r = await study(pair(relay, lv("P", "L2", 0.05)));
    const v = r.verdicts.find((x) => x.id === ID)!;
    expect(v.numbers.cti_s).toBe(0.3);
    // 0.25 s against 0.05 s: 0.20 s < 0.3 s
    expect(v.numbers.margin_s).toBeCloseTo(0.2, 9);
    expect(v.status).toBe("fail");
  });

  it("fails two LV trip units whose tolerance bands overlap although their nominal times are apart", async () => {
    const band = { pickup_pct: 10, time_pct: 20, time_min_s: 0.01 };
    const r = await study(pair(lv("B", "L1", 0.2, band), lv("P", "L2", 0.17, band)));
    const v = r.verdicts.find((x) => x.id === ID)!;
    expect(v.numbers.margin_s).toBeCloseTo(0.03, 9);
    expect(v.numbers.bandMargin_s).toBeLessThan(0);
    expect(v.status).toBe("fail");
  });
});
