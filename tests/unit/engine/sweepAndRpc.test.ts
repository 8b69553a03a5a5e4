import { describe, expect, it } from "vitest";
import { compileNetwork, solveFault, sweepFaults, sweepDeviceCurrents, handleRequest, createHandlerState, transferables, FAULT_TYPES, peakFactor, type EngineEvent } from "../../../src/engine/index.ts";
import { buildProject, bus, type RawElement } from "./helpers/projectBuilder.ts";

const cable = (id: string, a: string, b: string, km: number): RawElement => ({
  kind: "line", id, fromBus: a, toBus: b, length_km: km, r1_ohmPerKm: 0.15, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.6, x0_ohmPerKm: 0.3, csa_mm2: 120, ampacity_A: 300,
});
const project = buildProject(
  [
    bus("HV", 11), bus("LV", 0.4), bus("F1", 0.4), bus("F2", 0.4),
    { kind: "grid", id: "Q", bus: "HV", skMax_MVA: 150, skMin_MVA: 90 },
    { kind: "transformer", id: "T", hvBus: "HV", lvBus: "LV", sr_MVA: 1.25, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 },
    cable("C1", "LV", "F1", 0.12), cable("C2", "F1", "F2", 0.2), cable("C3", "LV", "F2", 0.25),
    { kind: "generator", id: "G", bus: "F2", sr_MVA: 0.4, ur_kV: 0.4, xdss_pu: 0.13, x2_pu: 0.14, x0_pu: 0.05, earthing: { kind: "solid" } },
    { kind: "inverter", id: "PV", bus: "F1", sr_MVA: 0.2, ur_kV: 0.4, negSeq: { mode: "k-factor", k2: 2 } },
    { kind: "inverter", id: "B", bus: "LV", sr_MVA: 0.3, ur_kV: 0.4, control: "grid-forming" },
    { kind: "relay", id: "R1", at: { element: "C1", end: "from" }, ctPrimary_A: 400, functions: [] },
    { kind: "relay", id: "R2", at: { element: "T", end: "from" }, ctPrimary_A: 100, functions: [] },
    { kind: "fuse", id: "F", at: { element: "PV", end: "terminal" }, rating_A: 400 },
    { kind: "lvbreaker", id: "K", at: { element: "G", end: "terminal" }, in_A: 630, longTime: { ir_x: 1, tr_s: 10 } },
    { kind: "lvbreaker", id: "K2", at: { element: "B", end: "terminal" }, in_A: 630, longTime: { ir_x: 1, tr_s: 10 } },
  ],
  { inverterModel: "refined" },
);

describe("all-bus sweep", () => {
  for (const model of ["refined", "iec"] as const) {
    it(`agrees with one-by-one fault solutions at every bus and device (${model} inverter model)`, () => {
      // Independent computation inside the engine: column solves per fault vs Takahashi's subset and per-device
      // reciprocity in the sweep.
      const p = buildProject(project.elements as RawElement[], { inverterModel: model });
      const c = compileNetwork(p, { limit: "max" });
      if (!c.ok) throw new Error("compile");
      const sw = sweepFaults(c.network);
      expect(sw.devices.map((d) => d.element)).toEqual(["C1", "T", "PV", "G", "B"]);
      sw.busIds.forEach((bus, b) =>
        sw.types.forEach((type, t) => {
          const r = solveFault(c.network, { kind: "bus", bus }, type);
          expect(sw.ikss_kA[b * sw.types.length + t]).toBeCloseTo(r.ikss_kA, 9);
          sw.devices.forEach((d, di) => {
            const e = (d.end === "terminal" ? r.shunts : r.branchEnds).find((x) => x.element === d.element && x.end === d.end)!;
            const got = sweepDeviceCurrents(sw, di, b, t);
            for (let ph = 0; ph < 3; ph++) {
              expect(Math.abs(got.phase_A[ph].mag - e.phase_A[ph].mag)).toBeLessThan(1e-6 * (1 + e.phase_A[ph].mag));
            }
          });
        }),
      );
    });
  }
  it("uses method B in a meshed island and says so", () => {
    const c = compileNetwork(project, { limit: "max" });
    if (!c.ok) throw new Error("compile");
    const r = solveFault(c.network, { kind: "bus", bus: "F1" }, "3ph");
    expect(r.peakMethod).toBe("meshed-method-b");
    // IEC 60909-0:2016 method B: 1.15 kappa(R/X at the fault), capped at 1.8 for LV (reference-checks.md, from memory)
    expect(r.kappa).toBeCloseTo(Math.min(1.8, 1.15 * peakFactor(r.zk_ohm.re / r.zk_ohm.im)), 12);
    // kappa on the voltage sources' share only, the converters' share with kappa = 1 (IEC 60909-0:2016, 8.1, from
    // memory); that share from the same network built without the converters.
    const bare = compileNetwork(buildProject((project.elements as RawElement[]).filter((e) => e.kind !== "inverter" && !["F", "K2"].includes(e.id)), { inverterModel: "refined" }), { limit: "max" });
    if (!bare.ok) throw new Error("compile");
    const ikS = solveFault(bare.network, { kind: "bus", bus: "F1" }, "3ph").ikss_kA;
    expect(r.ip_kA).toBeCloseTo(r.kappa * Math.SQRT2 * ikS + Math.SQRT2 * (r.ikss_kA - ikS), 12);
  });
  it("reports progress and stops when told to", () => {
    const c = compileNetwork(project, { limit: "max" });
    if (!c.ok) throw new Error("compile");
    const seen: number[] = [];
    const sw = sweepFaults(c.network, { onProgress: (f) => (seen.push(f), false) });
    expect(seen.length).toBe(1);
    expect(sw.messages.some((m) => m.code === "cancelled")).toBe(true);
  });
});

describe("worker request handler", () => {
  it("answers fault, sweep and load-flow requests with plain data and transferable arrays", async () => {
    const state = createHandlerState();
    const events: EngineEvent[] = [];
    const f = await handleRequest({ id: 1, kind: "fault", project, limit: "max", location: { kind: "bus", bus: "F2" }, faultType: "LG" }, state);
    expect(f.ok && f.kind === "fault" && f.result.ikss_kA > 0).toBe(true);
    const s = await handleRequest({ id: 2, kind: "sweep", project, limit: "min", types: [...FAULT_TYPES] }, state, (e) => events.push(e));
    expect(s.ok && s.kind === "sweep").toBe(true);
    expect(events.length).toBeGreaterThan(0);
    expect(transferables(s).length).toBeGreaterThan(0);
    const l = await handleRequest({ id: 3, kind: "loadflow", project }, state);
    expect(l.ok && l.kind === "loadflow" && l.result.converged).toBe(true);
    // Results survive structured cloning (what postMessage does).
    expect(structuredClone(f)).toEqual(f);
  });
  it("drops a request superseded on the same channel and honours cancel", async () => {
    const state = createHandlerState();
    const a = handleRequest({ id: 10, kind: "fault", channel: "pane", project, limit: "max", location: { kind: "bus", bus: "LV" }, faultType: "3ph" }, state);
    const b = handleRequest({ id: 11, kind: "fault", channel: "pane", project, limit: "max", location: { kind: "bus", bus: "LV" }, faultType: "LL" }, state);
    const [ra, rb] = await Promise.all([a, b]);
    expect(ra.ok).toBe(false);
    expect(!ra.ok && ra.cancelled).toBe(true);
    expect(rb.ok).toBe(true);
    const c = handleRequest({ id: 12, kind: "sweep", project, limit: "max" }, state);
    await handleRequest({ id: 13, kind: "cancel", target: 12 }, state);
    const rc = await c;
    expect(!rc.ok && rc.cancelled).toBe(true);
  });
  it("stops a running sweep when a cancel arrives between chunks", async () => {
    const state = createHandlerState(() => new Promise((resolve) => setTimeout(resolve, 0)));
    let sent = false;
    const r = await handleRequest({ id: 30, kind: "sweep", project, limit: "max" }, state, () => {
      if (!sent) {
        sent = true;
        void handleRequest({ id: 31, kind: "cancel", target: 30 }, state);
      }
    });
    expect(sent).toBe(true);
    expect(!r.ok && r.cancelled).toBe(true);
  });
  it("returns errors naming the element instead of throwing", async () => {
    const bad = structuredClone(project);
    const line = bad.elements.find((e) => e.id === "C2") as { fromBus: string };
    line.fromBus = "NOWHERE";
    const r = await handleRequest({ id: 20, kind: "fault", project: bad, limit: "max", location: { kind: "bus", bus: "LV" }, faultType: "3ph" }, createHandlerState());
    expect(r.ok).toBe(false);
    expect(!r.ok && r.errors[0].text).toMatch(/Cable C2: fromBus refers to unknown bus NOWHERE/);
  });
});
