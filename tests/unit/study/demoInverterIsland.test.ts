import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { loadProject } from "../../../src/model/projectFile.ts";
import type { LvBreaker } from "../../../src/model/schema.ts";
import { studyProject } from "../../../src/study/studyProject.ts";
import { handleStudyRequest } from "../../../src/study/rpc/handleStudyRequest.ts";

const loaded = loadProject(readFileSync(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url), "utf8"));
if (!loaded.ok) throw new Error(loaded.error.messages.join("\n"));
const project = loaded.project;
const breaker = (id: string) => project.elements.find((e) => e.id === id) as LvBreaker;
/** Short-time pickup Isd = isd_x * Ir = isd_x * ir_x * In (the trip unit's own definition). */
const isd_A = (b: LvBreaker) => b.shortTime!.isd_x * b.longTime.ir_x * b.in_A;

describe("the demo's inverter-only island (battery and PV only)", async () => {
  const result = await studyProject(project, {
    scenarios: ["island-inverters"],
    limits: ["min"],
  });
  const feeders = ["Q-MS", "Q-CS", "Q-PH"];

  it("keeps every fault current within what the inverters and motors can give", () => {
    // Independent bound: inverters are held at iMax x rated current, motors give at most ilrIr x rated current
    // (common practice: inverter fault current is limited to 1.1-1.5 x rated). Rated currents I = S / (sqrt 3 U).
    let bound_A = 0;
    for (const e of project.elements) {
      if (e.kind === "inverter") bound_A += (e.iMax_pu * e.sr_MVA * 1000) / (Math.sqrt(3) * e.ur_kV);
      if (e.kind === "motor") bound_A += (e.ilrIr * e.pr_kW) / (e.eta * e.cosPhi * Math.sqrt(3) * e.ur_kV);
    }
    // Three-phase faults only: in an earth fault the transformers' earthed LV star points add a zero-sequence path.
    const threePhase = result.cases.filter((c) => c.faultCase.faultType === "3ph");
    expect(threePhase.length).toBeGreaterThan(10);
    for (const c of threePhase) expect(c.iFault_A).toBeLessThan(bound_A * 1.05);
  });

  /** The feeder breaker's sensitivity verdict with the lowest pickup ratio over the island's cases. */
  const worstSensitivity = (id: string) =>
    result.verdicts.filter((x) => x.kind === "sensitivity" && x.device === id && x.numbers.ratio !== undefined).sort((a, b) => a.numbers.ratio - b.numbers.ratio)[0];

  it("fails sensitivity of the feeder breakers' short-circuit elements", () => {
    // primary margin 1.5 x the short-time pickup (common practice): none of the feeder breakers reaches it,
    // and at least one sees less than its short-time pickup at all
    const verdicts = feeders.map((id) => worstSensitivity(id)!);
    verdicts.forEach((v, k) => {
      expect(v.numbers.pickup_A).toBeCloseTo(isd_A(breaker(feeders[k])), 3);
      expect(v.numbers.measured_A / v.numbers.pickup_A).toBeLessThan(project.criteria.primaryMargin);
      expect(v.status).not.toBe("pass");
    });
    expect(verdicts.some((v) => v.numbers.measured_A < v.numbers.pickup_A)).toBe(true);
  });

  it("shows in the timeline of a failing feeder's case that only a slow element operates, or nothing", async () => {
    const v = feeders.map((id) => worstSensitivity(id)!).find((x) => x.numbers.measured_A < x.numbers.pickup_A)!;
    const answer = await handleStudyRequest({ kind: "case", requestId: "t", project, caseId: v.caseId!, timeline: true });
    if (answer.kind !== "case") throw new Error(`unexpected answer ${answer.kind}`);
    const tl = answer.timeline!;
    const trip = tl.events.find((e) => e.device === v.device && e.action === "trip");
    // below Isd only the long-time (overload) element can act: seconds, beyond the 1 s clearing limit
    if (trip) expect(trip.t_s).toBeGreaterThan(1);
    else expect(tl.isolated).toBe(false);
    const r = answer.result.responses.find((x) => x.device === v.device)!;
    expect(r.role).toBe("primary");
    expect(r.operatingElement === null || r.operatingElement === "long-time").toBe(true);
    expect(answer.verdicts.find((x) => x.id === `speed|zone|${v.caseId}`)!.status).toBe("fail");
  });

  it("tells what happened in the worst case's timeline", () => {
    // the timelines kept are the cases that matter, the most severe first: no isolation, or unwanted operations
    const worst = result.timelines[0];
    const c = result.cases.find((x) => x.faultCase.id === worst.caseId)!;
    expect(worst.isolated === false || c.operation.unwanted.length > 0).toBe(true);
    expect(worst.summary).toMatch(/not isolated|isolated at/);
  });
});

describe("the demo grid-tied with all sources", async () => {
  const result = await studyProject(project, { scenarios: ["grid-all"], limits: ["min"], faultTypes: ["3ph"], buses: ["LV-MS", "LV-CS", "LV-PH"] });
  it("gives the same feeder breakers enough fault current for their short-time elements", () => {
    // contrast with the island: the utility tie raises the fault level at the LV boards well above Isd
    for (const id of ["Q-MS", "Q-CS", "Q-PH"]) {
      const v = result.verdicts.find((x) => x.id === `sensitivity|${id}|grid-all|bus:${id.replace("Q-", "LV-")}|3ph|min`)!;
      expect(v.numbers.measured_A).toBeGreaterThan(isd_A(breaker(id)));
    }
  });
});
