// Turns zod issues on a raw project document into messages that name the element (id and name)
// and the field: the issue path tells which element (by index) and which field.
import type { z } from "zod";
import { elementLabel, idText } from "./elementLabel.ts";
import { errorMessage, type Message } from "./messages.ts";

type Issue = z.core.$ZodIssue;
type Path = readonly PropertyKey[];

/** One message per issue, worded for the user, against the raw (unparsed) document. */
export function schemaMessages(doc: unknown, issues: readonly Issue[]): Message[] {
  return issues.map((issue) => issueMessage(doc, issue));
}

function issueMessage(doc: unknown, issue: Issue): Message {
  const path = issue.path;
  const { subject, elementId, fieldPath } = locate(doc, path);
  const field = fieldPath.map(String).join(".");
  const value = valueAt(doc, path);
  const what = describeProblem(issue, field, value);
  const text = `${subject}: ${what}`;
  return errorMessage(text, elementId, field === "" ? undefined : field);
}

/** Which thing the path points into, and the rest of the path as the field. */
function locate(doc: unknown, path: Path): { subject: string; elementId?: string; fieldPath: Path } {
  const [head, index, ...rest] = path;
  const root = isObject(doc) ? doc : {};
  if (head === "elements" && typeof index === "number") {
    const record = arrayItem(root.elements, index);
    const label = elementLabel(isObject(record) ? record : undefined, "Element");
    const id = isObject(record) && typeof record.id === "string" ? record.id : undefined;
    return { subject: id ? label : `${label} (elements[${index}])`, elementId: id, fieldPath: rest };
  }
  if (head === "scenarios" && typeof index === "number") {
    const record = arrayItem(root.scenarios, index);
    const id = isObject(record) && typeof record.id === "string" ? record.id : undefined;
    const label = elementLabel(isObject(record) ? { ...record, kind: "scenario" } : { kind: "scenario" });
    return { subject: id ? label : `${label} (scenarios[${index}])`, elementId: id, fieldPath: rest };
  }
  if (head === "layout" && typeof index === "string") return { subject: `Layout of ${idText(index)}`, elementId: index, fieldPath: rest };
  if (head === "meta") return { subject: "Project settings (meta)", fieldPath: path.slice(1) };
  if (head === "study") return { subject: "Study settings (study)", fieldPath: path.slice(1) };
  if (head === "criteria") return { subject: "Criteria (criteria)", fieldPath: path.slice(1) };
  return { subject: "Project file", fieldPath: path };
}

function describeProblem(issue: Issue, field: string, value: unknown): string {
  const f = field === "" ? "the document" : field;
  switch (issue.code) {
    case "invalid_type":
      if (value === undefined) return `${f} is missing (expected ${article(issue.expected)})`;
      return `${f} must be ${article(issue.expected)} (got ${describeValue(value)})`;
    case "too_small": {
      const min = String(issue.minimum);
      if (issue.origin === "array") return `${f} must have at least ${min} item${min === "1" ? "" : "s"} (got ${arrayLength(value)})`;
      if (issue.origin === "string") return `${f} must not be empty`;
      return `${f} must be ${issue.inclusive ? ">=" : ">"} ${min} (got ${describeValue(value)})`;
    }
    case "too_big": {
      const max = String(issue.maximum);
      if (issue.origin === "array") return `${f} must have at most ${max} items (got ${arrayLength(value)})`;
      if (issue.origin === "string") return `${f} must be at most ${max} characters`;
      return `${f} must be ${issue.inclusive ? "<=" : "<"} ${max} (got ${describeValue(value)})`;
    }
    case "invalid_value":
      return `${f} must be ${issue.values.length === 1 ? "" : "one of "}${issue.values.map((v) => JSON.stringify(v)).join(", ")} (got ${describeValue(value)})`;
    case "invalid_union": {
      const options = (issue as { options?: unknown[] }).options;
      if (Array.isArray(options) && options.length > 0) {
        const known = options.map((v) => JSON.stringify(v)).join(", ");
        if (field === "kind" && value !== undefined) return `unknown kind ${describeValue(value)}; known kinds: ${known}`;
        return `${f} must be one of ${known} (got ${describeValue(value)})`;
      }
      const allowed = literalAlternatives(issue);
      if (allowed) return `${f} must be one of ${allowed.map((v) => JSON.stringify(v)).join(", ")} (got ${describeValue(value)})`;
      return `${f} does not match any allowed form (got ${describeValue(value)})`;
    }
    case "not_multiple_of":
      return `${f} must be a multiple of ${String(issue.divisor)} (got ${describeValue(value)})`;
    default:
      return `${f}: ${issue.message}`;
  }
}

/** For a union of literals (e.g. 50 | 60) every branch fails with invalid_value: list the allowed values. */
function literalAlternatives(issue: Issue): unknown[] | null {
  const branches = (issue as { errors?: Issue[][] }).errors;
  if (!Array.isArray(branches) || branches.length === 0) return null;
  const values: unknown[] = [];
  for (const branch of branches) {
    if (branch.length !== 1 || branch[0].code !== "invalid_value" || branch[0].path.length > 0) return null;
    values.push(...branch[0].values);
  }
  return values;
}

function article(expected: string): string {
  if (expected === "int") return "a whole number";
  if (expected === "array" || expected === "object") return `an ${expected}`;
  return `a ${expected}`;
}

function arrayLength(v: unknown): string {
  return Array.isArray(v) ? String(v.length) : describeValue(v);
}

export function describeValue(v: unknown): string {
  if (v === undefined) return "nothing";
  if (v === null) return "null";
  if (Array.isArray(v)) return `an array of ${v.length}`;
  if (typeof v === "object") return "an object";
  if (typeof v === "string") return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}...` : v);
  return String(v);
}

function valueAt(doc: unknown, path: Path): unknown {
  let cur: unknown = doc;
  for (const key of path) {
    if (cur === null || typeof cur !== "object") return undefined;
    cur = (cur as Record<PropertyKey, unknown>)[key as string];
  }
  return cur;
}

function arrayItem(list: unknown, index: number): unknown {
  return Array.isArray(list) ? list[index] : undefined;
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}
