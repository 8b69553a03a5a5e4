// `islet report` run as a user runs it: src/cli/islet.mjs in a child process.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { parseReportArgs } from "../../../src/cli/commands/report.ts";

const root = fileURLToPath(new URL("../../../", import.meta.url));
const demoPath = join(root, "assets/demo/dairy-coop.islet");
const CAUTION = "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";
const hasChromium = existsSync("/usr/bin/chromium");

let dir = "";

function islet(...args: string[]) {
  const r = spawnSync(process.execPath, [join(root, "src/cli/islet.mjs"), ...args], { cwd: root, encoding: "utf8", timeout: 300_000 });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "islet-report-"));
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

describe("islet report options", () => {
  it("defaults to html, csv and svg on A4", () => {
    const r = parseReportArgs(["p.islet", "--out", "x"]);
    expect(r.ok && [...r.value.formats].sort()).toEqual(["csv", "html", "svg"]);
    expect(r.ok && r.value.page).toBe("A4");
  });
  it("refuses a missing --out, an unknown format and a malformed date", () => {
    expect(parseReportArgs(["p.islet"])).toEqual({ ok: false, message: "missing --out DIR" });
    expect(parseReportArgs(["p.islet", "--out", "x", "--format", "html,docx"])).toMatchObject({ ok: false, message: expect.stringContaining("docx") });
    expect(parseReportArgs(["p.islet", "--out", "x", "--date", "2 Jan"])).toMatchObject({ ok: false, message: expect.stringContaining("YYYY-MM-DD") });
  });
});

describe("islet report", () => {
  it("exits 2 on a bad file with the loader's messages and writes nothing", () => {
    const doc = JSON.parse(readFileSync(demoPath, "utf8"));
    doc.elements.find((e: { id: string }) => e.id === "C-MS").length_km = -3;
    const bad = join(dir, "bad.islet");
    writeFileSync(bad, JSON.stringify(doc));
    const out = join(dir, "bad-out");
    const r = islet("report", bad, "--out", out);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/C-MS/);
    expect(r.err).toMatch(/length_km/);
    expect(existsSync(out)).toBe(false);
  });

  it("writes the default formats, prints the caution, and gives byte-identical files on a second run", () => {
    const a = join(dir, "a");
    const b = join(dir, "b");
    const r1 = islet("report", demoPath, "--out", a, "--date", "2026-03-04");
    expect(r1.code, r1.err).toBe(0);
    expect(r1.out).toContain(CAUTION);
    const r2 = islet("report", demoPath, "--out", b, "--date", "2026-03-04");
    expect(r2.code, r2.err).toBe(0);
    const files = ["report.html", "faults.csv", "settings.csv", "verdicts.csv", ...readdirSync(join(a, "plots")).map((f) => join("plots", f))];
    expect(files).toContain(join("plots", "oneline.svg"));
    for (const f of files) expect(readFileSync(join(b, f)).equals(readFileSync(join(a, f))), f).toBe(true);
    // the cover carries the file's SHA-256 (node:crypto here, as an independent computation of the same hash)
    const sha = createHash("sha256").update(readFileSync(demoPath)).digest("hex");
    expect(readFileSync(join(a, "report.html"), "utf8")).toContain(sha);
    const version = JSON.parse(readFileSync(join(root, "package.json"), "utf8")).version;
    expect(readFileSync(join(a, "report.html"), "utf8")).toContain(`<dt>Islet version</dt><dd>${version}</dd>`);
    expect(readFileSync(join(a, "report.html"), "utf8")).toContain("<dt>Report date</dt><dd>2026-03-04</dd>");
    expect(readFileSync(join(a, "faults.csv"), "utf8").split("\r\n")[0]).toBe("scenario_id,scenario_name,limit,bus_id,bus_name,un_kV,ikss_3ph_kA,ikss_LL_kA,ikss_LG_kA,ikss_LLG_kA,ip_3ph_kA,xr_3ph");
  }, 600_000);

  it.skipIf(!hasChromium)("prints a PDF and PNG plots with headless Chromium, and the PDF renders to non-trivial pages (skipped only when /usr/bin/chromium is not installed)", () => {
    const out = join(dir, "pdf");
    const r = islet("report", demoPath, "--out", out, "--format", "pdf,png", "--date", "2026-03-04");
    expect(r.code, r.err).toBe(0);
    const pdf = readFileSync(join(out, "report.pdf"));
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const pngs = readdirSync(join(out, "plots")).filter((f) => f.endsWith(".png"));
    expect(pngs).toContain("oneline.png");
    const render = spawnSync("pdftoppm", ["-png", "-r", "60", "-f", "1", "-l", "2", join(out, "report.pdf"), join(out, "page")], { encoding: "utf8" });
    expect(render.status, render.stderr).toBe(0);
    const pages = readdirSync(out).filter((f) => /^page-\d+\.png$/.test(f));
    expect(pages).toHaveLength(2);
    for (const p of pages) {
      const png = readFileSync(join(out, p));
      expect(png.subarray(1, 4).toString("latin1")).toBe("PNG");
      // an A4 page at 60 dpi with text compresses to well over a blank page's few hundred bytes
      expect(statSync(join(out, p)).size).toBeGreaterThan(8000);
    }
  }, 600_000);
});
