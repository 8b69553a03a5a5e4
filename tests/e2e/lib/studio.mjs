// Helpers for driving the studio in specs: open it, place parts, select, edit fields, fault.
import { strict as assert } from "node:assert";

export async function openStudio(context, url, query = "?empty=1") {
  const page = await context.newPage();
  const problems = [];
  page.on("pageerror", (e) => problems.push(`page error: ${e.message}`));
  await page.goto(url + query);
  await page.waitForSelector("html[data-ready='1']", { timeout: 30000 });
  return { page, problems };
}

/** Drags a part from the palette onto the one-line at (x, y) pixels inside the canvas. */
export async function placePart(page, kind, x, y) {
  const canvas = page.locator(".canvas-wrap .react-flow__pane");
  const before = await page.locator(".react-flow__node").count();
  await page.locator(`.palette-item[data-kind="${kind}"]`).dragTo(canvas, { targetPosition: { x, y } });
  await page.waitForFunction((n) => document.querySelectorAll(".react-flow__node").length === n + 1, before);
}

export async function select(page, id) {
  const node = page.locator(`[data-element="${id}"]`);
  const bar = node.locator(".bus-bar");
  if ((await bar.count()) > 0) await bar.click({ force: true });
  else await node.locator("svg").click({ force: true });
  await page.waitForFunction((want) => document.querySelector('[data-testid="inspector-head"]')?.textContent?.includes(want), id);
}

/** Types a value into the inspector field with this label and commits it with Enter. */
export async function setField(page, label, value) {
  const input = page.getByLabel(label, { exact: true });
  await input.fill(String(value));
  await input.press("Enter");
}

export async function chooseField(page, label, value) {
  await page.getByLabel(label, { exact: true }).selectOption(String(value));
}

/** Drags from an element's terminal handle onto a bus bar (a connection made with the mouse). */
export async function connectByMouse(page, elementId, handle, busId) {
  const from = await page.locator(`[data-element="${elementId}"] .react-flow__handle[data-handleid="${handle}"]`).boundingBox();
  const to = await page.locator(`[data-element="${busId}"] .bus-bar`).boundingBox();
  assert.ok(from && to, "handle and bus are on screen");
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
  await page.mouse.down();
  await page.mouse.move(from.x + 20, from.y + 20, { steps: 4 });
  await page.mouse.move(to.x + to.width / 2, to.y + to.height / 2, { steps: 8 });
  await page.mouse.up();
}

export async function faultLabel_kA(page) {
  const badge = page.locator('[data-testid="fault-ikss"]');
  await badge.waitFor({ timeout: 15000 });
  const text = await badge.textContent();
  const m = /([0-9.]+)\s*kA/.exec(text ?? "");
  assert.ok(m, `fault label shows a current in kA (got "${text}")`);
  return Number(m[1]);
}

export async function elementCount(page) {
  return page.locator(".react-flow__node").count();
}
