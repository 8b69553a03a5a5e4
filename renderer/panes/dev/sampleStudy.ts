// Sample data for the panes preview: an invented workshop site (our own scenario, not a real plant).
// Device curves come from the real protection models; chains, verdicts and the matrix are hand-made
// in the shapes of src/study/types.ts until the study can run in the preview.
import { fuseSchema, lineSchema, lvBreakerSchema, motorSchema, relaySchema, transformerSchema } from "../../../src/model/schema.ts";
import type { FaultChains, StudyMatrix, Verdict, VerdictKind, VerdictStatus, DeviceResponse } from "../../../src/study/types.ts";
import type { DeviceOnPlot } from "../tcc/bandsFromDevices.ts";
import type { TccFaultMark } from "../tcc/tccTypes.ts";

export const REFERENCE_KV = 0.4;

export function sampleDevices(): DeviceOnPlot[] {
  const hvRelay = relaySchema.parse({
    kind: "relay",
    id: "R-TX1",
    name: "TX1 HV feeder",
    at: { element: "TX1", end: "from" },
    ctPrimary_A: 100,
    functions: [
      { id: "f51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 63, multiplier: 0.12 },
      { id: "f50", ansi: "50", quantity: "phase", curve: "definite-time", pickup_A: 900, delay_s: 0.05 },
    ],
  });
  const incomer = lvBreakerSchema.parse({
    kind: "lvbreaker",
    id: "Q-INC",
    name: "LV incomer",
    at: { element: "TX1", end: "to" },
    in_A: 1600,
    longTime: { ir_x: 0.9, tr_s: 12 },
    shortTime: { isd_x: 4, tsd_s: 0.3 },
  });
  const feeder = lvBreakerSchema.parse({
    kind: "lvbreaker",
    id: "Q-WS",
    name: "Workshop feeder",
    at: { element: "C-WS", end: "from" },
    in_A: 400,
    longTime: { ir_x: 0.8, tr_s: 6 },
    shortTime: { isd_x: 6, tsd_s: 0.1 },
    instantaneous: { ii_x: 12 },
  });
  const fuse = fuseSchema.parse({ kind: "fuse", id: "F-PMP", name: "Pump fuse", at: { element: "M-PMP", end: "terminal" }, rating_A: 160 });
  return [
    { device: fuse, device_kV: 0.4 },
    { device: feeder, device_kV: 0.4 },
    { device: incomer, device_kV: 0.4 },
    { device: hvRelay, device_kV: 11 },
  ];
}

export const sampleTransformer = transformerSchema.parse({
  kind: "transformer",
  id: "TX1",
  name: "TX1 11/0.4 kV",
  hvBus: "B-MV",
  lvBus: "B-LV",
  sr_MVA: 1,
  urHv_kV: 11,
  urLv_kV: 0.4,
  uk_pct: 6,
});
export const sampleCable = lineSchema.parse({
  kind: "line",
  id: "C-WS",
  name: "Workshop cable",
  fromBus: "B-LV",
  toBus: "B-WS",
  length_km: 0.12,
  r1_ohmPerKm: 0.16,
  x1_ohmPerKm: 0.08,
  r0_ohmPerKm: 0.64,
  x0_ohmPerKm: 0.32,
  csa_mm2: 120,
  ampacity_A: 320,
});
export const sampleMotor = motorSchema.parse({ kind: "motor", id: "M-PMP", name: "Wash pump", bus: "B-WS", pr_kW: 55, ur_kV: 0.4, start_s: 6 });

export const sampleFaultMarks: TccFaultMark[] = [
  { id: "m1", label: "3ph max, grid-tied", current_A: 19800, scenarioId: "grid" },
  { id: "m2", label: "LG min, grid-tied", current_A: 11200, scenarioId: "grid" },
  { id: "m3", label: "3ph max, islanded", current_A: 3900, scenarioId: "island" },
  { id: "m4", label: "LG min, islanded", current_A: 2150, scenarioId: "island" },
];

export const sampleCaseId = "island|bus:B-WS|3ph|max";

export const sampleChains: FaultChains = {
  caseId: sampleCaseId,
  idealIsolation: ["Q-WS", "Q-WS"],
  paths: [
    {
      source: "G-UT",
      sourceName: "Utility tie",
      sourceKind: "grid",
      elements: ["C-WS", "TX1"],
      links: [
        { device: "Q-WS", deviceName: "Workshop feeder", depth: 0, role: "primary", current_A: 3100, tClear_s: 0.13, marginToNext_s: 0.21 },
        { device: "Q-INC", deviceName: "LV incomer", depth: 1, role: "backup", current_A: 3100, tClear_s: 0.36, marginToNext_s: 0.52 },
        { device: "R-TX1", deviceName: "TX1 HV feeder", depth: 2, role: "backup", current_A: 113, tClear_s: 1.12, marginToNext_s: null },
      ],
    },
    {
      source: "GEN1",
      sourceName: "Standby genset",
      sourceKind: "generator",
      elements: ["C-WS", "C-GEN"],
      links: [
        { device: "Q-WS", deviceName: "Workshop feeder", depth: 0, role: "primary", current_A: 800, tClear_s: 0.13, marginToNext_s: 0.41 },
        { device: "Q-GEN", deviceName: "Genset breaker", depth: 1, role: "backup", current_A: 800, tClear_s: 0.62, marginToNext_s: null },
      ],
    },
    {
      source: "INV-BAT",
      sourceName: "Battery inverter",
      sourceKind: "inverter",
      elements: ["C-WS", "C-BAT"],
      links: [
        { device: "Q-WS", deviceName: "Workshop feeder", depth: 0, role: "primary", current_A: 0, tClear_s: null, marginToNext_s: null },
        { device: "Q-BAT", deviceName: "Battery breaker", depth: 1, role: "backup", current_A: 240, tClear_s: null, marginToNext_s: null },
      ],
    },
  ],
};

export const sampleResponses: DeviceResponse[] = [
  resp("Q-WS", "Workshop feeder", 0.1),
  resp("Q-INC", "LV incomer", 0.33),
  resp("R-TX1", "TX1 HV feeder", 1.06),
  resp("Q-GEN", "Genset breaker", 0.59),
  resp("Q-BAT", "Battery breaker", null),
];

function resp(device: string, deviceName: string, tOperate_s: number | null): DeviceResponse {
  return {
    device,
    deviceName,
    deviceKind: "lvbreaker",
    iPhase_A: 0,
    iResidual_A: 0,
    iNegative_A: 0,
    direction: "forward",
    pickedUp: tOperate_s !== null,
    operatingElement: null,
    tOperate_s,
    tClear_s: tOperate_s === null ? null : tOperate_s + 0.03,
    tClearMin_s: null,
    tClearMax_s: null,
    role: "primary",
    onPathsOf: [],
  };
}

/** A matrix of `buses` buses x 4 fault types x 2 limits in 4 scenarios, with verdicts spread by a fixed rule. */
export function sampleMatrix(buses: number): { matrix: StudyMatrix; verdicts: Verdict[] } {
  const scenarios = [
    { id: "grid", name: "Grid-tied" },
    { id: "island", name: "Islanded" },
    { id: "island-nogen", name: "Islanded, genset out" },
    { id: "grid-nopv", name: "Grid-tied, PV off" },
  ];
  const types = ["3ph", "LL", "LG", "LLG"] as const;
  const limits = ["max", "min"] as const;
  const kinds: VerdictKind[] = ["sensitivity", "selectivity", "speed", "blinding", "sympathetic"];
  const rows: StudyMatrix["rows"] = [];
  const cells: StudyMatrix["cells"] = [];
  const verdicts: Verdict[] = [];
  const totals = Object.fromEntries(kinds.map((k) => [k, { pass: 0, warn: 0, fail: 0 }])) as StudyMatrix["totals"];
  let n = 0;
  for (let b = 0; b < buses; b++) {
    const bus = b === 0 ? "B-WS" : b === 1 ? "B-LV" : `B-${String(b).padStart(3, "0")}`;
    for (const ft of types)
      for (const lim of limits) {
        const row = `bus:${bus}|${ft}|${lim}`;
        rows.push({ id: row, label: `${ft} ${lim} at ${bus}` });
        scenarios.forEach((s, si) => {
          const caseId = `${s.id}|${row}`;
          const ids: string[] = [];
          const counts = { pass: 0, warn: 0, fail: 0 };
          kinds.forEach((kind, ki) => {
            n++;
            // A fixed spread: islanded minimum faults fail sensitivity and selectivity more often.
            const h = (b * 31 + ki * 7 + si * 13 + (lim === "min" ? 5 : 0) + types.indexOf(ft) * 3) % 23;
            const status: VerdictStatus = si > 0 && lim === "min" && h < 5 ? "fail" : h < 2 ? "fail" : h < 6 ? "warn" : "pass";
            if (kind === "sympathetic" && status === "pass" && h % 2 === 0) return;
            const id = `${kind}|${caseId}`;
            ids.push(id);
            counts[status]++;
            totals[kind][status]++;
            verdicts.push({
              id,
              kind,
              status,
              scenario: s.id,
              caseId,
              device: "Q-WS",
              other: kind === "selectivity" ? "Q-INC" : null,
              numbers: kind === "selectivity" ? { margin_s: status === "pass" ? 0.31 : 0.12, cti_s: 0.3 } : kind === "sensitivity" ? { ratio: status === "pass" ? 2.4 : 1.1, required: 1.5 } : { t_s: 0.13 + (n % 7) / 10 },
              explanation: explanation(kind, status, `${ft} ${lim} at ${bus}`, s.name),
            });
          });
          const worst = counts.fail ? "fail" : counts.warn ? "warn" : counts.pass ? "pass" : null;
          cells.push({ row, scenario: s.id, caseId, worst, counts, verdictIds: ids });
        });
      }
  }
  return { matrix: { scenarios, rows, cells, totals }, verdicts };
}

function explanation(kind: VerdictKind, status: VerdictStatus, where: string, scenario: string): string {
  const ok = status === "pass";
  switch (kind) {
    case "sensitivity":
      return ok ? `Workshop feeder picks up at ${where} (${scenario}): 2.4 x pickup >= 1.5` : `Workshop feeder sees only 1.1 x pickup at ${where} (${scenario}); 1.5 required`;
    case "selectivity":
      return ok ? `LV incomer backs up Workshop feeder with 0.31 s >= CTI 0.30 s at ${where} (${scenario})` : `LV incomer backup to Workshop feeder: margin 0.12 s < CTI 0.30 s at ${where} (${scenario})`;
    case "speed":
      return ok ? `Primary clears ${where} in 0.13 s <= 1.00 s limit (${scenario})` : `Primary clears ${where} in 1.42 s > 1.00 s limit (${scenario})`;
    case "blinding":
      return ok ? `Battery inverter infeed leaves the feeder's reach intact at ${where} (${scenario})` : `Battery inverter infeed lowers the feeder's current to 0.8 x pickup at ${where} (${scenario})`;
    case "sympathetic":
      return ok ? `No healthy feeder picks up for ${where} (${scenario})` : `Genset breaker picks up on reverse current for ${where} (${scenario})`;
    default:
      return ok ? `${kind}: passes at ${where} (${scenario})` : `${kind}: fails at ${where} (${scenario})`;
  }
}
