// The project file: our own open format, UTF-8 JSON with the extension ".islet".
// Envelope { format: "islet-project", formatVersion, meta, study, criteria, elements, scenarios, layout }.
// Loading never throws: it returns the project or a typed error whose messages name what is wrong.
// Writing to disk (atomically, with a backup) is the host's job; this module is pure.
import { FORMAT_TAG, FORMAT_VERSION, projectSchema, type Project } from "./schema.ts";
import { jsonSyntaxError } from "./jsonSyntaxError.ts";
import { runMigrations, MigrationError, type JsonObject } from "./migrations/index.ts";
import { schemaMessages, describeValue } from "./schemaMessages.ts";
import { validateRecords } from "./validate.ts";
import { canonicalJson } from "./canonicalJson.ts";
import { MAX_NESTING, replacementCharLines, tooDeep } from "./fileTextChecks.ts";

export const PROJECT_FILE_EXTENSION = ".islet";

export type LoadErrorKind = "invalidJson" | "notAProject" | "tooNew" | "migrationFailed" | "invalidRecords";
export interface LoadError {
  kind: LoadErrorKind;
  messages: string[];
}
export type LoadResult = { ok: true; project: Project; warnings: string[] } | { ok: false; error: LoadError };

function fail(kind: LoadErrorKind, messages: string[]): LoadResult {
  return { ok: false, error: { kind, messages } };
}

/** Reads a project file's text: parse, check the envelope, migrate step by step, validate the records. */
export function loadProject(text: string): LoadResult {
  try {
    return loadUnguarded(text);
  } catch (err) {
    // A bug of ours must not take the user's file down with it: report, never throw.
    const reason = err instanceof Error ? err.message : String(err);
    return fail("invalidRecords", [`Project file: could not be read because of an internal error (${reason}); the file is left unchanged`]);
  }
}

function loadUnguarded(text: string): LoadResult {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let doc: unknown;
  try {
    doc = JSON.parse(body);
  } catch {
    const where = jsonSyntaxError(body);
    if (!where) return fail("invalidJson", ["Project file: not valid JSON"]);
    const truncated = where.offset >= body.length ? " The file looks truncated (it ends too early)." : "";
    return fail("invalidJson", [
      `Project file: not valid JSON at line ${where.line}, column ${where.column} (character ${where.offset}): ${where.problem}.${truncated}`,
    ]);
  }

  const deep = tooDeep(doc);
  if (deep) {
    const where = deep.field === "" ? "" : ` under the field ${JSON.stringify(deep.field)}`;
    return fail("notAProject", [`Project file: values nest ${deep.depth} levels deep${where}; a project nests far less (this build reads up to ${MAX_NESTING} levels), so the file is not read`]);
  }
  if (typeof doc !== "object" || doc === null || Array.isArray(doc)) {
    return fail("notAProject", [`Project file: expected a JSON object with format "${FORMAT_TAG}", got ${describeValue(doc)}`]);
  }
  const envelope = doc as JsonObject;
  if (envelope.format !== FORMAT_TAG) {
    return fail("notAProject", [
      `Project file: format must be "${FORMAT_TAG}" (got ${describeValue(envelope.format)}); this is not an Islet project file`,
    ]);
  }
  // Version 0 drafts said `version`; every later file says `formatVersion`.
  const versionField = Object.hasOwn(envelope, "formatVersion") ? "formatVersion" : "version";
  const version = envelope[versionField];
  if (typeof version !== "number" || !Number.isInteger(version) || version < 0) {
    return fail("notAProject", [`Project file: formatVersion must be a whole number >= 0 (got ${describeValue(version)})`]);
  }
  if (version > FORMAT_VERSION) {
    return fail("tooNew", [
      `Project file: made by a newer Islet: formatVersion ${version}, this build reads up to ${FORMAT_VERSION}. Open it with a newer Islet; the file is left unchanged.`,
    ]);
  }

  const warnings: string[] = protoKeyPaths(envelope).map(
    (path) => `Project file: the field "__proto__" at ${path} is ignored (a reserved name in JavaScript; it is not kept on save)`,
  );
  const replaced = replacementCharLines(body);
  if (replaced.length > 0) {
    const shown = replaced.slice(0, 10).join(", ") + (replaced.length > 10 ? ` and ${replaced.length - 10} more` : "");
    warnings.push(
      `Project file: line${replaced.length > 1 ? "s" : ""} ${shown} hold${replaced.length > 1 ? "" : "s"} the replacement character U+FFFD: bytes there were not valid UTF-8 and were replaced when the file was read (or the character was typed on purpose). Check the text there; saving writes U+FFFD, not the original bytes`,
    );
  }
  let current: JsonObject = envelope;
  if (version < FORMAT_VERSION) {
    try {
      current = runMigrations(envelope, version).doc;
    } catch (err) {
      const reason = err instanceof MigrationError || err instanceof Error ? err.message : String(err);
      return fail("migrationFailed", [`Project file: could not be brought from formatVersion ${version} to ${FORMAT_VERSION}: ${reason}`]);
    }
    warnings.push(`Project file: brought from formatVersion ${version} to ${FORMAT_VERSION}; saving writes formatVersion ${FORMAT_VERSION}`);
  }

  const parsed = projectSchema.safeParse(current);
  if (!parsed.success) return fail("invalidRecords", schemaMessages(current, parsed.error.issues).map((m) => m.text));

  const messages = validateRecords(parsed.data);
  const errors = messages.filter((m) => m.severity === "error");
  if (errors.length > 0) return fail("invalidRecords", errors.map((m) => m.text));
  for (const m of messages) if (m.severity === "warning") warnings.push(m.text);
  return { ok: true, project: parsed.data, warnings };
}

/** Paths of "__proto__" keys, which JSON.parse keeps as data but the schemas cannot carry. */
function protoKeyPaths(value: unknown, path = "", out: string[] = []): string[] {
  if (typeof value !== "object" || value === null) return out;
  if (Array.isArray(value)) {
    value.forEach((v, i) => protoKeyPaths(v, `${path}[${i}]`, out));
    return out;
  }
  for (const key of Object.keys(value)) {
    const here = path === "" ? key : `${path}.${key}`;
    if (key === "__proto__") out.push(here);
    protoKeyPaths((value as Record<string, unknown>)[key], here, out);
  }
  return out;
}

/** Canonical text of a project: stable key order, 2-space indent, trailing newline. */
export function serializeProject(project: Project): string {
  return canonicalJson(project, projectSchema);
}

/** An empty project for File > New: one scenario, default study settings and criteria. */
export function newProject(name: string): Project {
  const trimmed = name.trim();
  return projectSchema.parse({
    format: FORMAT_TAG,
    formatVersion: FORMAT_VERSION,
    meta: { name: trimmed === "" ? "Untitled project" : trimmed },
    elements: [],
    scenarios: [{ id: "normal", name: "Normal operation" }],
  });
}
