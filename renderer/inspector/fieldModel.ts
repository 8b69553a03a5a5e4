// Inspector fields derived from the zod schema: labels from the descriptions, units from the
// field-name suffixes, choices from enums and literal unions, nesting from objects and arrays.
import type { z } from "zod";
import {
  busSchema,
  gridSchema,
  transformerSchema,
  lineSchema,
  generatorSchema,
  inverterSchema,
  motorSchema,
  loadSchema,
  switchSchema,
  relaySchema,
  fuseSchema,
  lvBreakerSchema,
  type ElementKind,
} from "../../src/model/schema.ts";
import { fieldLabel } from "../../src/model/fieldLabels.ts";

export const KIND_SCHEMAS: Record<ElementKind, z.ZodType> = {
  bus: busSchema,
  grid: gridSchema,
  transformer: transformerSchema,
  line: lineSchema,
  generator: generatorSchema,
  inverter: inverterSchema,
  motor: motorSchema,
  load: loadSchema,
  switch: switchSchema,
  relay: relaySchema,
  fuse: fuseSchema,
  lvbreaker: lvBreakerSchema,
};

/** Fields holding a bus reference: edited with a bus chooser. */
export const BUS_REF_FIELDS = new Set(["bus", "fromBus", "toBus", "hvBus", "lvBus", "busA", "busB"]);
/** Fields holding a reference to another element of one kind: edited with a chooser of those elements. */
export const ELEMENT_REF_FIELDS: Record<string, ElementKind> = { transformer: "transformer" };

export type FieldSpec =
  | { type: "number"; key: string; label: string; unit: string; help: string; optional: boolean; integer: boolean }
  | { type: "text"; key: string; label: string; help: string; optional: boolean }
  | { type: "busRef"; key: string; label: string; help: string }
  | { type: "elementRef"; key: string; label: string; help: string; kind: ElementKind }
  | { type: "choice"; key: string; label: string; help: string; options: (string | number)[]; optional: boolean }
  | { type: "flag"; key: string; label: string; help: string }
  | { type: "group"; key: string; label: string; help: string; optional: boolean; fields: FieldSpec[] }
  | { type: "list"; key: string; label: string; help: string; item: FieldSpec[] }
  | { type: "variant"; key: string; label: string; help: string; discriminator: string; variants: Record<string, FieldSpec[]> }
  | { type: "location"; key: string; label: string; help: string };

const UNIT_SUFFIXES: [RegExp, string][] = [
  [/_kV$/, "kV"],
  [/_MVA$/, "MVA"],
  [/_pct$/, "%"],
  [/_km$/, "km"],
  [/_ohmPerKm$/, "Ω/km"],
  [/_ohm$/, "Ω"],
  [/_A$/, "A"],
  [/_s$/, "s"],
  [/_pu$/, "pu"],
  [/_kW$/, "kW"],
  [/_kvar$/, "kvar"],
  [/_mm2$/, "mm²"],
  [/_deg$/, "°"],
  [/_Hz$/, "Hz"],
  [/_C$/, "°C"],
  [/_x$/, "×"],
];

export function unitOf(key: string): string {
  for (const [re, unit] of UNIT_SUFFIXES) if (re.test(key)) return unit;
  return "";
}

const WORDS: Record<string, string> = {
  id: "Id",
  name: "Name",
  bus: "Bus",
  fromBus: "From bus",
  toBus: "To bus",
  hvBus: "HV bus",
  lvBus: "LV bus",
  busA: "Bus A",
  busB: "Bus B",
  ctSecondary_A: "CT secondary",
  earthing: "Earthing",
  earthingHv: "HV earthing",
  earthingLv: "LV earthing",
  longTime: "Long-time band",
  shortTime: "Short-time band",
  instantaneous: "Instantaneous",
  groundFault: "Ground-fault band",
  tolerance: "Tolerance",
  functions: "Functions",
  quantity: "Measured quantity",
  restraint: "51V voltage restraint",
  material: "Conductor material",
  insulation: "Insulation",
  control: "Control mode",
  source: "Energy source",
  rx: "R/X",
  z0z1: "Z0/Z1",
  r0x0: "R0/X0",
  eta: "Efficiency",
  cosPhi: "Power factor",
  ilrIr: "Locked-rotor current ILR/IR",
  ansi: "Device number",
  kFactor: "k-factor",
  construction: "Construction",
};

/** Label: the description without its trailing unit phrase, else the key in words. */
export function labelOf(key: string, description: string | undefined): string {
  if (WORDS[key]) return WORDS[key];
  if (description) {
    const short = description
      .replace(/\s*\(.*?\)\s*/g, " ")
      .replace(/\s+in (kV|MVA|A|s|seconds|percent|km|ohm|ohm\/km|kW|kvar|mm2|pu|pu of rating|primary amperes|degrees)(\b.*)?$/i, "")
      .replace(/[,:].*$/, "")
      .trim();
    if (short) return short;
  }
  const bare = key.replace(/_[A-Za-z0-9]+$/, "");
  const spaced = bare.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase();
  return spaced.charAt(0).toUpperCase() + spaced.slice(1);
}

interface Def {
  type: string;
  innerType?: z.ZodType;
  options?: z.ZodType[];
  values?: unknown[];
  element?: z.ZodType;
  discriminator?: string;
  entries?: Record<string, string>;
  checks?: { _zod?: { def?: { check?: string; format?: string } } }[];
}

function def(s: z.ZodType): Def {
  return (s as unknown as { def: Def }).def;
}

function unwrap(s: z.ZodType): { base: z.ZodType; optional: boolean; description: string | undefined } {
  let cur = s;
  let optional = false;
  let description = cur.description;
  for (;;) {
    const d = def(cur);
    if (d.type === "optional" || d.type === "default" || d.type === "prefault" || d.type === "nullable") {
      if (d.type === "optional") optional = true;
      cur = d.innerType as z.ZodType;
      description ??= cur.description;
    } else break;
  }
  return { base: cur, optional, description };
}

function shapeOf(s: z.ZodType): Record<string, z.ZodType> {
  return (s as unknown as { shape: Record<string, z.ZodType> }).shape;
}

export function fieldSpec(key: string, schema: z.ZodType): FieldSpec | null {
  const { base, optional, description } = unwrap(schema);
  const d = def(base);
  const label = labelOf(key, description);
  const help = description ?? "";
  if (key === "at") return { type: "location", key, label: "Located at", help };
  if (BUS_REF_FIELDS.has(key)) return { type: "busRef", key, label: labelOf(key, undefined), help };
  if (Object.hasOwn(ELEMENT_REF_FIELDS, key) && d.type === "string") return { type: "elementRef", key, label, help, kind: ELEMENT_REF_FIELDS[key] };
  switch (d.type) {
    case "number": {
      const integer = (d.checks ?? []).some((c) => c._zod?.def?.format === "safeint" || c._zod?.def?.check === "number_format");
      return { type: "number", key, label, unit: unitOf(key), help, optional, integer };
    }
    case "string":
      return { type: "text", key, label, help, optional };
    case "boolean":
      return { type: "flag", key, label, help };
    case "enum":
      return { type: "choice", key, label, help, options: Object.values(d.entries ?? {}), optional };
    case "union": {
      const opts = d.options ?? [];
      if (d.discriminator) {
        const variants: Record<string, FieldSpec[]> = {};
        for (const o of opts) {
          const shape = shapeOf(o);
          const tag = def(shape[d.discriminator]).values?.[0];
          variants[String(tag)] = fieldsOf(o).filter((f) => f.key !== d.discriminator);
        }
        return { type: "variant", key, label, help, discriminator: d.discriminator, variants };
      }
      const literals = opts.map((o) => def(o)).filter((od) => od.type === "literal").map((od) => od.values?.[0] as string | number);
      if (literals.length === opts.length) return { type: "choice", key, label, help, options: literals, optional };
      return null;
    }
    case "object":
      return { type: "group", key, label, help, optional, fields: fieldsOf(base) };
    case "array": {
      const el = unwrap(d.element as z.ZodType).base;
      if (def(el).type === "object") return { type: "list", key, label, help, item: fieldsOf(el) };
      return null;
    }
    default:
      return null;
  }
}

/** The fields of an object schema; an element's own `kind` is not a field (a nested one, such as an
 * earthing's kind, is). */
export function fieldsOf(schema: z.ZodType, top = false): FieldSpec[] {
  const out: FieldSpec[] = [];
  for (const [key, s] of Object.entries(shapeOf(schema))) {
    if (key === "kind" && top) continue;
    const spec = fieldSpec(key, s);
    if (spec) out.push(spec);
  }
  return out;
}

/** Human labels (src/model/fieldLabels.ts) over the ones derived from the schema. */
function relabel(kind: ElementKind, specs: FieldSpec[], path: string[]): FieldSpec[] {
  return specs.map((spec) => {
    const p = [...path, spec.key];
    const label = fieldLabel(kind, p) ?? spec.label;
    if (spec.type === "group") return { ...spec, label, fields: relabel(kind, spec.fields, p) };
    if (spec.type === "list") return { ...spec, label, item: relabel(kind, spec.item, p) };
    if (spec.type === "variant") return { ...spec, label, variants: Object.fromEntries(Object.entries(spec.variants).map(([k, v]) => [k, relabel(kind, v, p)])) };
    return { ...spec, label };
  });
}

const kindFields = new Map<ElementKind, FieldSpec[]>();

export function fieldsOfKind(kind: ElementKind): FieldSpec[] {
  let specs = kindFields.get(kind);
  if (!specs) kindFields.set(kind, (specs = relabel(kind, fieldsOf(KIND_SCHEMAS[kind], true), [])));
  return specs;
}

type Record_ = Record<string, unknown>;
/** Fields that apply only in some settings, by key, judged on the record that holds them. */
const APPLIES: Record<string, (holder: Record_) => boolean> = {
  // an earthing impedance only for resistance or reactance earthing
  z_ohm: (h) => h.kind === "resistance" || h.kind === "reactance",
  // a grid-following unit injects reactive and negative-sequence current; a grid-forming one is a source behind an impedance
  kFactor: (h) => h.control !== "grid-forming",
  negSeq: (h) => h.control !== "grid-forming",
  zForming_pu: (h) => h.control === "grid-forming",
  k2: (h) => h.mode === "k-factor",
  // relay functions: a definite-time delay or an inverse curve's multiplier; restraint for 51V, direction for 67/67N
  multiplier: (h) => h.curve !== "definite-time" || !("ansi" in h),
  delay_s: (h) => !("ansi" in h) || h.curve === "definite-time" || h.ansi === "50" || h.ansi === "50N",
  reset: (h) => !("ansi" in h) || String(h.curve).startsWith("ieee"),
  restraint: (h) => !("ansi" in h) || h.ansi === "51V",
  direction: (h) => !("ansi" in h) || h.ansi === "67" || h.ansi === "67N",
  rca_deg: (h) => !("ansi" in h) || h.ansi === "67" || h.ansi === "67N",
};

/** Whether field `key` applies to at least one of the records holding it. */
export function fieldApplies(key: string, holders: readonly unknown[]): boolean {
  const rule = APPLIES[key];
  if (!rule) return true;
  return holders.some((h) => !h || typeof h !== "object" || rule(h as Record_));
}

/** The on-screen label of the field at a dotted path such as "functions.1.pickup_A", if the kind has it. */
export function labelAtPath(kind: ElementKind, path: string): string | undefined {
  let specs: FieldSpec[] = fieldsOfKind(kind);
  let label: string | undefined;
  for (const part of path.split(".")) {
    if (/^\d+$/.test(part)) continue;
    const spec = specs.find((s) => s.key === part);
    if (!spec) return undefined;
    label = spec.label;
    specs = spec.type === "group" ? spec.fields : spec.type === "list" ? spec.item : spec.type === "variant" ? Object.values(spec.variants).flat() : [];
  }
  return label;
}
