// The demo project: an invented coastal dairy cooperative with an 11 kV utility tie, two 11/0.4 kV
// transformers on a two-section LV board with a bus coupler, a diesel genset, a PV inverter, a battery
// inverter, two motors, seven LV feeders and an 11 kV village feeder. Names, figures and settings are
// invented and plausible as an engineer's first pass; the study is meant to find the weak spots
// (for example sensitivity in the inverter-only island), so they are not tuned away here.
// Cable data: typical published ranges for the trade (conductor resistance at 20 C per IEC 60228 sizes,
// reactance and ampacity rounded), not any maker's catalogue.
import { FORMAT_TAG, FORMAT_VERSION, projectSchema, type Project } from "../schema.ts";

interface CableType {
  material: "Cu" | "Al";
  insulation: "PVC" | "XLPE";
  csa_mm2: number;
  r1_ohmPerKm: number;
  x1_ohmPerKm: number;
  r0_ohmPerKm: number;
  x0_ohmPerKm: number;
  ampacity_A: number;
}

// LV four-core cables: zero-sequence return through an equal neutral, roughly R0 = 4 R1, X0 = 4 X1 (common practice).
const lv = (material: "Cu" | "Al", insulation: "PVC" | "XLPE", csa_mm2: number, r1: number, x1: number, ampacity_A: number): CableType => ({
  material,
  insulation,
  csa_mm2,
  r1_ohmPerKm: r1,
  x1_ohmPerKm: x1,
  r0_ohmPerKm: Number((4 * r1).toFixed(4)),
  x0_ohmPerKm: Number((4 * x1).toFixed(4)),
  ampacity_A,
});
const CABLE = {
  cu35pvc: lv("Cu", "PVC", 35, 0.524, 0.083, 126),
  cu50: lv("Cu", "XLPE", 50, 0.387, 0.082, 192),
  cu95: lv("Cu", "XLPE", 95, 0.193, 0.08, 285),
  cu120: lv("Cu", "XLPE", 120, 0.153, 0.079, 328),
  cu185: lv("Cu", "XLPE", 185, 0.0991, 0.078, 425),
  cu240: lv("Cu", "XLPE", 240, 0.0754, 0.077, 490),
  al70: lv("Al", "XLPE", 70, 0.443, 0.082, 190),
  // 11 kV three-core screened XLPE: zero sequence set by the screen return
  mvAl240: { material: "Al", insulation: "XLPE", csa_mm2: 240, r1_ohmPerKm: 0.125, x1_ohmPerKm: 0.1, r0_ohmPerKm: 0.95, x0_ohmPerKm: 0.32, ampacity_A: 355 },
  mvAl95: { material: "Al", insulation: "XLPE", csa_mm2: 95, r1_ohmPerKm: 0.32, x1_ohmPerKm: 0.115, r0_ohmPerKm: 1.25, x0_ohmPerKm: 0.4, ampacity_A: 215 },
} satisfies Record<string, CableType>;

const cable = (id: string, name: string, fromBus: string, toBus: string, length_km: number, type: CableType) => ({
  kind: "line",
  id,
  name,
  construction: "cable",
  fromBus,
  toBus,
  length_km,
  ...type,
});

const bus = (id: string, name: string, un_kV: number, extra: Record<string, unknown> = {}) => ({ kind: "bus", id, name, un_kV, ...extra });

const load = (id: string, name: string, busId: string, p_kW: number, pf: number) => ({
  kind: "load",
  id,
  name,
  bus: busId,
  p_kW,
  q_kvar: Number((p_kW * Math.tan(Math.acos(pf))).toFixed(1)),
});

/** An LV breaker with a long-time / short-time / instantaneous trip unit. */
const lvBreaker = (
  id: string,
  name: string,
  element: string,
  end: "from" | "to" | "terminal",
  in_A: number,
  unit: { ir_x: number; tr_s: number; isd_x?: number; tsd_s?: number; ii_x?: number; ig_A?: number; tg_s?: number },
) => ({
  kind: "lvbreaker",
  id,
  name,
  at: { element, end },
  in_A,
  longTime: { ir_x: unit.ir_x, tr_s: unit.tr_s, ref_x: 6 },
  ...(unit.isd_x !== undefined ? { shortTime: { isd_x: unit.isd_x, tsd_s: unit.tsd_s ?? 0.1, i2t: false } } : {}),
  ...(unit.ii_x !== undefined ? { instantaneous: { ii_x: unit.ii_x } } : {}),
  ...(unit.ig_A !== undefined ? { groundFault: { ig_A: unit.ig_A, tg_s: unit.tg_s ?? 0.2, i2t: false } } : {}),
});

/** An 11 kV overcurrent relay with 51, 50 and 51N elements. */
const mvRelay = (
  id: string,
  name: string,
  element: string,
  end: "from" | "to" | "terminal",
  ctPrimary_A: number,
  s: { p51_A: number; tms: number; p50_A: number; t50_s: number; p51n_A: number; t51n_s: number },
) => ({
  kind: "relay",
  id,
  name,
  at: { element, end },
  ctPrimary_A,
  ctSecondary_A: 1,
  breakerTime_s: 0.06,
  functions: [
    { id: "51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: s.p51_A, multiplier: s.tms },
    { id: "50", ansi: "50", quantity: "phase", curve: "definite-time", pickup_A: s.p50_A, delay_s: s.t50_s },
    { id: "51N", ansi: "51N", quantity: "residual", curve: "definite-time", pickup_A: s.p51n_A, delay_s: s.t51n_s },
  ],
});

const fuse = (id: string, name: string, element: string, end: "from" | "to" | "terminal", rating_A: number, family: "general-purpose" | "fast" | "time-delay") => ({
  kind: "fuse",
  id,
  name,
  at: { element, end },
  rating_A,
  curve: { kind: "parametric", family },
});

const ELEMENTS: unknown[] = [
  // ---- 11 kV ----
  bus("MV-POC", "Utility point of connection", 11),
  bus("MV-MAIN", "11 kV main switchboard", 11, { clearingLimit_s: 1 }),
  bus("MV-VIL", "Village substation 11 kV", 11),
  { kind: "grid", id: "GRID", name: "Utility 11 kV tie", bus: "MV-POC", skMax_MVA: 150, skMin_MVA: 80, rx: 0.1, z0z1: 1, r0x0: 0.1 },
  cable("C-INC", "Utility incomer cable", "MV-POC", "MV-MAIN", 0.15, CABLE.mvAl240),
  cable("C-VIL", "Village feeder cable", "MV-MAIN", "MV-VIL", 2.4, CABLE.mvAl95),
  // ---- transformers ----
  {
    kind: "transformer",
    id: "T1",
    name: "Transformer 1 (1.6 MVA)",
    hvBus: "MV-MAIN",
    lvBus: "LV-A",
    sr_MVA: 1.6,
    urHv_kV: 11,
    urLv_kV: 0.4,
    uk_pct: 6,
    ur_pct: 0.9,
    vectorGroup: "Dyn11",
    earthingHv: { kind: "isolated" },
    earthingLv: { kind: "solid" },
  },
  {
    kind: "transformer",
    id: "T2",
    name: "Transformer 2 (1 MVA)",
    hvBus: "MV-MAIN",
    lvBus: "LV-B",
    sr_MVA: 1,
    urHv_kV: 11,
    urLv_kV: 0.4,
    uk_pct: 5,
    ur_pct: 1.05,
    vectorGroup: "Dyn11",
    earthingHv: { kind: "isolated" },
    earthingLv: { kind: "solid" },
  },
  {
    kind: "transformer",
    id: "T-VIL",
    name: "Village transformer (500 kVA)",
    hvBus: "MV-VIL",
    lvBus: "LV-VIL",
    sr_MVA: 0.5,
    urHv_kV: 11,
    urLv_kV: 0.4,
    uk_pct: 4.5,
    ur_pct: 1.2,
    vectorGroup: "Dyn11",
    earthingHv: { kind: "isolated" },
    earthingLv: { kind: "solid" },
  },
  // ---- LV main switchboard, two sections and a coupler ----
  bus("LV-A", "Main switchboard section A", 0.4, { clearingLimit_s: 0.5 }),
  bus("LV-B", "Main switchboard section B", 0.4, { clearingLimit_s: 0.5 }),
  { kind: "switch", id: "Q-BC", name: "Bus coupler", device: "breaker", busA: "LV-A", busB: "LV-B", closed: true, tOpen_s: 0.05 },
  bus("LV-VIL", "Village low-voltage board", 0.4),
  // ---- sources on the LV board ----
  {
    kind: "generator",
    id: "GEN1",
    name: "Standby diesel genset",
    bus: "LV-B",
    sr_MVA: 1.25,
    ur_kV: 0.4,
    cosPhi: 0.8,
    xdss_pu: 0.14,
    xds_pu: 0.25,
    xd_pu: 2.8,
    x2_pu: 0.15,
    x0_pu: 0.06,
    rx: 0.15,
    earthing: { kind: "solid" },
  },
  { kind: "inverter", id: "INV-PV", name: "Roof PV inverter", bus: "LV-A", source: "pv", sr_MVA: 0.9, ur_kV: 0.4, iMax_pu: 1.1, control: "grid-following", kFactor: 2, activePower_pu: 0.8 },
  {
    kind: "inverter",
    id: "INV-BESS",
    name: "Battery inverter",
    bus: "LV-B",
    source: "battery",
    sr_MVA: 0.6,
    ur_kV: 0.4,
    iMax_pu: 1.5,
    control: "grid-forming",
    kFactor: 2,
    negSeq: { mode: "k-factor", k2: 2 },
    zForming_pu: 0.15,
    activePower_pu: 0,
  },
  // ---- LV feeders ----
  bus("LV-MS", "Milking shed board", 0.4),
  bus("LV-CS", "Cold store board", 0.4),
  bus("LV-PH", "Processing hall board", 0.4),
  bus("LV-OF", "Offices sub-board", 0.4),
  bus("LV-WS", "Workshop board", 0.4),
  bus("LV-PMP", "Effluent pump starter", 0.4),
  bus("LV-CMP", "Ammonia compressor starter", 0.4),
  cable("C-MS", "Milking shed feeder", "LV-A", "LV-MS", 0.12, CABLE.cu120),
  cable("C-PH", "Processing hall feeder", "LV-A", "LV-PH", 0.09, CABLE.cu240),
  cable("C-PMP", "Effluent pump feeder", "LV-A", "LV-PMP", 0.38, CABLE.cu50),
  cable("C-CS", "Cold store feeder", "LV-B", "LV-CS", 0.06, CABLE.cu185),
  cable("C-OF", "Offices sub-board feeder", "LV-B", "LV-OF", 0.18, CABLE.cu35pvc),
  cable("C-WS", "Workshop feeder", "LV-B", "LV-WS", 0.25, CABLE.al70),
  cable("C-CMP", "Compressor feeder", "LV-B", "LV-CMP", 0.03, CABLE.cu95),
  load("L-MS", "Milking plant and vacuum pumps", "LV-MS", 160, 0.88),
  load("L-CS", "Cold store refrigeration", "LV-CS", 220, 0.85),
  load("L-PH", "Processing hall (pasteurisers, separators)", "LV-PH", 280, 0.9),
  load("L-OF", "Offices and canteen", "LV-OF", 40, 0.95),
  load("L-WS", "Workshop", "LV-WS", 60, 0.85),
  load("L-VIL", "Village load", "LV-VIL", 300, 0.93),
  { kind: "motor", id: "M-CMP", name: "Compressor motor (90 kW)", bus: "LV-CMP", pr_kW: 90, ur_kV: 0.4, eta: 0.95, cosPhi: 0.87, ilrIr: 7, rx: 0.42, start_s: 8, polePairs: 2 },
  { kind: "motor", id: "M-PMP", name: "Effluent pump motor (55 kW)", bus: "LV-PMP", pr_kW: 55, ur_kV: 0.4, eta: 0.94, cosPhi: 0.86, ilrIr: 6.5, rx: 0.42, start_s: 4, polePairs: 1 },
  // ---- 11 kV protection ----
  mvRelay("R-INC", "Utility tie relay", "C-INC", "from", 300, { p51_A: 240, tms: 0.4, p50_A: 3000, t50_s: 0.35, p51n_A: 40, t51n_s: 0.7 }),
  mvRelay("R-T1", "Transformer 1 HV relay", "T1", "from", 150, { p51_A: 120, tms: 0.35, p50_A: 1900, t50_s: 0, p51n_A: 20, t51n_s: 0.3 }),
  mvRelay("R-T2", "Transformer 2 HV relay", "T2", "from", 100, { p51_A: 75, tms: 0.35, p50_A: 1400, t50_s: 0, p51n_A: 15, t51n_s: 0.3 }),
  mvRelay("R-VIL", "Village feeder relay", "C-VIL", "from", 100, { p51_A: 50, tms: 0.15, p50_A: 800, t50_s: 0, p51n_A: 10, t51n_s: 0.3 }),
  fuse("F-TVIL", "Village transformer HV fuse", "T-VIL", "from", 40, "general-purpose"),
  // ---- LV breakers on the main switchboard ----
  lvBreaker("Q-T1", "Transformer 1 LV incomer", "T1", "to", 2500, { ir_x: 0.95, tr_s: 12, isd_x: 4, tsd_s: 0.4, ig_A: 1200, tg_s: 0.4 }),
  lvBreaker("Q-T2", "Transformer 2 LV incomer", "T2", "to", 1600, { ir_x: 0.95, tr_s: 12, isd_x: 4, tsd_s: 0.4, ig_A: 800, tg_s: 0.4 }),
  lvBreaker("Q-GEN", "Genset breaker", "GEN1", "terminal", 2000, { ir_x: 0.95, tr_s: 8, isd_x: 3, tsd_s: 0.4, ii_x: 10, ig_A: 600, tg_s: 0.3 }),
  lvBreaker("Q-PV", "PV inverter breaker", "INV-PV", "terminal", 1600, { ir_x: 1, tr_s: 8, ii_x: 10 }),
  lvBreaker("Q-BESS", "Battery inverter breaker", "INV-BESS", "terminal", 1000, { ir_x: 0.9, tr_s: 8, ii_x: 10 }),
  lvBreaker("Q-MS", "Milking shed feeder breaker", "C-MS", "from", 400, { ir_x: 0.8, tr_s: 6, isd_x: 6, tsd_s: 0.1, ii_x: 12 }),
  lvBreaker("Q-PH", "Processing hall feeder breaker", "C-PH", "from", 630, { ir_x: 0.75, tr_s: 6, isd_x: 6, tsd_s: 0.1, ii_x: 12 }),
  lvBreaker("Q-CS", "Cold store feeder breaker", "C-CS", "from", 630, { ir_x: 0.65, tr_s: 6, isd_x: 6, tsd_s: 0.1, ii_x: 12 }),
  lvBreaker("Q-WS", "Workshop feeder breaker", "C-WS", "from", 160, { ir_x: 0.8, tr_s: 5, ii_x: 10 }),
  // ---- fuses on final circuits ----
  fuse("F-OF", "Offices sub-board fuse", "C-OF", "from", 100, "general-purpose"),
  fuse("F-PMP", "Effluent pump fuse", "C-PMP", "from", 160, "time-delay"),
  fuse("F-CMP", "Compressor fuse", "C-CMP", "from", 250, "time-delay"),
];

const SCENARIOS = [
  { id: "grid-all", name: "Grid-tied, all sources", description: "Utility tie closed; genset, PV and battery running in parallel.", outOfService: [], limits: ["max", "min"] },
  { id: "grid-no-inverters", name: "Grid-tied, no PV or battery", description: "Utility tie and genset; both inverters off (night, battery in maintenance).", outOfService: ["INV-PV", "INV-BESS"], limits: ["max", "min"] },
  { id: "island-genset", name: "Islanded: genset, battery and PV", description: "Utility tie out of service; the site and the village run on the genset with the inverters.", outOfService: ["GRID"], limits: ["max", "min"] },
  { id: "island-inverters", name: "Islanded: battery and PV only (inverter-only)", description: "Utility tie and genset out of service; the battery inverter forms the grid.", outOfService: ["GRID", "GEN1"], limits: ["max", "min"] },
];

// One-line positions: 11 kV tie at the top, transformers, the two LV sections side by side, feeders below,
// the village feeder to the right.
const LAYOUT: Record<string, { x: number; y: number; w?: number; rot?: number }> = {
  GRID: { x: 560, y: 0 },
  "MV-POC": { x: 560, y: 80, w: 160 },
  "C-INC": { x: 560, y: 140 },
  "R-INC": { x: 600, y: 120 },
  "MV-MAIN": { x: 700, y: 220, w: 900 },
  "R-T1": { x: 400, y: 260 },
  T1: { x: 360, y: 320 },
  "Q-T1": { x: 400, y: 380 },
  "R-T2": { x: 800, y: 260 },
  T2: { x: 760, y: 320 },
  "Q-T2": { x: 800, y: 380 },
  "R-VIL": { x: 1180, y: 260 },
  "C-VIL": { x: 1140, y: 320 },
  "MV-VIL": { x: 1140, y: 420, w: 160 },
  "F-TVIL": { x: 1180, y: 460 },
  "T-VIL": { x: 1140, y: 520 },
  "LV-VIL": { x: 1140, y: 620, w: 160 },
  "L-VIL": { x: 1140, y: 700 },
  "LV-A": { x: 300, y: 460, w: 520 },
  "Q-BC": { x: 600, y: 460 },
  "LV-B": { x: 860, y: 460, w: 460 },
  "INV-PV": { x: 120, y: 340 },
  "Q-PV": { x: 120, y: 400 },
  GEN1: { x: 960, y: 340 },
  "Q-GEN": { x: 960, y: 400 },
  "INV-BESS": { x: 1040, y: 340 },
  "Q-BESS": { x: 1040, y: 400 },
  "Q-MS": { x: 120, y: 510 },
  "C-MS": { x: 120, y: 580 },
  "LV-MS": { x: 120, y: 660, w: 100 },
  "L-MS": { x: 120, y: 740 },
  "Q-PH": { x: 260, y: 510 },
  "C-PH": { x: 260, y: 580 },
  "LV-PH": { x: 260, y: 660, w: 100 },
  "L-PH": { x: 260, y: 740 },
  "F-PMP": { x: 400, y: 510 },
  "C-PMP": { x: 400, y: 580 },
  "LV-PMP": { x: 400, y: 660, w: 100 },
  "M-PMP": { x: 400, y: 740 },
  "Q-CS": { x: 700, y: 510 },
  "C-CS": { x: 700, y: 580 },
  "LV-CS": { x: 700, y: 660, w: 100 },
  "L-CS": { x: 700, y: 740 },
  "F-OF": { x: 820, y: 510 },
  "C-OF": { x: 820, y: 580 },
  "LV-OF": { x: 820, y: 660, w: 100 },
  "L-OF": { x: 820, y: 740 },
  "Q-WS": { x: 940, y: 510 },
  "C-WS": { x: 940, y: 580 },
  "LV-WS": { x: 940, y: 660, w: 100 },
  "L-WS": { x: 940, y: 740 },
  "F-CMP": { x: 1040, y: 510 },
  "C-CMP": { x: 1040, y: 580 },
  "LV-CMP": { x: 1040, y: 660, w: 100 },
  "M-CMP": { x: 1040, y: 740 },
};

/** The demo project, with the schema's defaults filled in. */
export function dairyCoopProject(): Project {
  return projectSchema.parse({
    format: FORMAT_TAG,
    formatVersion: FORMAT_VERSION,
    meta: {
      name: "Coastal dairy cooperative",
      description:
        "Invented demo site: a dairy cooperative on an 11 kV utility tie with two 11/0.4 kV transformers, a standby genset, roof PV, a battery inverter that forms the grid when islanded, and an 11 kV feeder to the neighbouring village. All names and figures are invented.",
      author: "Islet demo",
      baseMVA: 10,
      frequency_Hz: 50,
    },
    // parsing copies, so callers may edit the result freely
    elements: ELEMENTS,
    scenarios: SCENARIOS,
    layout: LAYOUT,
  });
}
