// Deterministic JSON for the project file: keys in the schema's field order (every record starts
// kind, id, name), fields the schema does not know last in sorted order, 2-space indent, trailing newline.
// The same document always gives the same bytes, so files diff cleanly under version control.
import type { z } from "zod";

type Def = { type: string; [key: string]: unknown };
type AnySchema = z.core.$ZodType;

function defOf(schema: AnySchema | undefined): Def | undefined {
  return schema ? (schema._zod.def as unknown as Def) : undefined;
}

/** Strips optional/default/nullable/readonly/pipe wrappers. Cached: the same schemas are met once per record. */
const unwrapped = new WeakMap<AnySchema, AnySchema | undefined>();
function unwrap(schema: AnySchema | undefined): AnySchema | undefined {
  if (!schema) return undefined;
  if (unwrapped.has(schema)) return unwrapped.get(schema);
  let s: AnySchema | undefined = schema;
  for (let guard = 0; s && guard < 20; guard++) {
    const def: Def = defOf(s)!;
    if (def.type === "optional" || def.type === "default" || def.type === "nullable" || def.type === "readonly" || def.type === "prefault" || def.type === "catch") {
      s = def.innerType as AnySchema;
    } else if (def.type === "pipe") {
      s = def.in as AnySchema;
    } else break;
  }
  unwrapped.set(schema, s);
  return s;
}

/** For a union of objects: discriminator value -> option, built once per union. */
const unionIndex = new WeakMap<Def, { key: string; options: Map<unknown, AnySchema> }>();
function pickOption(def: Def, value: Record<string, unknown>): AnySchema | undefined {
  let index = unionIndex.get(def);
  if (!index) {
    const key = typeof def.discriminator === "string" ? def.discriminator : "kind";
    const options = new Map<unknown, AnySchema>();
    for (const option of (def.options as AnySchema[] | undefined) ?? []) {
      const o = defOf(unwrap(option));
      if (o?.type !== "object") continue;
      const lit = defOf(unwrap((o.shape as Record<string, AnySchema>)[key]));
      if (lit?.type === "literal") for (const v of lit.values as unknown[]) if (!options.has(v)) options.set(v, option);
    }
    index = { key, options };
    unionIndex.set(def, index);
  }
  return index.options.get(value[index.key]);
}

/** A copy of `value` with object keys in canonical order (values untouched). */
export function canonicalize(value: unknown, schema?: AnySchema): unknown {
  const s = unwrap(schema);
  const def = defOf(s);
  if (Array.isArray(value)) {
    if (def?.type === "array") {
      const item = def.element as AnySchema;
      return value.map((v) => canonicalize(v, item));
    }
    if (def?.type === "tuple") {
      const items = def.items as AnySchema[];
      return value.map((v, i) => canonicalize(v, items[i] ?? (def.rest as AnySchema | undefined)));
    }
    return value.map((v) => canonicalize(v));
  }
  if (value === null || typeof value !== "object") return value;
  const obj = value as Record<string, unknown>;
  if (def?.type === "union") return canonicalize(value, pickOption(def, obj));
  const out: Record<string, unknown> = {};
  if (def?.type === "object") {
    const shape = def.shape as Record<string, AnySchema>;
    for (const key in shape) if (Object.hasOwn(obj, key)) out[key] = canonicalize(obj[key], shape[key]);
    const unknown = Object.keys(obj).filter((key) => !Object.hasOwn(shape, key));
    if (unknown.length > 0) for (const key of unknown.sort()) setKey(out, key, canonicalize(obj[key], def.catchall as AnySchema | undefined));
    return out;
  }
  const valueSchema = def?.type === "record" ? (def.valueType as AnySchema) : undefined;
  for (const key of Object.keys(obj).sort()) setKey(out, key, canonicalize(obj[key], valueSchema));
  return out;
}

/** Plain assignment would treat a "__proto__" key from a file as the prototype; define it as data instead. */
export function setKey(target: Record<string, unknown>, key: string, value: unknown): void {
  if (key === "__proto__") Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true });
  else target[key] = value;
}

/** Canonical JSON text: 2-space indent and a trailing newline. */
export function canonicalJson(value: unknown, schema?: AnySchema): string {
  return `${JSON.stringify(canonicalize(value, schema), null, 2)}\n`;
}
