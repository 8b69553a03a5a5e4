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

export function fieldsOf(schema: z.ZodType): FieldSpec[] {
  const out: FieldSpec[] = [];
  for (const [key, s] of Object.entries(shapeOf(schema))) {
    if (key === "kind") continue;
    const spec = fieldSpec(key, s);
    if (spec) out.push(spec);
  }
  return out;
}

export function fieldsOfKind(kind: ElementKind): FieldSpec[] {
  return fieldsOf(KIND_SCHEMAS[kind]);
}
