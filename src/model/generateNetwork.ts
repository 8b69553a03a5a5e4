// Synthetic networks for benchmarks, canvas stress tests and property tests: an invented
// 11 kV site with a radial tree of cables and laterals, 11/0.4 kV transformers feeding LV
// buses, loads, a synchronous generator, a few inverters and protective devices at branch ends.
// Pure and deterministic: the same options give the same project (seeded PRNG, no Math.random).
// Cable and transformer figures are generic round values of the right order, not any maker's data.
import { FORMAT_TAG, FORMAT_VERSION, type Element, type Layout, type Project, type RelayFunction } from "./schema.ts";

export interface GenerateNetworkOptions {
  /** Total number of buses (MV and LV), at least 2. */
  buses: number;
  /** Maximum number of protective devices (relays, fuses, LV breakers) placed at branch ends. */
  devices: number;
  /** Seed of the PRNG: the same seed gives the same project. */
  seed: number;
}

export interface GenerateMeshedNetworkOptions extends GenerateNetworkOptions {
  /** Number of tie cables closing loops between MV buses (default: about 5 % of the buses, at least 1). */
  ties?: number;
}

/** Scenario ids of every generated project. */
export const GENERATED_SCENARIOS = { gridTied: "sc-grid", islanded: "sc-island" } as const;

const BASE_MVA = 100;
const MV_KV = 11;
const LV_KV = 0.4;
const GRID_SKMAX_MVA = 250;
const GRID_SKMIN_MVA = 150;
const MAX_DEPTH = 40; // keeps the deepest bus's fault level plausible on a 10,000-bus tree
const TOTAL_LOAD_KW = 8000;

interface CableType {
  csa_mm2: number;
  material: "Cu" | "Al";
  r1: number;
  x1: number;
  r0: number;
  x0: number;
  ampacity_A: number;
}
/** The per-km data and rating fields of a cable record, one run of XLPE cable of this type. */
function cableData(type: CableType) {
  return {
    r1_ohmPerKm: type.r1,
    x1_ohmPerKm: type.x1,
    r0_ohmPerKm: type.r0,
    x0_ohmPerKm: type.x0,
    parallel: 1,
    material: type.material,
    insulation: "XLPE" as const,
    csa_mm2: type.csa_mm2,
    ampacity_A: type.ampacity_A,
  };
}
// Round generic values, ohm/km (typical orders of magnitude; // from memory).
const MV_CABLES: CableType[] = [
  { csa_mm2: 240, material: "Al", r1: 0.125, x1: 0.097, r0: 0.5, x0: 0.35, ampacity_A: 420 },
  { csa_mm2: 150, material: "Al", r1: 0.206, x1: 0.104, r0: 0.82, x0: 0.4, ampacity_A: 320 },
  { csa_mm2: 95, material: "Al", r1: 0.32, x1: 0.112, r0: 1.25, x0: 0.45, ampacity_A: 250 },
];
const LV_CABLES: CableType[] = [
  { csa_mm2: 185, material: "Cu", r1: 0.099, x1: 0.072, r0: 0.4, x0: 0.29, ampacity_A: 400 },
  { csa_mm2: 95, material: "Cu", r1: 0.193, x1: 0.074, r0: 0.77, x0: 0.3, ampacity_A: 270 },
  { csa_mm2: 50, material: "Cu", r1: 0.387, x1: 0.076, r0: 1.55, x0: 0.31, ampacity_A: 180 },
];
const TRANSFORMER_MVA = [0.25, 0.4, 0.63, 1.0];
const CT_PRIMARY_A = [50, 100, 150, 200, 300, 400, 600, 800, 1000, 1200, 1600, 2000];
const FUSE_RATING_A = [6.3, 10, 16, 20, 25, 31.5, 40, 50, 63, 80, 100, 125, 160, 200];
const BREAKER_IN_A = [100, 160, 250, 400, 630, 800, 1000, 1250, 1600, 2000, 2500, 3200, 4000];

/** mulberry32: a small 32-bit PRNG, good enough for synthetic data (not for cryptography). */
function seededRandom(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const pick = <T>(rnd: () => number, xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)];
const round = (x: number, digits: number) => Number(x.toFixed(digits));
const firstAtLeast = (xs: readonly number[], v: number) => xs.find((x) => x >= v) ?? xs[xs.length - 1];
const baseCurrent_A = (un_kV: number) => (BASE_MVA * 1000) / (Math.sqrt(3) * un_kV);

/** One bus of the generated tree, with what the generator needs to set devices. */
interface TreeBus {
  id: string;
  un_kV: number;
  parent: number; // -1 for the root
  depth: number;
  branchId: string; // the branch from the parent ("" for the root)
  zPath_pu: number; // |Z| from the root bus, summed along the tree (an upper bound, used for settings)
  load_kW: number;
  children: number[];
}

function checkOptions(o: GenerateNetworkOptions): void {
  if (!Number.isInteger(o.buses) || o.buses < 2) throw new Error(`generateNetwork: buses must be an integer >= 2 (got ${o.buses})`);
  if (!Number.isInteger(o.devices) || o.devices < 0) throw new Error(`generateNetwork: devices must be an integer >= 0 (got ${o.devices})`);
  if (!Number.isFinite(o.seed)) throw new Error(`generateNetwork: seed must be a finite number (got ${o.seed})`);
}

/** A radial network: grid feeder at 11 kV, MV cable tree with laterals, 11/0.4 kV transformers to LV buses. */
export function generateRadialNetwork(options: GenerateNetworkOptions): Project {
  checkOptions(options);
  return build(options, 0, "radial");
}

/** The radial network with tie cables between MV buses that close loops. */
export function generateMeshedNetwork(options: GenerateMeshedNetworkOptions): Project {
  checkOptions(options);
  const ties = options.ties ?? Math.max(1, Math.round(options.buses * 0.05));
  if (!Number.isInteger(ties) || ties < 0) throw new Error(`generateNetwork: ties must be an integer >= 0 (got ${ties})`);
  return build(options, ties, "meshed");
}

function build(o: GenerateNetworkOptions, ties: number, shape: "radial" | "meshed"): Project {
  const rnd = seededRandom(o.seed);
  const elements: Element[] = [];
  const tree: TreeBus[] = [];
  const zGrid_pu = BASE_MVA / GRID_SKMIN_MVA;

  // Root: the 11 kV switchboard with the grid feeder and the generator.
  tree.push({ id: "bus-0", un_kV: MV_KV, parent: -1, depth: 0, branchId: "", zPath_pu: 0, load_kW: 0, children: [] });
  let lines = 0;
  let transformers = 0;
  for (let i = 1; i < o.buses; i++) {
    // Mostly continue the previous bus (a trunk), sometimes branch off an earlier bus (a lateral).
    let parent = rnd() < 0.55 ? i - 1 : Math.floor(rnd() * i);
    if (tree[parent].depth >= MAX_DEPTH) parent = Math.floor(rnd() * Math.min(i, 8));
    const p = tree[parent];
    const lvDepth = p.un_kV === LV_KV ? lvDepthOf(tree, parent) : 0;
    if (p.un_kV === LV_KV && (lvDepth >= 3 || rnd() < 0.7)) {
      // LV feeders stay short and few: go back up to the MV bus that feeds this LV board.
      parent = p.parent;
      while (tree[parent].un_kV === LV_KV) parent = tree[parent].parent;
    }
    const par = tree[parent];
    const busId = `bus-${i}`;
    let kind: "mv" | "tx" | "lv";
    if (par.un_kV === LV_KV) kind = "lv";
    else kind = i > 1 && rnd() < 0.12 ? "tx" : "mv";
    let z_pu: number;
    let branchId: string;
    if (kind === "tx") {
      transformers++;
      branchId = `tx-${transformers}`;
      const sr = pick(rnd, TRANSFORMER_MVA);
      const uk = sr >= 0.63 ? 6 : 4;
      elements.push({
        kind: "transformer",
        id: branchId,
        name: `Transformer ${transformers}`,
        hvBus: par.id,
        lvBus: busId,
        sr_MVA: sr,
        urHv_kV: MV_KV,
        urLv_kV: LV_KV,
        uk_pct: uk,
        ur_pct: 1,
        vectorGroup: "Dyn11",
        earthingHv: { kind: "isolated" },
        earthingLv: { kind: "solid" },
        tap_pct: 0,
        z0z1: 1,
      });
      z_pu = ((uk / 100) * BASE_MVA) / sr;
    } else {
      lines++;
      branchId = `cab-${lines}`;
      const un = par.un_kV;
      const type = pick(rnd, un === LV_KV ? LV_CABLES : MV_CABLES);
      const length_km = round(un === LV_KV ? 0.02 + rnd() * 0.12 : 0.05 + rnd() * 0.45, 3);
      elements.push({
        kind: "line",
        id: branchId,
        name: `Cable ${lines}`,
        construction: "cable",
        fromBus: par.id,
        toBus: busId,
        length_km,
        ...cableData(type),
      });
      z_pu = (Math.hypot(type.r1, type.x1) * length_km) / ((un * un) / BASE_MVA);
    }
    const un_kV = kind === "mv" ? MV_KV : LV_KV;
    tree.push({ id: busId, un_kV, parent, depth: par.depth + 1, branchId, zPath_pu: par.zPath_pu + z_pu, load_kW: 0, children: [] });
    par.children.push(i);
  }

  // Buses first, so a reader sees the nodes before what connects them.
  const busElements: Element[] = tree.map((b, i) => ({ kind: "bus", id: b.id, name: i === 0 ? "Main 11 kV board" : `Bus ${i}`, un_kV: b.un_kV }));

  // Sources at the main board: the grid feeder and one generator (the islanded source).
  const gen = { sr_MVA: 2.5, xdss_pu: 0.15 };
  const shunts: Element[] = [
    { kind: "grid", id: "grid-1", name: "Utility feeder", bus: "bus-0", skMax_MVA: GRID_SKMAX_MVA, skMin_MVA: GRID_SKMIN_MVA, rx: 0.1, z0z1: 1, r0x0: 0.1 },
    {
      kind: "generator",
      id: "gen-1",
      name: "Standby generator",
      bus: "bus-0",
      sr_MVA: gen.sr_MVA,
      ur_kV: MV_KV,
      cosPhi: 0.8,
      xdss_pu: gen.xdss_pu,
      xds_pu: 0.25,
      xd_pu: 2,
      x2_pu: 0.16,
      x0_pu: 0.07,
      rx: 0.07,
      earthing: { kind: "resistance", z_ohm: 20 },
    },
  ];
  const zGen_pu = (gen.xdss_pu * BASE_MVA) / gen.sr_MVA;

  // Loads on about half the non-root buses, scaled to a plausible site total.
  const loadBuses = tree.map((_, i) => i).filter((i) => i > 0 && rnd() < 0.5);
  if (loadBuses.length === 0) loadBuses.push(tree.length - 1);
  const perLoad_kW = TOTAL_LOAD_KW / loadBuses.length;
  loadBuses.forEach((bi, k) => {
    const p_kW = round(perLoad_kW * (0.5 + rnd()), 1);
    tree[bi].load_kW = p_kW;
    shunts.push({ kind: "load", id: `load-${k + 1}`, name: `Load ${k + 1}`, bus: tree[bi].id, p_kW, q_kvar: round(p_kW * 0.4, 1) });
  });

  // A few inverters, preferably on LV buses: PV that follows the grid, one battery that forms it.
  const lvBuses = tree.map((_, i) => i).filter((i) => tree[i].un_kV === LV_KV);
  const candidates = lvBuses.length > 0 ? lvBuses : tree.map((_, i) => i).filter((i) => i > 0);
  const nInverters = Math.min(12, Math.max(2, Math.round(o.buses / 100))); // a few, not one per feeder
  for (let k = 0; k < nInverters; k++) {
    const bi = pick(rnd, candidates);
    const battery = k === 0;
    shunts.push({
      kind: "inverter",
      id: `inv-${k + 1}`,
      name: battery ? "Battery inverter" : `PV inverter ${k}`,
      bus: tree[bi].id,
      source: battery ? "battery" : "pv",
      sr_MVA: battery ? 0.5 : round(0.05 + rnd() * 0.2, 3),
      ur_kV: tree[bi].un_kV,
      iMax_pu: battery ? 1.5 : 1.2,
      control: battery ? "grid-forming" : "grid-following",
      kFactor: 2,
      negSeq: { mode: "none", k2: 2 },
      zForming_pu: 0.15,
      activePower_pu: 0.8,
    });
  }

  // Subtree sums (children have larger indices than parents, so one backward pass suffices).
  const subLoad_kW = tree.map((b) => b.load_kW);
  const subZmax_pu = tree.map((b) => b.zPath_pu);
  const height = tree.map(() => 0);
  for (let i = tree.length - 1; i > 0; i--) {
    const p = tree[i].parent;
    subLoad_kW[p] += subLoad_kW[i];
    subZmax_pu[p] = Math.max(subZmax_pu[p], subZmax_pu[i]);
    height[p] = Math.max(height[p], height[i] + 1);
  }

  const branchElements = new Map<string, Element>();
  for (const e of elements) branchElements.set(e.id, e);
  const devices = placeDevices(o.devices, tree, branchElements, subLoad_kW, subZmax_pu, height, Math.max(zGrid_pu, zGen_pu));

  // Ties between MV buses that are not already neighbours.
  const tieElements: Element[] = [];
  const mvBuses = tree.map((_, i) => i).filter((i) => tree[i].un_kV === MV_KV);
  for (let k = 0; k < ties && mvBuses.length >= 3; k++) {
    let a = pick(rnd, mvBuses);
    let b = pick(rnd, mvBuses);
    for (let tries = 0; tries < 20 && (a === b || tree[a].parent === b || tree[b].parent === a); tries++) {
      a = pick(rnd, mvBuses);
      b = pick(rnd, mvBuses);
    }
    if (a === b) continue;
    const type = MV_CABLES[0];
    tieElements.push({
      kind: "line",
      id: `tie-${k + 1}`,
      name: `Tie ${k + 1}`,
      construction: "cable",
      fromBus: tree[a].id,
      toBus: tree[b].id,
      length_km: round(0.2 + rnd() * 0.8, 3),
      ...cableData(type),
    });
  }

  const all = [...busElements, ...elements, ...tieElements, ...shunts, ...devices];
  return {
    format: FORMAT_TAG,
    formatVersion: FORMAT_VERSION,
    meta: {
      name: `Generated ${shape} network (${o.buses} buses, seed ${o.seed})`,
      description: "Synthetic invented site for benchmarks and tests; not a real installation.",
      author: "generateNetwork",
      baseMVA: BASE_MVA,
      frequency_Hz: 50,
    },
    study: {
      method: "iec60909",
      prefault_pu: 1,
      lvTolerance_pct: 10,
      inverterModel: "refined",
      breakingTime_s: 0.1,
      thermalTime_s: 1,
      conductorEndTemp_C: 160,
      faultR_ohm: 0,
      faultX_ohm: 0,
    },
    criteria: {
      cti_s: 0.3,
      ctiDirectActing_s: 0,
      primaryMargin: 1.5,
      backupMargin: 1.2,
      loadMargin: 1.25,
      clearingLimit_s: 1,
      horizon_s: 10,
      linePoints_pct: [10, 50, 90],
      pairCti: [],
    },
    elements: all,
    scenarios: [
      { id: GENERATED_SCENARIOS.gridTied, name: "Grid-tied", outOfService: [], switchStates: {}, limits: ["max", "min"] },
      { id: GENERATED_SCENARIOS.islanded, name: "Islanded", description: "Utility feeder out; generator and battery carry the site.", outOfService: ["grid-1"], switchStates: {}, limits: ["max", "min"] },
    ],
    layout: treeLayout(tree, all),
  };
}

function lvDepthOf(tree: TreeBus[], i: number): number {
  let d = 0;
  while (i > 0 && tree[i].un_kV === LV_KV && tree[tree[i].parent].un_kV === LV_KV) {
    d++;
    i = tree[i].parent;
  }
  return d;
}

/** Devices at branch ends, upstream first (breadth-first), with settings that pick up on faults in their zone:
 * phase pickup 1.5x the downstream load (// common practice: 1.25-1.5x load) but at most half the estimated
 * minimum fault current at the far end of the subtree (// common practice: end-of-zone fault >= 1.5-2x pickup). */
function placeDevices(
  limit: number,
  tree: TreeBus[],
  branches: Map<string, Element>,
  subLoad_kW: number[],
  subZmax_pu: number[],
  height: number[],
  zSourceMin_pu: number,
): Element[] {
  const out: Element[] = [];
  const order: number[] = [];
  const queue = [0];
  while (queue.length > 0) {
    const i = queue.shift() as number;
    if (i > 0) order.push(i);
    queue.push(...tree[i].children);
  }
  const push = (e: Element) => {
    if (out.length < limit) out.push(e);
  };
  for (const i of order) {
    if (out.length >= limit) break;
    const b = tree[i];
    const br = branches.get(b.branchId);
    if (!br) continue;
    const un = tree[b.parent].un_kV;
    const load_A = (subLoad_kW[i] / (Math.sqrt(3) * un * 0.93)) || 1; // cos phi about 0.93 from q = 0.4 p
    const ikMin_A = (0.95 * baseCurrent_A(un)) / (zSourceMin_pu + subZmax_pu[i]); // far end, weakest source
    if (br.kind === "transformer") {
      const irHv_A = (br.sr_MVA * 1000) / (Math.sqrt(3) * br.urHv_kV);
      push({ kind: "fuse", id: `fuse-${i}`, name: `Fuse ${i}`, at: { element: br.id, end: "from" }, rating_A: firstAtLeast(FUSE_RATING_A, 1.6 * irHv_A), curve: { kind: "parametric", family: "general-purpose" } });
      const irLv_A = (br.sr_MVA * 1000) / (Math.sqrt(3) * br.urLv_kV);
      push(lvBreaker(`lvb-${i}`, br.id, "to", irLv_A, (0.95 * baseCurrent_A(LV_KV)) / (zSourceMin_pu + subZmax_pu[i])));
    } else if (un === LV_KV) {
      push(lvBreaker(`lvb-${i}`, br.id, "from", Math.max(load_A * 1.25, 40), ikMin_A));
    } else {
      const pickup_A = round(Math.min(Math.max(1.5 * load_A, 20), 0.5 * ikMin_A), 1);
      const ct = firstAtLeast(CT_PRIMARY_A, pickup_A);
      const tms = round(Math.min(1, 0.05 + 0.03 * height[i]), 2);
      const functions: RelayFunction[] = [
        { id: "f51", ansi: "51", enabled: true, quantity: "phase", curve: "iec-standard-inverse", pickup_A, multiplier: tms, delay_s: 0, tMin_s: 0, reset: "instantaneous", direction: "non-directional", rca_deg: 45 },
        { id: "f51n", ansi: "51N", enabled: true, quantity: "residual", curve: "iec-standard-inverse", pickup_A: round(Math.max(0.2 * pickup_A, 5), 1), multiplier: tms, delay_s: 0, tMin_s: 0, reset: "instantaneous", direction: "non-directional", rca_deg: 45 },
      ];
      push({ kind: "relay", id: `rly-${i}`, name: `Relay ${i}`, at: { element: br.id, end: "from" }, ctPrimary_A: ct, ctSecondary_A: 1, breakerTime_s: 0.06, functions, tolerance: { pickup_pct: 5, time_pct: 5, time_min_s: 0.02 } });
    }
  }
  return out;
}

function lvBreaker(id: string, element: string, end: "from" | "to", i_A: number, ikMin_A: number): Element {
  const in_A = firstAtLeast(BREAKER_IN_A, i_A);
  const ir_x = round(Math.min(1, Math.max(0.4, Math.ceil((i_A / in_A) * 20) / 20)), 2);
  const ir_A = ir_x * in_A;
  const isd_x = round(Math.min(10, Math.max(1.5, Math.floor((0.5 * ikMin_A) / ir_A))), 1);
  return {
    kind: "lvbreaker",
    id,
    name: `LV breaker ${id.slice(4)}`,
    at: { element, end },
    in_A,
    longTime: { ir_x, tr_s: 10, ref_x: 6 },
    shortTime: { isd_x, tsd_s: 0.2, i2t: false },
    clearing_s: 0.03,
    tolerance: { pickup_pct: 10, time_pct: 15, time_min_s: 0.01 },
  };
}

/** A layered tree layout: depth down the page, leaves spread across it, parents centred over children;
 * branches at the midpoint of their buses, shunt elements to the right of their bus, devices beside their branch end. */
function treeLayout(tree: TreeBus[], elements: Element[]): Layout {
  const DX = 140;
  const DY = 180;
  const x = new Array<number>(tree.length).fill(0);
  let nextLeaf = 0;
  // Iterative post-order so a 10,000-deep chain cannot overflow the stack.
  const stack: Array<[number, boolean]> = [[0, false]];
  while (stack.length > 0) {
    const [i, done] = stack.pop() as [number, boolean];
    const kids = tree[i].children;
    if (done || kids.length === 0) {
      x[i] = kids.length === 0 ? nextLeaf++ * DX : (x[kids[0]] + x[kids[kids.length - 1]]) / 2;
      continue;
    }
    stack.push([i, true]);
    for (let k = kids.length - 1; k >= 0; k--) stack.push([kids[k], false]);
  }
  const layout: Layout = {};
  const busPos = new Map<string, { x: number; y: number }>();
  tree.forEach((b, i) => {
    const p = { x: x[i], y: b.depth * DY };
    busPos.set(b.id, p);
    layout[b.id] = { x: p.x, y: p.y, w: 100 };
  });
  const shuntCount = new Map<string, number>();
  const branchEnds = new Map<string, [string, string]>();
  for (const e of elements) {
    if (e.kind === "line") branchEnds.set(e.id, [e.fromBus, e.toBus]);
    if (e.kind === "transformer") branchEnds.set(e.id, [e.hvBus, e.lvBus]);
  }
  for (const e of elements) {
    if (e.kind === "bus") continue;
    if (e.kind === "line" || e.kind === "transformer") {
      const [a, b] = branchEnds.get(e.id) as [string, string];
      const pa = busPos.get(a) as { x: number; y: number };
      const pb = busPos.get(b) as { x: number; y: number };
      layout[e.id] = { x: (pa.x + pb.x) / 2, y: (pa.y + pb.y) / 2 };
    } else if (e.kind === "relay" || e.kind === "fuse" || e.kind === "lvbreaker") {
      const ends = branchEnds.get(e.at.element);
      const bus = ends ? (e.at.end === "to" ? ends[1] : ends[0]) : "";
      const p = busPos.get(bus) ?? { x: 0, y: 0 };
      const q = ends ? (busPos.get(e.at.end === "to" ? ends[0] : ends[1]) ?? p) : p;
      layout[e.id] = { x: p.x + (q.x - p.x) * 0.25 + 30, y: p.y + (q.y - p.y) * 0.25 };
    } else if (e.kind !== "switch") {
      const n = shuntCount.get(e.bus) ?? 0;
      shuntCount.set(e.bus, n + 1);
      const p = busPos.get(e.bus) ?? { x: 0, y: 0 };
      layout[e.id] = { x: p.x + 60 + 40 * n, y: p.y + 50 };
    }
  }
  return layout;
}
