// New elements from the palette: generic starting values of our own (no product data), completed
// with the schema's defaults. The user edits them in Properties.
import { elementSchema, type DeviceLocation, type Element, type ElementKind, type Project } from "../../src/model/schema.ts";

export const ID_PREFIX: Record<ElementKind, string> = {
  bus: "B",
  grid: "N",
  transformer: "T",
  line: "C",
  generator: "G",
  inverter: "INV",
  motor: "M",
  load: "LD",
  switch: "SW",
  relay: "R",
  fuse: "F",
  lvbreaker: "CB",
};

const KIND_NAME: Record<ElementKind, string> = {
  bus: "Bus",
  grid: "Grid feeder",
  transformer: "Transformer",
  line: "Cable",
  generator: "Genset",
  inverter: "Inverter",
  motor: "Motor",
  load: "Load",
  switch: "Switching device",
  relay: "Relay",
  fuse: "Fuse",
  lvbreaker: "LV breaker",
};

/** Palette words where the kind's name alone could mislead: a switching device has no trip unit. */
const PALETTE_WORDS: Partial<Record<ElementKind, { label: string; title: string }>> = {
  switch: { label: "Switch (no trip)", title: "Add a breaker, switch or disconnector with no trip function of its own (a coupler or tie); a relay trips it" },
  lvbreaker: { label: "LV breaker + trip unit", title: "Add an LV circuit breaker with its own trip unit (long-time, short-time, instantaneous) on a branch end or a feeder" },
};

export function paletteWords(kind: ElementKind): { label: string; title: string } {
  return PALETTE_WORDS[kind] ?? { label: KIND_NAME[kind], title: `Add ${KIND_NAME[kind].toLowerCase()}` };
}

/** Smallest unused id of the form PREFIXn. */
export function nextId(kind: ElementKind, taken: ReadonlySet<string>): string {
  const prefix = ID_PREFIX[kind];
  for (let n = 1; ; n++) if (!taken.has(`${prefix}${n}`)) return `${prefix}${n}`;
}

// Starting values only: round figures chosen to give a valid element.
function startingValues(kind: ElementKind, at: DeviceLocation | null): Record<string, unknown> {
  switch (kind) {
    case "bus":
      return { un_kV: 0.4 };
    case "grid":
      return { bus: "", skMax_MVA: 250, skMin_MVA: 150 };
    case "transformer":
      return { hvBus: "", lvBus: "", sr_MVA: 1, urHv_kV: 11, urLv_kV: 0.4, uk_pct: 6 };
    case "line":
      return { fromBus: "", toBus: "", length_km: 0.1, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.32, csa_mm2: 120, ampacity_A: 280 };
    case "generator":
      return { bus: "", sr_MVA: 0.5, ur_kV: 0.4, xdss_pu: 0.15, x2_pu: 0.15, x0_pu: 0.08 };
    case "inverter":
      return { bus: "", sr_MVA: 0.25, ur_kV: 0.4 };
    case "motor":
      return { bus: "", pr_kW: 55, ur_kV: 0.4 };
    case "load":
      return { bus: "", p_kW: 100, q_kvar: 30 };
    case "switch":
      return { busA: "", busB: "" };
    case "relay":
      return {
        at,
        ctPrimary_A: 200,
        functions: [{ id: "f1", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 200, multiplier: 0.1 }],
      };
    case "fuse":
      return { at, rating_A: 100 };
    case "lvbreaker":
      return { at, in_A: 400, longTime: { ir_x: 1, tr_s: 10 }, instantaneous: { ii_x: 10 } };
  }
}

const UNCONNECTED = "unconnected";
const TERMINALS = ["bus", "fromBus", "toBus", "hvBus", "lvBus", "busA", "busB"];

/** A new element; its terminals start empty ("not connected") until the user ties them to buses. */
export function newElement(kind: ElementKind, doc: Project, at: DeviceLocation | null = null): Element {
  const taken = new Set(doc.elements.map((e) => e.id));
  const id = nextId(kind, taken);
  const n = id.slice(ID_PREFIX[kind].length);
  const start = startingValues(kind, at);
  // the schema wants non-empty bus ids: parse with a placeholder, then leave the terminals empty
  for (const t of TERMINALS) if (t in start) start[t] = UNCONNECTED;
  const parsed = elementSchema.parse({ kind, id, name: `${KIND_NAME[kind]} ${n}`, ...start }) as Record<string, unknown>;
  for (const t of TERMINALS) if (parsed[t] === UNCONNECTED) parsed[t] = "";
  return parsed as Element;
}

export const PALETTE_KINDS: ElementKind[] = ["bus", "grid", "transformer", "line", "switch", "generator", "inverter", "motor", "load", "relay", "fuse", "lvbreaker"];

export function kindName(kind: ElementKind): string {
  return KIND_NAME[kind];
}
