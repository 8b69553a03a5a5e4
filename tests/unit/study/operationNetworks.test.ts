// Hand-built networks whose right answer is known before the study runs: which devices must open for each
// fault follows from the one-line alone (protection zones bounded by tripping devices; directional elements
// restrain for faults behind them), and the simulated operation must reach it with the real engine.
// The networks are invented for the tests.
import { describe, expect, it } from "vitest";
import { studyProject } from "../../../src/study/studyProject.ts";
import type { CaseResult, StudyResult } from "../../../src/study/types.ts";
import { makeProject } from "./fixtures.ts";

const cable = { r1_ohmPerKm: 0.16, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.64, x0_ohmPerKm: 0.4, csa_mm2: 240, material: "Al", insulation: "XLPE", ampacity_A: 400 };
const lvCable = { r1_ohmPerKm: 0.08, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.32, x0_ohmPerKm: 0.32, csa_mm2: 240, material: "Cu", insulation: "XLPE", ampacity_A: 500 };
/** A definite-time relay function: operates 0.3 s after its current exceeds pickup_A (IEC 60255-151 definite time). */
const dt = (id: string, pickup_A: number, delay_s: number, direction: "non-directional" | "forward" = "non-directional", quantity: "phase" | "residual" = "phase") => ({
  id,
  ansi: quantity === "residual" ? (direction === "forward" ? "67N" : "50N") : direction === "forward" ? "67" : "50",
  quantity,
  curve: "definite-time",
  pickup_A,
  delay_s,
  direction,
});
const relay = (id: string, element: string, end: "from" | "to", functions: unknown[]) => ({
  kind: "relay",
  id,
  at: { element, end },
  ctPrimary_A: 400,
  breakerTime_s: 0.06,
  tolerance: { pickup_pct: 0, time_pct: 0, time_min_s: 0 },
  functions,
});
const caseOf = (r: StudyResult, id: string): CaseResult => {
  const c = r.cases.find((x) => x.faultCase.id === id);
  if (!c) throw new Error(`no case ${id}`);
  return c;
};
const opened = (c: CaseResult) => c.operation.operations.filter((o) => o.action === "open" || o.action === "clear").map((o) => o.device);

describe("a ring of three 11 kV cables fed by a grid and a generator, directional relays at both ends of every cable", async () => {
  // Grid at A, generator at B; cables A-B, B-C, C-A. Each cable end has a relay looking into its cable,
  // directional forward (67), definite time: a cable fault is seen from both ends, a bus fault by nobody at that
  // bus (every relay there looks away from it). With two sources no single time grading suits every fault in a
  // ring (the study shows the clashes); these delays grade for the faults below: L-BC's ends 0.1 s, the A end of
  // C-A 0.25 s, the rest 0.4 s.
  const ends = [
    ["L-AB", "A", "B"],
    ["L-BC", "B", "C"],
    ["L-CA", "C", "A"],
  ] as const;
  const project = makeProject(
    [
      { kind: "bus", id: "A", un_kV: 11 },
      { kind: "bus", id: "B", un_kV: 11 },
      { kind: "bus", id: "C", un_kV: 11 },
      { kind: "grid", id: "G", bus: "A", skMax_MVA: 200, skMin_MVA: 150 },
      { kind: "generator", id: "GEN", bus: "B", sr_MVA: 5, ur_kV: 11, xdss_pu: 0.15, xds_pu: 0.25, xd_pu: 1.8, x2_pu: 0.15, x0_pu: 0.06, earthing: { kind: "solid" } },
      { kind: "load", id: "LD-C", bus: "C", p_kW: 800, q_kvar: 200 },
      ...ends.map(([id, from, to]) => ({ kind: "line", id, fromBus: from, toBus: to, length_km: 2, ...cable })),
      ...ends.flatMap(([id]) => [
        relay(`R-${id}-from`, id, "from", [dt("67", 100, id === "L-BC" ? 0.1 : 0.4, "forward")]),
        relay(`R-${id}-to`, id, "to", [dt("67", 100, id === "L-BC" ? 0.1 : id === "L-CA" ? 0.25 : 0.4, "forward")]),
      ]),
    ],
    [{ id: "s1", name: "Ring closed", limits: ["max"] }],
  );
  const result = await studyProject(project, { faultTypes: ["3ph"] });

  it("opens both ends of a faulted cable, and nothing else", () => {
    const c = caseOf(result, "s1|line:L-BC@50|3ph|max");
    expect([...c.operation.ideal].sort()).toEqual(["R-L-BC-from", "R-L-BC-to"]);
    expect(c.operation.zoneBuses).toEqual([]);
    expect(opened(c).sort()).toEqual(["R-L-BC-from", "R-L-BC-to"]);
    // definite time 0.1 s plus the 0.06 s breaker at both ends (IEC 60255-151, definite time)
    expect(c.operation.isolated_s).toBeCloseTo(0.16, 9);
    expect(c.operation.unwanted).toEqual([]);
    // the load at C stays fed through C-A: cutting one cable of a ring loses nothing
    expect(c.operation.loadLost_kW).toBe(0);
    expect(c.operation.idealLoadLost_kW).toBe(0);
    expect(result.verdicts.filter((v) => v.caseId === c.faultCase.id && v.kind === "sensitivity").map((v) => v.status)).toEqual(["pass", "pass"]);
  });

  it("does not fail the restrained directional relays at a faulted bus, and names the remote relays that clear it", () => {
    const c = caseOf(result, "s1|bus:C|3ph|max");
    // at C both relays look into their cables, away from the bus: they restrain, as they should
    expect([...c.operation.restrained].sort()).toEqual(["R-L-BC-to", "R-L-CA-from"]);
    // the zone grows over both cables to the far ends, whose relays look towards C
    expect([...c.operation.ideal].sort()).toEqual(["R-L-BC-from", "R-L-CA-to"]);
    // B's end opens at 0.1 + 0.06 s; A's end of C-A at 0.25 + 0.06 s, while the relay at A into A-B now sees the
    // generator's current flowing back (reverse) and restrains
    expect(opened(c)).toEqual(["R-L-BC-from", "R-L-CA-to"]);
    expect(c.operation.isolated_s).toBeCloseTo(0.31, 9);
    expect(c.operation.unwanted).toEqual([]);
    const sens = result.verdicts.filter((v) => v.caseId === c.faultCase.id && v.kind === "sensitivity");
    expect(sens.map((v) => v.device).sort()).toEqual(["R-L-BC-from", "R-L-CA-to"]);
    expect(sens.every((v) => v.status === "pass")).toBe(true);
    // what remote clearing costs: C loses its supply (its load), as any bus fault would
    expect(c.operation.loadLost_kW).toBe(800);
  });
});

describe("two parallel cables between the same buses", async () => {
  // M (grid) to N (load) by P1 and P2; at M a non-directional relay, at N a directional relay looking into its cable.
  const project = makeProject(
    [
      { kind: "bus", id: "M", un_kV: 11 },
      { kind: "bus", id: "N", un_kV: 11 },
      { kind: "grid", id: "G", bus: "M", skMax_MVA: 200, skMin_MVA: 150 },
      { kind: "load", id: "LD", bus: "N", p_kW: 500, q_kvar: 100 },
      { kind: "line", id: "P1", fromBus: "M", toBus: "N", length_km: 3, ...cable },
      { kind: "line", id: "P2", fromBus: "M", toBus: "N", length_km: 3, ...cable },
      relay("R-P1-M", "P1", "from", [dt("50", 200, 0.5)]),
      relay("R-P2-M", "P2", "from", [dt("50", 200, 0.5)]),
      relay("R-P1-N", "P1", "to", [dt("67", 100, 0.1, "forward")]),
      relay("R-P2-N", "P2", "to", [dt("67", 100, 0.1, "forward")]),
    ],
    [{ id: "s1", name: "Both cables in", limits: ["max"] }],
  );
  const result = await studyProject(project, { faultTypes: ["3ph", "LG"] });

  it("opens both ends of the faulted cable and keeps N fed through the other", () => {
    for (const type of ["3ph", "LG"]) {
      const c = caseOf(result, `s1|line:P1@50|${type}|max`);
      expect([...c.operation.ideal].sort()).toEqual(["R-P1-M", "R-P1-N"]);
      // the N end sees the fault fed back through P2 and opens first (0.1 s), then the M end (0.5 s)
      expect(opened(c)).toEqual(["R-P1-N", "R-P1-M"]);
      expect(c.operation.isolated_s).toBeCloseTo(0.56, 9);
      expect(c.operation.unwanted).toEqual([]);
      expect(c.operation.loadLost_kW).toBe(0);
    }
  });

  it("makes the healthy cable's M-end relay the backup of the faulted cable's N end", () => {
    const c = caseOf(result, "s1|line:P1@50|3ph|max");
    expect(c.operation.backups).toEqual(
      expect.arrayContaining([
        { device: "R-P1-N", backups: ["R-P2-M"] },
        { device: "R-P1-M", backups: [] },
      ]),
    );
  });
});

describe("an LV board in two sections, each with its incomer", () => {
  // MV grid bus feeding T1 to section A and T2 to section B (Dyn11, 1 MVA); each incomer an LV breaker with a
  // short-time element. Between the sections either a protected coupler (a short bus duct with its own LV
  // breaker) or a plain switch that nothing trips.
  const lvBreaker = (id: string, element: string, end: "from" | "to", in_A: number, tsd_s: number) => ({
    kind: "lvbreaker",
    id,
    at: { element, end },
    in_A,
    longTime: { ir_x: 1, tr_s: 10 },
    shortTime: { isd_x: 3, tsd_s },
    tolerance: { pickup_pct: 0, time_pct: 0, time_min_s: 0 },
  });
  const board = (coupler: "protected" | "plain" | "breaker") =>
    makeProject(
      [
        { kind: "bus", id: "MV", un_kV: 11 },
        { kind: "grid", id: "G", bus: "MV", skMax_MVA: 250, skMin_MVA: 200 },
        { kind: "bus", id: "LV-A", un_kV: 0.4 },
        { kind: "bus", id: "LV-B", un_kV: 0.4 },
        ...["1", "2"].map((k) => ({
          kind: "transformer",
          id: `T${k}`,
          hvBus: "MV",
          lvBus: k === "1" ? "LV-A" : "LV-B",
          sr_MVA: 1,
          urHv_kV: 11,
          urLv_kV: 0.4,
          uk_pct: 6,
          ur_pct: 1,
          vectorGroup: "Dyn11",
          earthingLv: { kind: "solid" },
        })),
        { kind: "load", id: "LD-A", bus: "LV-A", p_kW: 300, q_kvar: 100 },
        { kind: "load", id: "LD-B", bus: "LV-B", p_kW: 400, q_kvar: 100 },
        lvBreaker("Q-T1", "T1", "to", 1600, 0.3),
        lvBreaker("Q-T2", "T2", "to", 1600, 0.3),
        ...(coupler === "protected"
          ? [{ kind: "line", id: "BC", fromBus: "LV-A", toBus: "LV-B", length_km: 0.005, ...lvCable, ampacity_A: 1600 }, lvBreaker("Q-BC", "BC", "from", 1600, 0.1)]
          : coupler === "breaker"
            ? [{ kind: "switch", id: "BC", device: "breaker", busA: "LV-A", busB: "LV-B", closed: true }, lvBreaker("Q-BC", "BC", "from", 1600, 0.1)]
            : [{ kind: "switch", id: "BC", device: "breaker", busA: "LV-A", busB: "LV-B", closed: true }]),
      ],
      [{ id: "s1", name: "Both incomers, coupler closed", limits: ["max"] }],
    );

  it("with a protected coupler, opens the coupler and the faulted section's incomer only", async () => {
    const r = await studyProject(board("protected"), { faultTypes: ["3ph"], buses: ["LV-A"], linePoints: false });
    const c = caseOf(r, "s1|bus:LV-A|3ph|max");
    expect(c.operation.zoneBuses).toEqual(["LV-A"]);
    expect([...c.operation.ideal].sort()).toEqual(["Q-BC", "Q-T1"]);
    // the coupler (0.1 s) grades below the incomers (0.3 s): it opens first, then Q-T1; Q-T2 keeps section B
    expect(opened(c)).toEqual(["Q-BC", "Q-T1"]);
    expect(c.operation.unwanted).toEqual([]);
    expect(c.operation.loadLost_kW).toBe(300);
  });

  it("with a trip unit on the coupler breaker itself, grades the same way as with a protected bus duct", async () => {
    const duct = await studyProject(board("protected"), { faultTypes: ["3ph", "LG"], linePoints: false });
    const breaker = await studyProject(board("breaker"), { faultTypes: ["3ph", "LG"], linePoints: false });
    for (const bus of ["LV-A", "LV-B"])
      for (const type of ["3ph", "LG"]) {
        const id = `s1|bus:${bus}|${type}|max`;
        const c = caseOf(breaker, id);
        const d = caseOf(duct, id);
        expect(c.operation.zoneBuses).toEqual([bus]);
        expect([...c.operation.ideal].sort()).toEqual(["Q-BC", bus === "LV-A" ? "Q-T1" : "Q-T2"]);
        expect(opened(c)).toEqual(opened(d));
        // Kirchhoff at the healthy section (its load neglected, IEC 60909): all that its transformer gives
        // flows through the coupler, so the coupler's trip unit reads the other incomer's current
        const iBreaker = c.responses.find((r) => r.device === "Q-BC")!.iPhase_A;
        const iOther = c.responses.find((r) => r.device === (bus === "LV-A" ? "Q-T2" : "Q-T1"))!.iPhase_A;
        expect(Math.abs(iBreaker - iOther) / iOther).toBeLessThan(1e-6);
        // and a little more than through a 5 m duct, whose own impedance the breaker lacks
        const iDuct = d.responses.find((r) => r.device === "Q-BC")!.iPhase_A;
        expect(iBreaker).toBeGreaterThan(iDuct);
        expect(iBreaker / iDuct).toBeLessThan(1.15);
      }
  });

  it("with a coupler that nothing trips, makes both sections one zone and loses the whole board", async () => {
    const r = await studyProject(board("plain"), { faultTypes: ["3ph"], buses: ["LV-A"], linePoints: false });
    const c = caseOf(r, "s1|bus:LV-A|3ph|max");
    expect([...c.operation.zoneBuses].sort()).toEqual(["LV-A", "LV-B"]);
    expect([...c.operation.ideal].sort()).toEqual(["Q-T1", "Q-T2"]);
    expect(opened(c).sort()).toEqual(["Q-T1", "Q-T2"]);
    expect(c.operation.idealLoadLost_kW).toBe(700);
    expect(c.operation.loadLost_kW).toBe(700);
  });
});

describe("an inverter-only island earthed only through a transformer's LV star point", async () => {
  // The utility is out; a grid-forming battery inverter holds the LV board. T1 (Dyn11, its HV side dead) earths
  // the LV system through its star point. Its LV incomer has a ground-fault element (200 A, 0.1 s); the feeder
  // breaker has none and its short-time pickup is far above what the inverter gives. An earth fault on the
  // feeder drives 3I0 back through the transformer's star point: the incomer's ground-fault element opens T1 first.
  const project = makeProject(
    [
      { kind: "bus", id: "MV", un_kV: 11 },
      { kind: "grid", id: "G", bus: "MV", skMax_MVA: 250, skMin_MVA: 200 },
      { kind: "bus", id: "LV", un_kV: 0.4 },
      { kind: "bus", id: "F", un_kV: 0.4 },
      { kind: "transformer", id: "T1", hvBus: "MV", lvBus: "LV", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6, ur_pct: 1, vectorGroup: "Dyn11", earthingLv: { kind: "solid" } },
      { kind: "inverter", id: "BESS", bus: "LV", source: "battery", sr_MVA: 0.5, ur_kV: 0.4, iMax_pu: 1.5, control: "grid-forming" },
      { kind: "line", id: "FD", fromBus: "LV", toBus: "F", length_km: 0.1, ...lvCable },
      { kind: "load", id: "LD-F", bus: "F", p_kW: 100, q_kvar: 20 },
      { kind: "lvbreaker", id: "Q-T1", at: { element: "T1", end: "to" }, in_A: 1600, longTime: { ir_x: 1, tr_s: 10 }, shortTime: { isd_x: 4, tsd_s: 0.4 }, groundFault: { ig_A: 200, tg_s: 0.1 } },
      { kind: "lvbreaker", id: "Q-FD", at: { element: "FD", end: "from" }, in_A: 400, longTime: { ir_x: 1, tr_s: 10 }, shortTime: { isd_x: 8, tsd_s: 0.1 } },
      { kind: "lvbreaker", id: "Q-BESS", at: { element: "BESS", end: "terminal" }, in_A: 800, longTime: { ir_x: 1, tr_s: 8 }, instantaneous: { ii_x: 10 } },
    ],
    [{ id: "island", name: "Islanded on the battery", outOfService: ["G"], limits: ["min"] }],
  );
  const result = await studyProject(project, { faultTypes: ["LG"], buses: ["F"], linePoints: false });

  it("reports the transformer incomer's earth-fault trip as unwanted, and says that it removes the earth", () => {
    const c = caseOf(result, "island|bus:F|LG|min");
    expect(c.operation.ideal).toEqual(["Q-FD"]);
    expect(c.operation.unwanted).toContain("Q-T1");
    expect(c.operation.operations[0]).toMatchObject({ device: "Q-T1", action: "trip" });
    // the ground-fault delay: 0.1 s, with no tolerance on this trip unit's time beyond its default band
    expect(c.operation.operations[0].t_s).toBeCloseTo(0.1, 6);
    const v = result.verdicts.find((x) => x.caseId === c.faultCase.id && x.device === "Q-T1" && x.status === "fail")!;
    expect(v.kind).toBe("selectivity");
    expect(v.explanation).toMatch(/removing that winding's earth/);
  });
});

describe("a stuck primary breaker", async () => {
  // Grid, 11 kV cable with relay R-UP (definite time 0.6 s), then a second cable with relay R-DN (0.2 s).
  const project = makeProject(
    [
      { kind: "bus", id: "S", un_kV: 11 },
      { kind: "bus", id: "M", un_kV: 11 },
      { kind: "bus", id: "E", un_kV: 11 },
      { kind: "grid", id: "G", bus: "S", skMax_MVA: 200, skMin_MVA: 150 },
      { kind: "line", id: "C1", fromBus: "S", toBus: "M", length_km: 2, ...cable },
      { kind: "line", id: "C2", fromBus: "M", toBus: "E", length_km: 2, ...cable },
      { kind: "load", id: "LD-M", bus: "M", p_kW: 200, q_kvar: 50 },
      { kind: "load", id: "LD-E", bus: "E", p_kW: 300, q_kvar: 50 },
      relay("R-UP", "C1", "from", [dt("50", 200, 0.6)]),
      relay("R-DN", "C2", "from", [dt("50", 200, 0.2)]),
    ],
    [{ id: "s1", name: "Radial", limits: ["max"] }],
  );
  const result = await studyProject(project, { faultTypes: ["3ph"], buses: ["E"], linePoints: false });

  it("is cleared by the backup, at the backup's time, losing what the backup feeds", () => {
    const c = caseOf(result, "s1|bus:E|3ph|max");
    expect(c.operation.ideal).toEqual(["R-DN"]);
    expect(opened(c)).toEqual(["R-DN"]);
    expect(c.operation.isolated_s).toBeCloseTo(0.26, 9);
    const f = c.operation.failures[0];
    expect(f.device).toBe("R-DN");
    expect(f.backups).toEqual(["R-UP"]);
    expect(f.operations.map((o) => [o.device, o.action])).toEqual([
      ["R-DN", "trip"],
      ["R-DN", "stuck"],
      ["R-UP", "trip"],
      ["R-UP", "open"],
    ]);
    expect(f.isolated_s).toBeCloseTo(0.66, 9);
    expect(f.loadLost_kW).toBe(500);
    const backup = result.verdicts.find((v) => v.id === `backup|R-DN|${c.faultCase.id}`)!;
    expect(backup.status).toBe("pass");
    // the pair keeps 0.6 - 0.2 = 0.4 s >= CTI 0.3 s (common practice CTI)
    const pair = result.verdicts.find((v) => v.id === `selectivity|R-DN>R-UP|${c.faultCase.id}`)!;
    expect(pair.numbers.margin_s).toBeCloseTo(0.4, 9);
    expect(pair.status).toBe("pass");
  });
});
