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
];
