// The migration chain, in order. Append a step when FORMAT_VERSION goes up; never edit a released one.
import { FORMAT_VERSION } from "../schema.ts";
import { MigrationError, type JsonObject, type Migration } from "./migration.ts";
import { v1ElementsArray } from "./v1ElementsArray.ts";

export const MIGRATIONS: readonly Migration[] = [v1ElementsArray];

export interface MigrationRun {
  doc: JsonObject;
  /** Ids of the steps that ran, in order. */
  applied: number[];
}

/** Runs every step from `fromVersion` up to FORMAT_VERSION, in order. Throws MigrationError on a gap. */
export function runMigrations(doc: JsonObject, fromVersion: number, migrations: readonly Migration[] = MIGRATIONS, toVersion = FORMAT_VERSION): MigrationRun {
  let current = doc;
  const applied: number[] = [];
  for (let v = fromVersion + 1; v <= toVersion; v++) {
    const step = migrations.find((m) => m.id === v);
    if (!step) throw new MigrationError(`no migration produces formatVersion ${v}`);
    try {
      current = step.up(current);
    } catch (err) {
      const reason = err instanceof Error ? err.message : String(err);
      throw new MigrationError(`step to formatVersion ${v} (${step.summary}): ${reason}`);
    }
    applied.push(step.id);
  }
  return { doc: current, applied };
}

export { MigrationError, type JsonObject, type Migration };
