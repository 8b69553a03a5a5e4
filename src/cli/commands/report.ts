// `islet report FILE --out DIR [--format html,pdf,csv,svg,png] [--page A4|Letter] [--date YYYY-MM-DD] [--quiet]`:
// runs the study and writes the report: report.html, report.pdf, faults.csv, settings.csv, verdicts.csv, plots/*.svg|png.
// Exit 0 when written, 2 on a bad file (with the loader's messages), bad options or a missing browser, 130 when
// stopped by Ctrl+C (then nothing of this run is left in DIR: see stagedOutput.ts).
// PDF and PNG are printed by headless Chromium at /usr/bin/chromium through playwright-core.
import { createHash } from "node:crypto";
import { existsSync } from "node:fs";
import { basename, join } from "node:path";
import type { CliCommand } from "../command.ts";
// bundled into the packaged CLI, so the version travels with it
import packageJson from "../../../package.json" with { type: "json" };
import type { Project } from "../../model/schema.ts";
import type { ClearingTimeline, StudyResult } from "../../study/types.ts";
import { buildReport, faultTable, failureTimelineCases, printReportPdf, REPORT_CAUTION, type PageSize, type PdfPrinter, type ReportOutput } from "../../report/index.ts";
import { EXIT_INTERRUPTED, flag, oneFile, parseCommandArgs, QUIET_OPTION, text, type CommandSpec } from "../args.ts";
import { loadStep } from "../loadStep.ts";
import { runCommand, type CommandSession } from "../runCommand.ts";
import type { SessionOptions } from "../session.ts";
import { StagedOutput } from "../stagedOutput.ts";
import { refuseTooLarge, studyInSession } from "../studyRun.ts";
import { terminalField as f } from "../terminalText.ts";

const FORMATS = ["html", "pdf", "csv", "svg", "png"] as const;
type Format = (typeof FORMATS)[number];
export const CHROMIUM_PATH = "/usr/bin/chromium";
const CHROMIUM_ARGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

export const reportSpec: CommandSpec = {
  name: "report",
  summary: "run the study and write the report (HTML, PDF, CSV, SVG/PNG plots) into --out DIR",
  synopsis: "FILE --out DIR [--format html,pdf,csv,svg,png] [--page A4|Letter] [--date YYYY-MM-DD] [--all-passes] [--quiet]",
  about: [
    "Writes report.html, report.pdf, faults.csv, settings.csv, verdicts.csv and plots/ as --format asks.",
    "The files appear in DIR only when all of them are written: stopped by Ctrl+C, DIR is left as it was.",
    `PDF and PNG are printed by headless Chromium at ${CHROMIUM_PATH}.`,
  ],
  options: {
    out: { type: "string", value: "DIR", help: "the folder to write into (made if missing)" },
    format: { type: "string", value: "LIST", help: "comma-separated: html, pdf, csv, svg, png (default html,csv,svg)" },
    page: { type: "string", value: "SIZE", help: "A4 or Letter (default A4)" },
    date: { type: "string", value: "YYYY-MM-DD", help: "the report date (default today), e.g. for reproducible files" },
    "all-passes": { type: "boolean", help: "list every passing verdict too, not only their count" },
    quiet: QUIET_OPTION,
  },
  examples: [
    { command: "islet report site.islet --out report/", does: "HTML, CSV and SVG plots into report/" },
    { command: "islet report site.islet --out report/ --format pdf,png --page Letter", does: "a PDF on Letter pages and PNG plots" },
  ],
  exits: ["0  the report is written", "2  bad options, an invalid project or a missing browser (nothing written)", "130  stopped by Ctrl+C (nothing of this run left in DIR)"],
};

export interface ReportArgs {
  file: string;
  out: string;
  formats: Set<Format>;
  page: PageSize;
  date: string | null;
  allPasses: boolean;
  quiet: boolean;
}

export function parseReportArgs(args: readonly string[]): { ok: true; value: ReportArgs } | { ok: false; message: string } {
  const parsed = parseCommandArgs(reportSpec, args);
  if (!parsed.ok) return parsed;
  const v = parsed.values;
  let formats = new Set<Format>(["html", "csv", "svg"]);
  const formatText = text(v, "format");
  if (formatText !== undefined) {
    const list = formatText.split(",").map((x) => x.trim().toLowerCase()).filter(Boolean);
    const bad = list.filter((x) => !(FORMATS as readonly string[]).includes(x));
    if (bad.length || !list.length) return { ok: false, message: `--format takes a comma-separated list of ${FORMATS.join(", ")} (got ${formatText})` };
    formats = new Set(list as Format[]);
  }
  const page = text(v, "page") ?? "A4";
  if (page !== "A4" && page !== "Letter") return { ok: false, message: `--page must be A4 or Letter (got ${page})` };
  const date = text(v, "date") ?? null;
  if (date !== null && !/^\d{4}-\d{2}-\d{2}$/.test(date)) return { ok: false, message: `--date must be YYYY-MM-DD (got ${date})` };
  const file = oneFile(parsed.positionals);
  if (!file.ok) return file;
  const out = text(v, "out");
  if (out === undefined) return { ok: false, message: "missing --out DIR" };
  return { ok: true, value: { file: file.file, out, formats, page, date, allPasses: flag(v, "all-passes"), quiet: flag(v, "quiet") } };
}

/** Timelines of the worst failed bus faults, each from a narrow study of that one case; null at Ctrl+C. */
async function failureTimelines(session: CommandSession, project: Project, study: StudyResult): Promise<ClearingTimeline[] | null> {
  const out: ClearingTimeline[] = [];
  const wanted = failureTimelineCases(study);
  for (const [k, req] of wanted.entries()) {
    session.progress.update("timelines of failed faults", k, wanted.length);
    const one = await studyInSession(session, project, { scenarios: [req.scenario], buses: [req.bus], faultTypes: [req.faultType], limits: [req.limit], linePoints: false, timelineCases: [req.caseId] }, "timeline: ");
    if (!one) return null;
    const t = one.timelines.find((x) => x.caseId === req.caseId);
    if (t) out.push(t);
  }
  return out;
}

/** PDF and PNG through headless Chromium; Ctrl+C closes the browser, which ends whatever it was doing. */
async function printWithBrowser(session: CommandSession, report: ReportOutput, formats: Set<Format>, staged: StagedOutput): Promise<void> {
  // loaded at run time from node_modules (never bundled): it finds its own files next to it
  const moduleName = "playwright-core";
  const { chromium } = (await import(moduleName)) as typeof import("playwright-core");
  // the session answers Ctrl+C (playwright's own handler would end the process before the staging folder is removed)
  const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS, handleSIGINT: false });
  const closeOnAbort = () => void browser.close().catch(() => undefined);
  session.signal.addEventListener("abort", closeOnAbort);
  try {
    if (formats.has("pdf")) {
      session.progress.update("printing the PDF", 0, 0);
      const printer: PdfPrinter = async (html, options) => {
        const pg = await browser.newPage();
        try {
          await pg.setContent(html, { waitUntil: "load" });
          return await pg.pdf(options);
        } finally {
          await pg.close();
        }
      };
      staged.write("report.pdf", await printReportPdf(report.html, printer));
    }
    if (formats.has("png")) {
      const pg = await browser.newPage({ deviceScaleFactor: 2 });
      try {
        for (const [k, p] of report.plots.entries()) {
          if (session.signal.aborted) return;
          session.progress.update("PNG plots", k, report.plots.length);
          await pg.setContent(`<!doctype html><html><body style="margin:0;background:#fff">${p.svg}</body></html>`);
          staged.write(join("plots", `${p.name}.png`), await pg.locator("svg").first().screenshot({ type: "png" }));
        }
      } finally {
        await pg.close();
      }
    }
  } finally {
    session.signal.removeEventListener("abort", closeOnAbort);
    await browser.close().catch(() => undefined);
  }
}

/** The command with its session's options (tests pass a stand-in for Ctrl+C and for the terminal). */
export function runReport(args: readonly string[], options: SessionOptions = {}): Promise<number> {
  return runCommand(
    reportSpec,
    args,
    async (session) => {
      const parsed = parseReportArgs(args);
      if (!parsed.ok) return session.usage(parsed.message);
      const { file, out, formats, page } = parsed.value;
      const loaded = loadStep(session.out, "report", file, { json: false, invalidExit: 2, note: "no report written" });
      if (!loaded.ok) return loaded.code;
      const needsBrowser = formats.has("pdf") || formats.has("png");
      if (needsBrowser && !existsSync(CHROMIUM_PATH)) {
        session.out.error(`islet report: PDF and PNG need Chromium at ${CHROMIUM_PATH} (install the Debian package "chromium"); use --format html,csv,svg without it`);
        return 2;
      }
      session.interruptNote = `no report written; ${f(out)} is as it was`;
      session.out.print(REPORT_CAUTION);
      const project = loaded.project;
      const tooLarge = refuseTooLarge(session, project);
      if (tooLarge !== null) return tooLarge;
      const study = await studyInSession(session, project);
      if (!study) return EXIT_INTERRUPTED;
      const extra = await failureTimelines(session, project, study);
      if (!extra) return EXIT_INTERRUPTED;
      session.progress.update("composing the report", 0, 0);
      await session.yieldNow();
      if (session.signal.aborted) return EXIT_INTERRUPTED;
      const report = buildReport({
        project,
        study,
        faults: faultTable(project),
        meta: {
          date: parsed.value.date ?? new Date().toISOString().slice(0, 10),
          version: packageJson.version,
          fileName: basename(file),
          fileSha256: createHash("sha256").update(loaded.bytes).digest("hex"),
        },
        validationWarnings: loaded.warnings,
        extraTimelines: extra,
        pageSize: page,
        listPasses: parsed.value.allPasses,
      });
      if (session.signal.aborted) return EXIT_INTERRUPTED;

      const staged = new StagedOutput(out);
      const dropStop = session.onForcedStop(() => staged.discard());
      let written: string[];
      try {
        session.progress.update("writing files", 0, 0);
        if (formats.has("html")) staged.write("report.html", report.html);
        if (formats.has("csv")) {
          staged.write("faults.csv", report.faultsCsv);
          staged.write("settings.csv", report.settingsCsv);
          staged.write("verdicts.csv", report.verdictsCsv);
        }
        if (formats.has("svg")) for (const p of report.plots) staged.write(join("plots", `${p.name}.svg`), p.svg);
        if (needsBrowser) await printWithBrowser(session, report, formats, staged);
        if (session.signal.aborted) {
          staged.discard();
          return EXIT_INTERRUPTED;
        }
        written = staged.commit();
      } catch (err) {
        staged.discard();
        throw err;
      } finally {
        dropStop();
      }
      const fails = study.verdicts.filter((v) => v.status === "fail").length;
      const warns = study.verdicts.filter((v) => v.status === "warn").length;
      const lines = [`${f(project.meta.name)}: ${study.cases.length} fault cases, ${fails} failed and ${warns} warned verdicts; wrote ${written.length} file(s) to ${f(out)}`];
      const plots = written.filter((w) => w.startsWith(join(out, "plots")));
      for (const w of written) if (!plots.includes(w)) lines.push(`  ${f(w)}`);
      if (plots.length) lines.push(`  ${f(join(out, "plots"))}: ${plots.length} plot file(s) (${report.plots.map((p) => f(p.name)).slice(0, 3).join(", ")}${report.plots.length > 3 ? ", ..." : ""})`);
      lines.push(REPORT_CAUTION);
      session.out.print(lines.join("\n"));
      return 0;
    },
    options,
  );
}

export const reportCommand: CliCommand = {
  name: "report",
  summary: reportSpec.summary,
  spec: reportSpec,
  run: (args) => runReport(args),
};
