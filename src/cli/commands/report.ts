// `islet report FILE --out DIR [--format html,pdf,csv,svg,png] [--page A4|Letter] [--date YYYY-MM-DD]`:
// runs the study and writes the report: report.html, report.pdf, faults.csv, settings.csv, verdicts.csv, plots/*.svg|png.
// Exit 0 when written, 2 on a bad file (with the loader's messages), bad options or a missing browser.
// PDF and PNG are printed by headless Chromium at /usr/bin/chromium through playwright-core.
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { basename, join } from "node:path";
import type { CliCommand } from "../command.ts";
// bundled into the packaged CLI, so the version travels with it
import packageJson from "../../../package.json" with { type: "json" };
import { loadProject } from "../../model/projectFile.ts";
import { studyProject } from "../../study/studyProject.ts";
import type { ClearingTimeline } from "../../study/types.ts";
import { buildReport, faultTable, failureTimelineCases, printReportPdf, REPORT_CAUTION, type PageSize, type PdfPrinter } from "../../report/index.ts";

const USAGE = "Usage: islet report FILE --out DIR [--format html,pdf,csv,svg,png] [--page A4|Letter] [--date YYYY-MM-DD] [--all-passes]";
const FORMATS = ["html", "pdf", "csv", "svg", "png"] as const;
type Format = (typeof FORMATS)[number];
export const CHROMIUM_PATH = "/usr/bin/chromium";
const CHROMIUM_ARGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

export interface ReportArgs {
  file: string;
  out: string;
  formats: Set<Format>;
  page: PageSize;
  date: string | null;
  allPasses: boolean;
}

export function parseReportArgs(args: readonly string[]): { ok: true; value: ReportArgs } | { ok: false; message: string } {
  const files: string[] = [];
  let out: string | null = null;
  let formats = new Set<Format>(["html", "csv", "svg"]);
  let page: PageSize = "A4";
  let date: string | null = null;
  let allPasses = false;
  for (let k = 0; k < args.length; k++) {
    const a = args[k];
    if (a === "--out" || a === "--format" || a === "--page" || a === "--date") {
      const v = args[k + 1];
      if (v === undefined || v.startsWith("--")) return { ok: false, message: `option ${a} needs a value` };
      k++;
      if (a === "--out") out = v;
      else if (a === "--format") {
        const list = v.split(",").map((x) => x.trim().toLowerCase()).filter(Boolean);
        const bad = list.filter((x) => !(FORMATS as readonly string[]).includes(x));
        if (bad.length || !list.length) return { ok: false, message: `--format takes a comma-separated list of ${FORMATS.join(", ")} (got ${v})` };
        formats = new Set(list as Format[]);
      } else if (a === "--page") {
        if (v !== "A4" && v !== "Letter") return { ok: false, message: `--page must be A4 or Letter (got ${v})` };
        page = v;
      } else {
        if (!/^\d{4}-\d{2}-\d{2}$/.test(v)) return { ok: false, message: `--date must be YYYY-MM-DD (got ${v})` };
        date = v;
      }
    } else if (a === "--all-passes") allPasses = true;
    else if (a.startsWith("--")) return { ok: false, message: `unknown option ${a}` };
    else files.push(a);
  }
  if (files.length !== 1) return { ok: false, message: files.length === 0 ? "missing FILE" : `expected one FILE, got ${files.length}` };
  if (out === null) return { ok: false, message: "missing --out DIR" };
  return { ok: true, value: { file: files[0], out, formats, page, date, allPasses } };
}

/** Timelines of the worst failed bus faults, each from a narrow study of that one case. */
async function failureTimelines(project: Parameters<typeof studyProject>[0], study: Awaited<ReturnType<typeof studyProject>>): Promise<ClearingTimeline[]> {
  const out: ClearingTimeline[] = [];
  for (const req of failureTimelineCases(study)) {
    const one = await studyProject(project, { scenarios: [req.scenario], buses: [req.bus], faultTypes: [req.faultType], limits: [req.limit], linePoints: false, timelineCases: [req.caseId] });
    const t = one.timelines.find((x) => x.caseId === req.caseId);
    if (t) out.push(t);
  }
  return out;
}

export const reportCommand: CliCommand = {
  name: "report",
  summary: "run the study and write the report (HTML, PDF, CSV, SVG/PNG plots) into --out DIR",
  async run(args) {
    const parsed = parseReportArgs(args);
    if (!parsed.ok) {
      console.error(`islet report: ${parsed.message}\n${USAGE}`);
      return 2;
    }
    const { file, out, formats, page } = parsed.value;
    let bytes: Buffer;
    try {
      bytes = readFileSync(file);
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      console.error(`islet report: cannot read ${file}: ${code === "ENOENT" ? "no such file" : code === "EISDIR" ? "is a folder, not a file" : (err as Error).message}`);
      return 2;
    }
    const loaded = loadProject(bytes.toString("utf8"));
    if (!loaded.ok) {
      console.error(`${file}: not a valid Islet project (${loaded.error.kind}); no report written:`);
      for (const m of loaded.error.messages) console.error(`  error: ${m}`);
      return 2;
    }
    const needsBrowser = formats.has("pdf") || formats.has("png");
    if (needsBrowser && !existsSync(CHROMIUM_PATH)) {
      console.error(`islet report: PDF and PNG need Chromium at ${CHROMIUM_PATH} (install the Debian package "chromium"); use --format html,csv,svg without it`);
      return 2;
    }
    console.log(REPORT_CAUTION);
    const project = loaded.project;
    const study = await studyProject(project);
    const extra = await failureTimelines(project, study);
    const report = buildReport({
      project,
      study,
      faults: faultTable(project),
      meta: {
        date: parsed.value.date ?? new Date().toISOString().slice(0, 10),
        version: packageJson.version,
        fileName: basename(file),
        fileSha256: createHash("sha256").update(bytes).digest("hex"),
      },
      validationWarnings: loaded.warnings,
      extraTimelines: extra,
      pageSize: page,
      listPasses: parsed.value.allPasses,
    });

    mkdirSync(out, { recursive: true });
    const written: string[] = [];
    const write = (name: string, data: string | Uint8Array) => {
      const path = join(out, name);
      writeFileSync(path, data);
      written.push(path);
    };
    if (formats.has("html")) write("report.html", report.html);
    if (formats.has("csv")) {
      write("faults.csv", report.faultsCsv);
      write("settings.csv", report.settingsCsv);
      write("verdicts.csv", report.verdictsCsv);
    }
    if (formats.has("svg") || formats.has("png")) mkdirSync(join(out, "plots"), { recursive: true });
    if (formats.has("svg")) for (const p of report.plots) write(join("plots", `${p.name}.svg`), p.svg);
    if (needsBrowser) {
      // loaded at run time from node_modules (never bundled): it finds its own files next to it
      const moduleName = "playwright-core";
      const { chromium } = (await import(moduleName)) as typeof import("playwright-core");
      const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS });
      try {
        if (formats.has("pdf")) {
          const printer: PdfPrinter = async (html, options) => {
            const pg = await browser.newPage();
            try {
              await pg.setContent(html, { waitUntil: "load" });
              return await pg.pdf(options);
            } finally {
              await pg.close();
            }
          };
          write("report.pdf", await printReportPdf(report.html, printer));
        }
        if (formats.has("png")) {
          const pg = await browser.newPage({ deviceScaleFactor: 2 });
          try {
            for (const p of report.plots) {
              await pg.setContent(`<!doctype html><html><body style="margin:0;background:#fff">${p.svg}</body></html>`);
              write(join("plots", `${p.name}.png`), await pg.locator("svg").first().screenshot({ type: "png" }));
            }
          } finally {
            await pg.close();
          }
        }
      } finally {
        await browser.close();
      }
    }
    const fails = study.verdicts.filter((v) => v.status === "fail").length;
    const warns = study.verdicts.filter((v) => v.status === "warn").length;
    console.log(`${project.meta.name}: ${study.cases.length} fault cases, ${fails} failed and ${warns} warned verdicts; wrote ${written.length} file(s) to ${out}`);
    const plots = written.filter((w) => w.startsWith(join(out, "plots")));
    for (const w of written) if (!plots.includes(w)) console.log(`  ${w}`);
    if (plots.length) console.log(`  ${join(out, "plots")}: ${plots.length} plot file(s) (${report.plots.map((p) => p.name).slice(0, 3).join(", ")}${report.plots.length > 3 ? ", ..." : ""})`);
    console.log(REPORT_CAUTION);
    return 0;
  },
};
