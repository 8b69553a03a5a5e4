// The Report command on the demo: runs the study when none is current, downloads the HTML report
// with its cover, the project's name, the file's SHA-256 and the caution, and renders it.
import { strict as assert } from "node:assert";
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { openStudio } from "../lib/studio.mjs";

export const viewport = { width: 1366, height: 768 };

const CAUTION = "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";

export const steps = [
  {
    name: "saves the demo's report as HTML, running the study first",
    async run(t) {
      const { page, problems } = await openStudio(t.context, t.url, "");
      t.state.page = page;
      await page.waitForFunction(() => document.querySelectorAll(".react-flow__node").length > 30);
      const download = page.waitForEvent("download", { timeout: 300000 });
      await page.getByTestId("report").click();
      const file = await download;
      assert.match(file.suggestedFilename(), /-report\.html$/);
      const path = join(t.artifacts, "40-report.html");
      await file.saveAs(path);
      const html = await readFile(path, "utf8");
      assert.match(html, /<section class="cover" id="cover">/);
      assert.match(html, /<h1>[^<]*dairy[^<]*<\/h1>/i, "the cover names the project");
      assert.ok(html.includes(CAUTION.replace(/'/g, "&#39;")) || html.includes(CAUTION), "the report carries the caution");
      assert.match(html, /class="hash">[0-9a-f]{64}</, "the cover shows a SHA-256");
      await page.getByText(/Report saved/).waitFor({ timeout: 30000 });
      assert.deepEqual(problems, []);
      t.state.reportPath = path;
    },
  },
  {
    name: "renders the saved report",
    async run(t) {
      const view = await t.context.newPage();
      await view.setContent(await readFile(t.state.reportPath, "utf8"), { waitUntil: "load" });
      await view.screenshot({ path: join(t.artifacts, "40-report-cover.png") });
      assert.equal(await view.locator("#cover h1").count(), 1);
      await view.close();
    },
  },
];
