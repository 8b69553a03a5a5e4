// The studio on the demo project: opens by default with the caution, looks as the reference images
// (light and dark), runs the full study with progress and cancel, edits with the keyboard and on
// several elements at once, and faults a point along a cable.
import { strict as assert } from "node:assert";
import { copyFile, mkdir } from "node:fs/promises";
import { existsSync } from "node:fs";
import { join } from "node:path";
import { openStudio, select, setField, faultLabel_kA, elementCount } from "../lib/studio.mjs";
import { pixelDifference } from "../lib/imageCompare.mjs";

export const viewport = { width: 1366, height: 768 };

const CAUTION = "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";
/** Share of pixels allowed to differ from a reference image (font hinting, anti-aliasing). */
const MAX_DIFF_RATIO = 0.02;

/** Saves a screenshot and compares it with tests/e2e/reference/<name>.png (ISLET_UPDATE_REFERENCE=1 rewrites it). */
async function matchesReference(t, page, name) {
  const shot = join(t.artifacts, `${name}.png`);
  await page.mouse.move(0, 0);
  // hover styles fade out: wait until no CSS transition or finite animation is still running
  await page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== "running" || a.effect?.getTiming().iterations === Infinity), null, { timeout: 10000 });
  await page.screenshot({ path: shot });
  const ref = join(t.here, "reference", `${name}.png`);
  if (process.env.ISLET_UPDATE_REFERENCE === "1" || !existsSync(ref)) {
    await mkdir(join(t.here, "reference"), { recursive: true });
    await copyFile(shot, ref);
    console.log(`      reference ${name}.png written`);
    return;
  }
  const diff = await pixelDifference(t.context, shot, ref);
  console.log(`      ${name}: ${(diff.ratio * 100).toFixed(2)} % of pixels differ from the reference`);
  assert.ok(diff.sameSize, `${name}: same size as the reference`);
  assert.ok(diff.ratio <= MAX_DIFF_RATIO, `${name}: ${(diff.ratio * 100).toFixed(2)} % of pixels differ (limit ${MAX_DIFF_RATIO * 100} %)`);
}

export const steps = [
  {
    name: "opens on the demo by default with the caution in the status area",
    async run(t) {
      const { page, problems } = await openStudio(t.context, t.url, "");
      t.state.page = page;
      t.state.problems = problems;
      await page.waitForFunction(() => document.querySelectorAll(".react-flow__node").length > 30);
      assert.equal(await page.getByTestId("caution").textContent(), CAUTION);
      assert.match(await page.getByTestId("doc-state").textContent(), /dairy/i);
      assert.equal(await page.getByTestId("dirty-mark").count(), 0, "the demo opens clean");
      await matchesReference(t, page, "demo-light-1366");
    },
  },
  {
    name: "switches to the dark theme",
    async run(t) {
      const page = t.state.page;
      await page.getByRole("button", { name: "Switch theme" }).click();
      assert.equal(await page.evaluate(() => document.documentElement.dataset.theme), "dark");
      await matchesReference(t, page, "demo-dark-1366");
      await page.getByRole("button", { name: "Switch theme" }).click();
    },
  },
  {
    name: "shows the full study's progress and cancels it",
    async run(t) {
      const page = t.state.page;
      await page.getByTestId("study-run").click();
      await page.getByTestId("study-progress").waitFor();
      await page.waitForFunction(() => /\d+\/\d+/.test(document.querySelector('[data-testid="study-progress"]')?.textContent ?? ""), null, { timeout: 30000 });
      await page.screenshot({ path: join(t.artifacts, "20-study-progress.png") });
      await page.getByTestId("study-cancel").click();
      await page.getByText("Study cancelled.").waitFor({ timeout: 30000 });
      assert.equal(await page.getByTestId("study-progress").count(), 0);
    },
  },
  {
    name: "runs the full study and fills the verdict matrix",
    async run(t) {
      const page = t.state.page;
      await page.getByTestId("study-run").click();
      await page.getByText(/Study finished/).waitFor({ timeout: 240000 });
      await page.getByTestId("tab-verdicts").click();
      const rows = page.locator(".verdict-scroll [role=row]");
      await rows.first().waitFor();
      assert.ok((await rows.count()) > 3, "the matrix has rows");
      await page.screenshot({ path: join(t.artifacts, "20-verdicts.png") });
    },
  },
  {
    name: "copies, pastes, deletes and undoes with the keyboard",
    async run(t) {
      const page = t.state.page;
      const before = await elementCount(page);
      await select(page, "LV-MS");
      await page.keyboard.press("Control+c");
      await page.keyboard.press("Control+v");
      await page.waitForFunction((n) => document.querySelectorAll(".react-flow__node").length === n + 1, before);
      await page.keyboard.press("Delete");
      await page.waitForFunction((n) => document.querySelectorAll(".react-flow__node").length === n, before);
      await page.keyboard.press("Control+z");
      await page.waitForFunction((n) => document.querySelectorAll(".react-flow__node").length === n + 1, before);
      await page.keyboard.press("Control+z");
      await page.waitForFunction((n) => document.querySelectorAll(".react-flow__node").length === n, before);
    },
  },
  {
    name: "aligns two buses on the first one's left edge",
    async run(t) {
      const page = t.state.page;
      await select(page, "LV-MS");
      await page.locator('[data-element="LV-PH"] .bus-bar').click({ modifiers: ["Shift"], force: true });
      await page.waitForFunction(() => document.querySelector('[data-testid="inspector-head"]')?.textContent?.startsWith("2 elements"));
      await page.getByText("Align", { exact: true }).click();
      await page.getByRole("button", { name: "Left edges" }).click();
      const left = async (id) => (await page.locator(`[data-element="${id}"] .bus-bar`).boundingBox()).x;
      await page.waitForFunction(() => {
        const a = document.querySelector('[data-element="LV-MS"] .bus-bar')?.getBoundingClientRect().x;
        const b = document.querySelector('[data-element="LV-PH"] .bus-bar')?.getBoundingClientRect().x;
        return a !== undefined && Math.abs(a - b) < 0.5;
      });
      assert.ok(Math.abs((await left("LV-MS")) - (await left("LV-PH"))) < 0.5);
      await page.keyboard.press("Control+z");
      await page.waitForFunction(() => {
        const a = document.querySelector('[data-element="LV-MS"] .bus-bar')?.getBoundingClientRect().x;
        const b = document.querySelector('[data-element="LV-PH"] .bus-bar')?.getBoundingClientRect().x;
        return Math.abs(a - b) > 10;
      });
    },
  },
  {
    name: "edits two loads at once through their shared fields",
    async run(t) {
      const page = t.state.page;
      await select(page, "L-MS");
      await page.locator('[data-element="L-PH"] svg').click({ modifiers: ["Shift"], force: true });
      await page.waitForFunction(() => document.querySelector('[data-testid="inspector-head"]')?.textContent?.startsWith("2 elements"));
      await setField(page, "Active power", 123);
      for (const id of ["L-MS", "L-PH"]) assert.match(await page.locator(`[data-element="${id}"] .caption-detail`).textContent(), /^123 kW/);
      await page.evaluate(() => document.activeElement?.blur()); // Ctrl+Z inside a field is the field's own undo
      await page.keyboard.press("Control+z");
      assert.doesNotMatch(await page.locator('[data-element="L-MS"] .caption-detail').textContent(), /^123 kW/, "one undo step reverts both");
    },
  },
  {
    name: "faults a point along a cable",
    async run(t) {
      const page = t.state.page;
      await select(page, "C-MS");
      await page.keyboard.press("f");
      const at50 = await faultLabel_kA(page);
      assert.ok(at50 > 0, "a current is shown at the cable");
      await page.screenshot({ path: join(t.artifacts, "20-cable-fault.png") });
      await page.getByLabel("Fault position along the line").fill("90");
      await page.waitForFunction((before) => {
        const m = /([0-9.]+)\s*kA/.exec(document.querySelector('[data-testid="fault-ikss"]')?.textContent ?? "");
        return m !== null && Number(m[1]) !== before;
      }, at50);
      const at90 = await faultLabel_kA(page);
      // further along a radial cable from the source, more cable impedance is in series: less current
      assert.ok(at90 < at50, `I"k at 90 % (${at90} kA) is below I"k at 50 % (${at50} kA)`);
      await page.evaluate(() => document.activeElement?.blur()); // Esc inside a field belongs to the field
      await page.keyboard.press("Escape");
      await page.locator('[data-testid="fault-ikss"]').waitFor({ state: "detached" });
    },
  },
  {
    name: "faults a bus with a double click",
    async run(t) {
      const page = t.state.page;
      await page.locator('[data-element="LV-B"] .bus-bar').dblclick({ force: true });
      await page.locator('[data-element="LV-B"] [data-testid="fault-ikss"]').waitFor();
      assert.ok((await faultLabel_kA(page)) > 0);
      assert.deepEqual(t.state.problems, [], "no page errors");
    },
  },
];
