// One step of the project-file migration chain. A migration's id is the formatVersion it produces;
// it takes the document as the previous version left it (plain JSON) and returns the next version.

export type JsonObject = { [key: string]: unknown };

export interface Migration {
  /** The formatVersion this step produces; the chain runs ids 1, 2, ... FORMAT_VERSION in order. */
  id: number;
  /** What changed, for the log and the README. */
  summary: string;
  /** Pure: must not mutate its input. Throws MigrationError with a named message on data it cannot carry over. */
  up(doc: JsonObject): JsonObject;
}

/** Raised by a migration step with a message that names the element and field it could not carry over. */
export class MigrationError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "MigrationError";
  }
}
