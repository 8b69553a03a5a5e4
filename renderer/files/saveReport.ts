// The Report command: runs the full study when there is none for this revision, then saves the
// HTML report and, on the desktop, the printed PDF. Failures are told to the user; the document is untouched.
import packageJson from "../../package.json" with { type: "json" };
import { REPORT_CAUTION } from "../../src/report/reportCaution.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { useStudyStore } from "../fault/studyStore.ts";
import { failureTimelines, runFullStudy } from "../fault/studyCommands.ts";
import { currentHost } from "../host/currentHost.ts";
import { reportCommand } from "./reportCommand.ts";
import { isDirty } from "./fileCommands.ts";

function message(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

export async function saveReport(): Promise<void> {
  const session = useSessionStore.getState();
  if (useStudyStore.getState().running) {
    session.notify("info", "A study is running: make the report when it has finished.");
    return;
  }
  const fresh = () => {
    const s = useStudyStore.getState();
    return s.full !== null && s.fullRevision === useDocumentStore.getState().revision ? s.full : null;
  };
  if (!fresh()) await runFullStudy();
  const study = fresh();
  if (!study) {
    session.notify("error", "No report: the full study has not finished for the current project. Run the study, then choose Report again.");
    return;
  }
  const host = currentHost();
  try {
    const project = useDocumentStore.getState().doc;
    const extraTimelines = await failureTimelines(project, study);
    const report = await reportCommand({
      project,
      study,
      extraTimelines,
      fileName: useSessionStore.getState().file?.name ?? null,
      dirty: isDirty(),
      date: new Date().toISOString().slice(0, 10),
      version: packageJson.version,
    });
    const savedHtml = await host.exportFile(report.htmlName, report.html, "text/html");
    let savedPdf = false;
    if (host.exportReportPdf) savedPdf = await host.exportReportPdf(report.pdfName, report.html);
    if (savedHtml || savedPdf) session.notify("info", `Report saved${savedHtml && savedPdf ? " (HTML and PDF)" : savedPdf ? " (PDF)" : ""}.`, [REPORT_CAUTION]);
  } catch (err) {
    session.notify("error", `The report could not be saved: ${message(err)}`);
  }
}
