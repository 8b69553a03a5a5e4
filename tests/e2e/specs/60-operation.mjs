// The operation pane on the demo: after the study, a case chosen in the verdict matrix shows what was
// expected to open beside what the simulation opened, in order; clicking a step selects its device.
import { strict as assert } from "node:assert";
import { join } from "node:path";
import { openStudio } from "../lib/studio.mjs";

export const viewport = { width: 1366, height: 768 };

export const steps = [
  {
    name: "shows a case's expected isolation and what opened, in order, and selects a step's device",
    async run(t) {
      const { page } = await openStudio(t.context, t.url, "");
      t.state.page = page;
      await page.waitForFunction(() => document.querySelectorAll(".react-flow__node").length > 30);
      await page.getByTestId("study-run").click();
      await page.getByText(/Study finished/).waitFor({ timeout: 240000 });
      await page.getByTestId("tab-verdicts").click();
      // the first failing cell of the matrix
      const cell = page.locator("button.verdict-cell.is-fail").first();
      await cell.waitFor();
      await cell.click();
      await page.getByTestId("tab-chain").click();
      const summary = page.getByTestId("operation-summary");
      await summary.waitFor({ timeout: 30000 });
      assert.match(await summary.textContent(), /^(Isolated at [\d.]+ m?s; \d+ kW lost \(expected isolation: \d+ kW\)|Not isolated)/);
      const expectedRows = page.locator(".chain-step");
      assert.ok((await expectedRows.count()) > 0, "the expected devices are listed");
      const opSteps = page.locator(".operation-step");
      if ((await opSteps.count()) > 0) {
        const first = opSteps.first();
        const name = (await first.locator("td").nth(1).textContent()).trim();
        await first.click();
        await page.waitForFunction((n) => document.querySelector('[data-testid="inspector-head"]')?.textContent?.includes(n), name);
        await page.locator(".operation-step.is-current").first().waitFor();
      }
      await page.screenshot({ path: join(t.artifacts, "60-operation.png") });
    },
  },
  {
    name: "walks the expected devices with the arrow keys after one click on the pane, the canvas marking each step's device",
    async run(t) {
      const page = t.state.page;
      // a case with a backup: the first row of the verdict matrix's failing cells whose pane lists two steps or more
      await page.getByTestId("tab-verdicts").click();
      const cells = page.locator("button.verdict-cell.is-fail");
      const n = await cells.count();
      let found = false;
      for (let k = 0; k < n && !found; k++) {
        await page.getByTestId("tab-verdicts").click();
        await cells.nth(k).click();
        await page.getByTestId("tab-chain").click();
        await page.locator(".chain-pane .ap-title").waitFor();
        await page.waitForFunction(() => document.querySelector('[data-testid="operation-summary"]') || document.querySelector(".chain-pane .ap-empty"));
        found = (await page.locator(".chain-step").count()) >= 2;
      }
      assert.ok(found, "a failing case with a backup step");
      // one click on the pane's title, then the keys
      await page.locator(".chain-pane .ap-title").click();
      await page.waitForFunction(() => document.activeElement?.classList.contains("chain-body"));
      const before = (await page.locator(".chain-step.is-current").textContent()) ?? "";
      await page.keyboard.press("ArrowDown");
      await page.waitForFunction((b) => (document.querySelector(".chain-step.is-current")?.textContent ?? "") !== b, before);
      const current = (await page.locator(".chain-step.is-current").textContent()) ?? "";
      assert.match(current, /backup/);
      // the step's device is marked on the one-line
      await page.locator(".react-flow .device.is-selected").first().waitFor();
      await page.screenshot({ path: join(t.artifacts, "60-operation-step.png") });
    },
  },
];
