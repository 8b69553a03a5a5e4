// Deterministic JSON for the project file: keys in the schema's field order (every record starts
// kind, id, name), fields the schema does not know last in sorted order, 2-space indent, trailing newline.
// The same document always gives the same bytes, so files diff cleanly under version control.
import type { z } from "zod";

type Def = { type: string; [key: string]: unknown };
type AnySchema = z.core.$ZodType;

function defOf(schema: AnySchema | undefined): Def | undefined {
  return schema ? (schema._zod.def as unknown as Def) : undefined;
}

/** Strips optional/default/nullable/readonly/pipe wrappers. */
function unwrap(schema: AnySchema | undefined): AnySchema | undefined {
  let s = schema;
  for (let guard = 0; s && guard < 20; guard++) {
    const def = defOf(s)!;
    if (def.type === "optional" || def.type === "default" || def.type === "nullable" || def.type === "readonly" || def.type === "prefault" || def.type === "catch") {
      s = def.innerType as AnySchema;
    } else if (def.type === "pipe") {
      s = def.in as AnySchema;
    } else return s;
  }
  return s;
}

/** For a union of objects, the option whose literal discriminator matches the value. */
function pickOption(def: Def, value: Record<string, unknown>): AnySchema | undefined {
  const options = (def.options as AnySchema[] | undefined) ?? [];
  const key = typeof def.discriminator === "string" ? def.discriminator : "kind";
  for (const option of options) {
    const o = defOf(unwrap(option));
    if (o?.type !== "object") continue;
    const lit = defOf(unwrap((o.shape as Record<string, AnySchema>)[key]));
    if (lit?.type === "literal" && (lit.values as unknown[]).includes(value[key])) return option;
  }
  return undefined;
}

/** A copy of `value` with object keys in canonical order (values untouched). */
export function canonicalize(value: unknown, schema?: AnySchema): unknown {
  const s = unwrap(schema);
  const def = defOf(s);
  if (Array.isArray(value)) {
    let itemSchema: ((i: number) => AnySchema | undefined) = () => undefined;
    if (def?.type === "array") itemSchema = () => def.element as AnySchema;
    else if (def?.type === "tuple") itemSchema = (i) => (def.items as AnySchema[])[i] ?? (def.rest as AnySchema | undefined);
    return value.map((v, i) => canonicalize(v, itemSchema(i)));
  }
  if (value === null || typeof value !== "object") return value;
  const obj = value as Record<string, unknown>;
  if (def?.type === "union") return canonicalize(value, pickOption(def, obj));
  const out: Record<string, unknown> = {};
  if (def?.type === "object") {
    const shape = def.shape as Record<string, AnySchema>;
    for (const key of Object.keys(shape)) if (Object.hasOwn(obj, key)) setKey(out, key, canonicalize(obj[key], shape[key]));
    for (const key of Object.keys(obj).sort()) if (!Object.hasOwn(shape, key)) setKey(out, key, canonicalize(obj[key], def.catchall as AnySchema | undefined));
    return out;
  }
  const valueSchema = def?.type === "record" ? (def.valueType as AnySchema) : undefined;
  for (const key of Object.keys(obj).sort()) setKey(out, key, canonicalize(obj[key], valueSchema));
  return out;
}

/** Plain assignment would treat a "__proto__" key from a file as the prototype; define it as data instead. */
export function setKey(target: Record<string, unknown>, key: string, value: unknown): void {
  Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true });
}

/** Canonical JSON text: 2-space indent and a trailing newline. */
export function canonicalJson(value: unknown, schema?: AnySchema): string {
  return `${JSON.stringify(canonicalize(value, schema), null, 2)}\n`;
}
