// Checks on every argument that crosses the IPC boundary. The renderer is treated as untrusted:
// a wrong type or an oversized payload is refused with a message naming the call and the argument.
import type { FileRef } from "../src/model/hostContract.ts";
import { LIMITS } from "./limits.ts";

export class ArgumentError extends Error {
  override name = "ArgumentError";
}

function describe(value: unknown): string {
  if (value === null) return "null";
  if (Array.isArray(value)) return "array";
  if (value instanceof Uint8Array) return `Uint8Array of ${value.byteLength} bytes`;
  if (typeof value === "string") return `string of ${value.length} characters`;
  return typeof value;
}

export function checkString(call: string, arg: string, value: unknown, max_chars: number): string {
  if (typeof value !== "string") throw new ArgumentError(`${call}: ${arg} must be a string (got ${describe(value)})`);
  if (value.length > max_chars) throw new ArgumentError(`${call}: ${arg} is too large (${value.length} characters, limit ${max_chars})`);
  return value;
}

export function checkBoolean(call: string, arg: string, value: unknown): boolean {
  if (typeof value !== "boolean") throw new ArgumentError(`${call}: ${arg} must be true or false (got ${describe(value)})`);
  return value;
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value) && !(value instanceof Uint8Array);
}

export function checkFileRef(call: string, arg: string, value: unknown): FileRef {
  if (!isPlainObject(value)) throw new ArgumentError(`${call}: ${arg} must be a file reference { name, key } (got ${describe(value)})`);
  const name = checkString(call, `${arg}.name`, value.name, LIMITS.name_chars);
  const key = checkString(call, `${arg}.key`, value.key, LIMITS.path_chars);
  if (key.length === 0) throw new ArgumentError(`${call}: ${arg}.key must not be empty`);
  if (key.includes("\0")) throw new ArgumentError(`${call}: ${arg}.key must not contain a NUL character`);
  return { name, key };
}

export function checkFileRefOrNull(call: string, arg: string, value: unknown): FileRef | null {
  return value === null || value === undefined ? null : checkFileRef(call, arg, value);
}

export function checkDocumentState(call: string, value: unknown): { name: string; dirty: boolean } {
  if (!isPlainObject(value)) throw new ArgumentError(`${call}: state must be { name, dirty } (got ${describe(value)})`);
  return { name: checkString(call, "state.name", value.name, LIMITS.name_chars), dirty: checkBoolean(call, "state.dirty", value.dirty) };
}

/** Export payloads are text or bytes; the byte size counts, since that is what lands on disk. */
export function checkExportData(call: string, arg: string, value: unknown): string | Uint8Array {
  if (typeof value === "string") {
    // UTF-8 takes at most 3 bytes per UTF-16 code unit; check cheaply before encoding.
    if (value.length * 3 > LIMITS.export_bytes && new TextEncoder().encode(value).byteLength > LIMITS.export_bytes) {
      throw new ArgumentError(`${call}: ${arg} is too large (limit ${LIMITS.export_bytes} bytes)`);
    }
    return value;
  }
  if (value instanceof Uint8Array) {
    if (value.byteLength > LIMITS.export_bytes) throw new ArgumentError(`${call}: ${arg} is too large (${value.byteLength} bytes, limit ${LIMITS.export_bytes})`);
    return value;
  }
  throw new ArgumentError(`${call}: ${arg} must be a string or a Uint8Array (got ${describe(value)})`);
}
