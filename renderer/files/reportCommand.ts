// Assembles the study report in the studio: the same buildReport the CLI uses, fed from the open
// document and the last full study. Pure apart from the SHA-256 (Web Crypto), so it is unit-tested.
import { loadProject, serializeProject } from "../../src/model/projectFile.ts";
import type { Project } from "../../src/model/schema.ts";
import type { ClearingTimeline, StudyResult } from "../../src/study/types.ts";
import { buildReport, faultTable } from "../../src/report/index.ts";

export interface ReportCommandInput {
  project: Project;
  study: StudyResult;
  /** Name of the session's file, or null for a project never saved. */
  fileName: string | null;
  /** The document differs from the saved file (the hash is then of the current document, not the file). */
  dirty: boolean;
  /** Report date, YYYY-MM-DD (the caller reads the clock). */
  date: string;
  version: string;
  /** Clearing timelines of failed cases the full study did not simulate (see failureTimelineCases), as the CLI adds. */
  extraTimelines?: readonly ClearingTimeline[];
}

export interface AssembledReport {
  html: string;
  /** Suggested name for the saved HTML, e.g. "dairy-coop-report.html". */
  htmlName: string;
  /** Suggested name for the printed PDF. */
  pdfName: string;
  fileSha256: string;
}

/** 64 lowercase hex digits of SHA-256 over the UTF-8 bytes of `text`. */
export async function sha256Hex(text: string): Promise<string> {
  const digest = await crypto.subtle.digest("SHA-256", new TextEncoder().encode(text));
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, "0")).join("");
}

/** The base of the report file names: the project file's stem, else the project's name. */
export function reportBaseName(fileName: string | null, projectName: string): string {
  const stem = (fileName ?? "").replace(/\.islet$/i, "").trim();
  const base = (stem || projectName).replace(/[^\w.-]+/g, "-").replace(/^-+|-+$/g, "");
  return base || "project";
}

/** What the cover says about the file: the hash is always of the current document's text. */
export function fileLabel(fileName: string | null, dirty: boolean): string {
  if (fileName === null) return "not saved to a file (hash of the current document)";
  return dirty ? `${fileName}, with unsaved changes (hash of the current document)` : fileName;
}

export async function reportCommand(input: ReportCommandInput): Promise<AssembledReport> {
  // The hash is over the text a save would write, so it matches the file once saved unchanged.
  const text = serializeProject(input.project);
  const fileSha256 = await sha256Hex(text);
  const loaded = loadProject(text);
  const base = reportBaseName(input.fileName, input.project.meta.name);
  const report = buildReport({
    project: input.project,
    study: input.study,
    faults: faultTable(input.project),
    meta: { date: input.date, version: input.version, fileName: fileLabel(input.fileName, input.dirty), fileSha256 },
    validationWarnings: loaded.ok ? loaded.warnings : [],
    extraTimelines: input.extraTimelines,
  });
  return { html: report.html, htmlName: `${base}-report.html`, pdfName: `${base}-report.pdf`, fileSha256 };
}
