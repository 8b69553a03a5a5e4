// Device templates: generic, parametric settings stored as JSON in assets/templates. The core cannot read files,
// so callers pass the parsed JSON; this module validates it and turns a template into a document device.
import { z } from "zod";
import { fuseSchema, lvBreakerSchema, relaySchema } from "../model/schema.ts";
import type { DeviceLocation } from "../model/schema.ts";
import type { ProtectiveDevice } from "./types.ts";
import { checkDeviceSettings } from "./checkDeviceSettings.ts";

export const TEMPLATE_FORMAT = "islet-device-template";
export const TEMPLATE_FORMAT_VERSION = 1;

/** A device record without id, name and location (kept per kind, so `kind` still narrows it). */
// (a key-remapping mapped type: Omit would collapse the loose records' known fields into their index signature)
type WithoutPlace<D> = { [K in keyof D as K extends "id" | "name" | "at" ? never : K]: D[K] };
export type DeviceBody = ProtectiveDevice extends infer D ? (D extends ProtectiveDevice ? WithoutPlace<D> : never) : never;

export interface DeviceTemplate {
  /** Stable template id, e.g. "relay-iec-standard-inverse-feeder". */
  id: string;
  /** What it is, e.g. "IEC standard inverse feeder relay". */
  title: string;
  description: string;
  /** The device record without id, name and location. */
  device: DeviceBody;
}

export class TemplateError extends Error {
  constructor(
    readonly source: string,
    readonly problems: readonly string[],
  ) {
    super(`Template ${source}: ${problems.join("; ")}`);
    this.name = "TemplateError";
  }
}

const envelope = z.looseObject({
  format: z.literal(TEMPLATE_FORMAT),
  formatVersion: z.literal(TEMPLATE_FORMAT_VERSION),
  id: z.string().min(1),
  title: z.string().min(1),
  description: z.string().default(""),
  device: z.looseObject({ kind: z.enum(["relay", "fuse", "lvbreaker"]) }),
});

const PLACEHOLDER_AT: DeviceLocation = { element: "template", end: "from" };

function parseDevice(device: Record<string, unknown>, id: string, title: string): ProtectiveDevice {
  const record = { ...device, id, name: title, at: PLACEHOLDER_AT };
  if (device.kind === "relay") return relaySchema.parse(record);
  if (device.kind === "fuse") return fuseSchema.parse(record);
  return lvBreakerSchema.parse(record);
}

/** Validate one parsed template file; `source` names it in errors (e.g. the file name). */
export function loadTemplate(json: unknown, source: string): DeviceTemplate {
  const env = envelope.safeParse(json);
  if (!env.success) {
    throw new TemplateError(source, env.error.issues.map((i) => `${i.path.join(".") || "(root)"}: ${i.message}`));
  }
  const { id, title, description } = env.data;
  let device: ProtectiveDevice;
  try {
    device = parseDevice(env.data.device, id, title);
  } catch (e) {
    const issues = e instanceof z.ZodError ? e.issues.map((i) => `device.${i.path.join(".")}: ${i.message}`) : [String(e)];
    throw new TemplateError(source, issues);
  }
  const errors = checkDeviceSettings(device).filter((m) => m.severity === "error");
  if (errors.length > 0) throw new TemplateError(source, errors.map((m) => m.text));
  const { id: _i, name: _n, at: _a, ...rest } = device;
  return { id, title, description, device: rest as DeviceBody };
}

/** Validate many; good ones load, bad ones are reported without stopping the rest. */
export function loadTemplates(files: readonly { source: string; json: unknown }[]): { templates: DeviceTemplate[]; errors: TemplateError[] } {
  const templates: DeviceTemplate[] = [];
  const errors: TemplateError[] = [];
  for (const f of files) {
    try {
      templates.push(loadTemplate(f.json, f.source));
    } catch (e) {
      if (e instanceof TemplateError) errors.push(e);
      else throw e;
    }
  }
  const seen = new Set<string>();
  for (const t of templates) {
    if (seen.has(t.id)) errors.push(new TemplateError(t.id, [`template id ${t.id} is used twice`]));
    seen.add(t.id);
  }
  return { templates, errors };
}

/** A new device from a template; the caller supplies a fresh id, a name and where it sits. */
export function instantiateTemplate(t: DeviceTemplate, id: string, name: string, at: DeviceLocation): ProtectiveDevice {
  return structuredCloneLike({ ...t.device, id, name, at }) as ProtectiveDevice;
}

// Deep copy of plain JSON data so the new device shares nothing with the template.
function structuredCloneLike<T>(v: T): T {
  return JSON.parse(JSON.stringify(v)) as T;
}
