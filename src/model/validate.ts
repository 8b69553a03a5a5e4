// Validation of a project document: first the schema (types, ranges, required fields), then the
// rules between records (ids, references, voltages, ratings, scenarios, topology).
// Every message names the element (id and name) and the field.
import { projectSchema, type Project } from "./schema.ts";
import type { Message } from "./messages.ts";
import { schemaMessages } from "./schemaMessages.ts";
import { ruleContext } from "./rules/ruleContext.ts";
import { uniqueIds } from "./rules/uniqueIds.ts";
import { references } from "./rules/references.ts";
import { voltages } from "./rules/voltages.ts";
import { ratings } from "./rules/ratings.ts";
import { scenarios } from "./rules/scenarios.ts";
import { connectivity } from "./rules/connectivity.ts";
import { powerStationUnits } from "./rules/powerStationUnits.ts";

const RULES = [uniqueIds, references, voltages, ratings, scenarios, connectivity, powerStationUnits];

/** Messages for a project: schema errors when the document does not parse, else every rule's findings. */
export function validateProject(input: Project | unknown): Message[] {
  const parsed = projectSchema.safeParse(input);
  if (!parsed.success) return schemaMessages(input, parsed.error.issues);
  return validateRecords(parsed.data);
}

/** The rules between records only, for a project already known to match the schema (skips a second parse). */
export function validateRecords(project: Project): Message[] {
  const ctx = ruleContext(project);
  return RULES.flatMap((rule) => rule(ctx));
}
