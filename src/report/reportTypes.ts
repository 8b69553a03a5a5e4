// Inputs and outputs of the study report. Everything the report shows is passed in: the project, the study
// result, the fault table, and the facts only the host knows (date, version, file hash), so the same input
// always gives byte-identical output.
import type { Project } from "../model/schema.ts";
import type { ClearingTimeline, StudyResult } from "../study/types.ts";
import type { FaultTable } from "./faultTable.ts";

export type PageSize = "A4" | "Letter";

export interface ReportMeta {
  /** Report date as the host gives it, e.g. "2026-12-02" (never read from a clock here). */
  date: string;
  /** Islet version, from package.json. */
  version: string;
  /** Name of the project file the report was made from. */
  fileName: string;
  /** SHA-256 of the project file's bytes, 64 lowercase hex digits. */
  fileSha256: string;
}

export interface ReportInput {
  project: Project;
  study: StudyResult;
  faults: FaultTable;
  meta: ReportMeta;
  /** Validation warnings of the loaded file (loader's `warnings`). */
  validationWarnings: readonly string[];
  /** Clearing timelines computed for failed cases beyond the ones in `study.timelines`. */
  extraTimelines?: readonly ClearingTimeline[];
  pageSize?: PageSize;
  /** List every passed verdict in the HTML (default: summarised; verdicts.csv always has them all). */
  listPasses?: boolean;
}

export interface ReportPlot {
  /** File name inside the plots folder, without extension, e.g. "oneline" or "path-03". */
  name: string;
  title: string;
  svg: string;
}

export interface ReportOutput {
  html: string;
  faultsCsv: string;
  settingsCsv: string;
  /** Every verdict, passed ones included. */
  verdictsCsv: string;
  plots: ReportPlot[];
}
