// Migration 0 -> 1. Version 0 was the pre-release draft format: `version` instead of `formatVersion`,
// the project's metadata under `project`, elements in an object keyed by id, and field names without units
// (e.g. a bus had `un`, a cable `length`, `r1`). Version 1 holds elements in an array, each with its id,
// and every quantity named with its unit (`un_kV`, `length_km`, `r1_ohmPerKm`).
import { MigrationError, type JsonObject, type Migration } from "./migration.ts";

/** Draft field name -> version 1 field name, per element kind. Fields not listed keep their name. */
export const DRAFT_FIELD_NAMES: Record<string, Record<string, string>> = {
  bus: { un: "un_kV", clearingLimit: "clearingLimit_s" },
  grid: { skMax: "skMax_MVA", skMin: "skMin_MVA" },
  transformer: { sr: "sr_MVA", urHv: "urHv_kV", urLv: "urLv_kV", uk: "uk_pct", ur: "ur_pct", tap: "tap_pct" },
  line: {
    length: "length_km",
    r1: "r1_ohmPerKm",
    x1: "x1_ohmPerKm",
    r0: "r0_ohmPerKm",
    x0: "x0_ohmPerKm",
    csa: "csa_mm2",
    ampacity: "ampacity_A",
  },
  generator: { sr: "sr_MVA", ur: "ur_kV", xdss: "xdss_pu", xds: "xds_pu", xd: "xd_pu", x2: "x2_pu", x0: "x0_pu" },
  inverter: { sr: "sr_MVA", ur: "ur_kV", iMax: "iMax_pu", zForming: "zForming_pu", activePower: "activePower_pu" },
  motor: { pr: "pr_kW", ur: "ur_kV", start: "start_s" },
  load: { p: "p_kW", q: "q_kvar" },
  switch: { tOpen: "tOpen_s" },
  relay: { ctPrimary: "ctPrimary_A", ctSecondary: "ctSecondary_A", breakerTime: "breakerTime_s" },
  fuse: { rating: "rating_A" },
  lvbreaker: { in: "in_A", clearing: "clearing_s" },
};
const RELAY_FUNCTION_NAMES: Record<string, string> = { pickup: "pickup_A", delay: "delay_s", tMin: "tMin_s", tMax: "tMax_s" };
const LV_PART_NAMES: Record<string, Record<string, string>> = {
  longTime: { ir: "ir_x", tr: "tr_s", ref: "ref_x" },
  shortTime: { isd: "isd_x", tsd: "tsd_s" },
  instantaneous: { ii: "ii_x" },
  groundFault: { ig: "ig_A", tg: "tg_s" },
};
const META_NAMES: Record<string, string> = { base: "baseMVA", frequency: "frequency_Hz" };

function isObject(v: unknown): v is JsonObject {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** Renames keys per the map, keeping every other key (unknown fields are never dropped). */
function renamed(record: JsonObject, names: Record<string, string>, where: string): JsonObject {
  const out: JsonObject = {};
  for (const [key, value] of Object.entries(record)) {
    const target = Object.hasOwn(names, key) ? names[key] : key;
    if (Object.hasOwn(out, target) || (target !== key && Object.hasOwn(record, target))) {
      throw new MigrationError(`${where}: has both "${key}" and "${target}"; cannot tell which to keep`);
    }
    Object.defineProperty(out, target, { value, enumerable: true, writable: true, configurable: true });
  }
  return out;
}

function migrateElement(id: string, draft: unknown): JsonObject {
  const where = `Element ${id}`;
  if (!isObject(draft)) throw new MigrationError(`${where}: expected an object in "elements", got ${draft === null ? "null" : typeof draft}`);
  if (draft.id !== undefined && draft.id !== id) {
    throw new MigrationError(`${where}: its "id" field says ${JSON.stringify(draft.id)}, but it is stored under key ${JSON.stringify(id)}`);
  }
  const kind = typeof draft.kind === "string" ? draft.kind : "";
  const label = typeof draft.name === "string" && draft.name ? `${where} "${draft.name}"` : where;
  const body = renamed(draft, DRAFT_FIELD_NAMES[kind] ?? {}, label);
  if (kind === "relay" && Array.isArray(body.functions)) {
    body.functions = body.functions.map((f, k) => (isObject(f) ? renamed(f, RELAY_FUNCTION_NAMES, `${label}: functions.${k}`) : f));
  }
  if (kind === "lvbreaker") {
    for (const [part, names] of Object.entries(LV_PART_NAMES)) {
      if (isObject(body[part])) body[part] = renamed(body[part], names, `${label}: ${part}`);
    }
  }
  // kind, id first so the record reads the same as one written by version 1
  const { kind: k, id: _ignored, ...rest } = body;
  return { kind: k, id, ...rest };
}

export const v1ElementsArray: Migration = {
  id: 1,
  summary: "elements from an object keyed by id to an array; unit suffixes on every quantity; `project` becomes `meta`",
  up(doc) {
    const { version: _version, project, elements, ...rest } = doc;
    if (elements !== undefined && !isObject(elements)) {
      throw new MigrationError(`elements: a version 0 file keeps elements in an object keyed by id, got ${Array.isArray(elements) ? "an array" : typeof elements}`);
    }
    if (project !== undefined && !isObject(project)) throw new MigrationError(`project: expected an object, got ${typeof project}`);
    const meta = project ? renamed(project, META_NAMES, "project") : {};
    const list = Object.entries(elements ?? {}).map(([id, e]) => migrateElement(id, e));
    const { format, ...others } = rest;
    return { format, formatVersion: 1, meta, ...others, elements: list };
  },
};
