// Public API of the study report (pure: strings in, strings out; the host writes files and prints PDF).
export { buildReport } from "./buildReport.ts";
export type { ReportInput, ReportOutput, ReportMeta, ReportPlot, PageSize } from "./reportTypes.ts";
export { faultTable } from "./faultTable.ts";
export type { FaultRow, FaultTable } from "./faultTable.ts";
export { settingsTable } from "./settingsTable.ts";
export type { SettingsRow } from "./settingsTable.ts";
export { faultsCsv, FAULTS_CSV_HEADER } from "./faultsCsv.ts";
export { settingsCsv, SETTINGS_CSV_HEADER } from "./settingsCsv.ts";
export { verdictsCsv, VERDICTS_CSV_HEADER } from "./verdictsCsv.ts";
export { csvTable } from "./csvTable.ts";
export { oneLineSvg } from "./oneLineSvg.ts";
export { tccPlotSvg } from "./tccPlotSvg.ts";
export { protectionPaths } from "./protectionPaths.ts";
export type { ProtectionPath } from "./protectionPaths.ts";
export { failureTimelineCases } from "./failureTimelineCases.ts";
export { printReportPdf, REPORT_PDF_OPTIONS } from "./printReportPdf.ts";
export type { PdfPrinter, PdfPrintOptions } from "./printReportPdf.ts";
export { REPORT_CAUTION } from "./reportCaution.ts";
