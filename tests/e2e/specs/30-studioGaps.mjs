// Studio features no other spec covers: the layout at 1366x768 with the mini-map and both themes,
// the fault overlay following a cable edit (with its edit-to-overlay time), the time-current SVG
// and PNG exports with the caution, box selection and alignment, snap to grid as saved, a failed
// save that keeps the work, and reopening a file from the Recent list.
import { strict as assert } from "node:assert";
import { readFile, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { openStudio, placePart, select, setField, faultLabel_kA, elementCount } from "../lib/studio.mjs";

export const viewport = { width: 1366, height: 768 };

const CAUTION = "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";
/** The one-line's grid step in flow units (renderer/canvas/OneLineCanvas.tsx, GRID). */
const GRID_STEP = 10;

async function download(page, action) {
  const [dl] = await Promise.all([page.waitForEvent("download", { timeout: 15000 }), action()]);
  return dl;
}

/** Saves with the Save button and returns the saved project, parsed. (Ctrl+S right after a node
 * drag now and then ends in no download at all in headless Chromium; spec 10 covers Ctrl+S.) */
async function saveAndRead(t, page, fileName) {
  const dl = await download(page, () => page.getByRole("button", { name: "Save", exact: true }).click());
  const path = join(t.artifacts, fileName);
  await dl.saveAs(path);
  await page.getByTestId("dirty-mark").waitFor({ state: "detached" });
  return JSON.parse(await readFile(path, "utf8"));
}

/** Presses on a bus bar's middle and drags it by (dx, dy) screen pixels. */
async function dragBus(page, id, dx, dy) {
  const box = await page.locator(`[data-element="${id}"] .bus-bar`).boundingBox();
  assert.ok(box, `bus ${id} is on screen`);
  const x = box.x + box.width / 2;
  const y = box.y + box.height / 2;
  await page.mouse.move(x, y);
  await page.mouse.down();
  // the first move past the drag threshold only starts the drag (the flow library's threshold,
  // 1 px): keep it small so the node follows the pointer to within 2 px
  await page.mouse.move(x + 2, y + 1);
  await page.mouse.move(x + dx / 2, y + dy / 2, { steps: 5 });
  await page.mouse.move(x + dx, y + dy, { steps: 5 });
  await page.mouse.up();
  // the drop is one document edit: the unsaved marker shows it was taken
  await page.getByTestId("dirty-mark").waitFor({ timeout: 5000 });
}

const zoom = (page) => page.evaluate(() => Number(/scale\(([0-9.]+)\)/.exec(document.querySelector(".react-flow__viewport")?.style.transform ?? "")?.[1]));

/** Width and height of a PNG from its IHDR chunk (ISO/IEC 15948:2004, 11.2.2: big-endian at bytes 16 and 20). */
function pngSize(bytes) {
  assert.equal(bytes.subarray(1, 4).toString("latin1"), "PNG", "the file is a PNG");
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

export const steps = [
  {
    name: "fits the studio in 1366x768 with the caution and the mini-map",
    async run(t) {
      // diagnostics on: the status area then shows the edit-to-overlay time this spec reads
      const { page, problems } = await openStudio(t.context, t.url, "?diagnostics=1");
      t.state.page = page;
      t.state.problems = problems;
      // one handler for every dialog: a prompt gets the name the step asks for, a confirm is accepted
      page.on("dialog", (d) => void (d.type() === "prompt" ? d.accept(t.state.saveName ?? "project") : d.accept()));
      await page.waitForFunction(() => document.querySelectorAll(".react-flow__node").length > 30);
      assert.equal(await page.getByTestId("caution").textContent(), CAUTION, "the caution is in the status area");
      assert.ok(await page.getByTestId("caution").isVisible(), "and visible");
      assert.ok(await page.locator(".canvas-wrap .react-flow__minimap").isVisible(), "the mini-map is shown");
      assert.ok((await page.locator(".react-flow__minimap svg rect, .react-flow__minimap-node").count()) > 10, "the mini-map draws the nodes");
      const vw = viewport.width;
      const vh = viewport.height;
      for (const sel of [".toolbar", ".palette", ".canvas-wrap", ".bottom-panes", ".side", ".status-bar"]) {
        const box = await page.locator(sel).first().boundingBox();
        assert.ok(box, `${sel} is laid out`);
        assert.ok(box.width > 0 && box.height > 0, `${sel} has a size`);
        assert.ok(box.x >= 0 && box.y >= 0 && box.x + box.width <= vw + 0.5 && box.y + box.height <= vh + 0.5, `${sel} (${JSON.stringify(box)}) lies inside the ${vw}x${vh} viewport`);
      }
      const clipped = await page.evaluate(() =>
        [".toolbar", ".status-bar", ".tabs"].filter((sel) => {
          const e = document.querySelector(sel);
          return e.scrollWidth > e.clientWidth + 1;
        }),
      );
      assert.deepEqual(clipped, [], "the command bar, status area and tabs show all their content");
      const theme = await page.getByRole("button", { name: "Switch theme" }).boundingBox();
      assert.ok(theme.x + theme.width <= vw, "the last command of the bar is on screen");
      const canvas = await page.locator(".canvas-wrap").boundingBox();
      assert.ok(canvas.width >= 500 && canvas.height >= 250, `the one-line keeps a usable size (${canvas.width}x${canvas.height})`);
      const scroll = await page.evaluate(() => ({ w: document.documentElement.scrollWidth, h: document.documentElement.scrollHeight }));
      assert.ok(scroll.w <= vw && scroll.h <= vh, `the page itself does not scroll (${scroll.w}x${scroll.h})`);
      await page.screenshot({ path: join(t.artifacts, "30-01-layout-1366.png") });
    },
  },
  {
    name: "switches to the dark theme and back",
    async run(t) {
      const page = t.state.page;
      const background = () => page.evaluate(() => getComputedStyle(document.querySelector(".status-bar")).backgroundColor);
      const light = await background();
      await page.getByRole("button", { name: "Switch theme" }).click();
      assert.equal(await page.evaluate(() => document.documentElement.dataset.theme), "dark");
      assert.notEqual(await background(), light, "the dark theme repaints the status area");
      assert.ok(await page.locator(".react-flow__minimap").isVisible(), "the mini-map stays in the dark theme");
      await page.screenshot({ path: join(t.artifacts, "30-02-dark.png") });
      await page.getByRole("button", { name: "Switch theme" }).click();
      assert.equal(await page.evaluate(() => document.documentElement.dataset.theme), "light");
      assert.equal(await background(), light, "back to the light colours");
    },
  },
  {
    name: "updates the fault overlay after a cable edit and times it",
    async run(t) {
      const page = t.state.page;
      await select(page, "LV-MS");
      await page.keyboard.press("f");
      const label = page.locator('[data-element="LV-MS"] [data-testid="fault-ikss"]');
      await label.waitFor({ timeout: 15000 });
      const before = await faultLabel_kA(page);
      await select(page, "C-MS");
      const field = page.getByLabel("Route length", { exact: true });
      assert.equal(Number(await field.inputValue()), 0.12, "the demo's milking shed feeder is 0.12 km long");
      await page.evaluate(() => performance.clearMeasures());
      await setField(page, "Route length", 0.5);
      await page.waitForFunction((was) => {
        const m = /([0-9.]+)\s*kA/.exec(document.querySelector('[data-element="LV-MS"] [data-testid="fault-ikss"]')?.textContent ?? "");
        return m !== null && Number(m[1]) !== was;
      }, before, { timeout: 15000 });
      const after = await faultLabel_kA(page);
      // IEC 60909-0:2016, equation (29): I"k = c Un / (sqrt(3) Zk). The cable is in series between
      // every source and its far end, so a longer cable adds R'L l + jX'L l to Zk: less current.
      assert.ok(after < before, `I"k at the far end fell from ${before} kA to ${after} kA`);
      await page.waitForFunction(() => performance.getEntriesByType("measure").some((m) => m.name.startsWith("islet-overlay-")), null, { timeout: 10000 });
      const times = await page.evaluate(() => performance.getEntriesByType("measure").filter((m) => m.name.startsWith("islet-overlay-")).map((m) => m.duration));
      const shown = await page.getByTestId("overlay-time").textContent();
      console.log(`      edit-to-overlay: ${times.map((d) => d.toFixed(1)).join(", ")} ms (status area: ${shown.trim()})`);
      assert.ok(times.every((d) => d > 0), "the studio measured the edit-to-overlay time");
      assert.match(shown, /overlay [0-9.]+ ms/);
      await page.screenshot({ path: join(t.artifacts, "30-03-overlay-after-edit.png") });
      t.state.faultedAfterEdit = after;
    },
  },
  {
    name: "exports the time-current plot as SVG and PNG with the curves and the caution",
    async run(t) {
      const page = t.state.page;
      await page.getByTestId("tab-tcc").click();
      const host = page.getByTestId("tcc-host");
      await host.waitFor();
      // the plot is laid out after the pane is measured: wait until at least two devices' curves are drawn
      // (a path of more than a few points each), never on time, so a loaded machine reads the finished plot
      const onScreen = await (
        await page.waitForFunction(() => {
          const svg = document.querySelector(".tcc-host svg.tcc-svg");
          if (!svg) return null;
          const drawn = [...svg.querySelectorAll("g[data-device-id]")].filter((g) => [...g.querySelectorAll("path")].some((p) => (p.getAttribute("d") ?? "").split(/[LC]/).length > 4));
          const ids = [...new Set(drawn.map((g) => g.getAttribute("data-device-id")))];
          const r = svg.getBoundingClientRect();
          return ids.length >= 2 && r.width > 0 ? { ids, width: r.width, height: r.height } : null;
        }, null, { timeout: 30000 })
      ).jsonValue();
      assert.ok(onScreen.ids.length >= 2, `the plot draws the path's devices (${onScreen.ids.join(", ")})`);
      await page.screenshot({ path: join(t.artifacts, "30-04-tcc.png") });

      const svgDl = await download(page, () => host.getByRole("button", { name: "Export SVG" }).click());
      assert.match(svgDl.suggestedFilename(), /\.svg$/);
      const svgPath = join(t.artifacts, "30-tcc-export.svg");
      await svgDl.saveAs(svgPath);
      const svgText = await readFile(svgPath, "utf8");
      const parsed = await page.evaluate((text) => {
        const doc = new DOMParser().parseFromString(text, "image/svg+xml");
        const root = doc.documentElement;
        const curves = {};
        for (const g of doc.querySelectorAll("g[data-device-id]")) {
          const id = g.getAttribute("data-device-id");
          // a drawn curve: a path with more than a couple of points
          const drawn = [...g.querySelectorAll("path")].filter((p) => (p.getAttribute("d") ?? "").split(/[LC]/).length > 4).length;
          curves[id] = (curves[id] ?? 0) + drawn;
        }
        return {
          error: doc.querySelector("parsererror")?.textContent ?? null,
          root: root.localName,
          ns: root.namespaceURI,
          width: Number(root.getAttribute("width")),
          height: Number(root.getAttribute("height")),
          texts: [...doc.querySelectorAll("text")].map((n) => n.textContent),
          curves,
        };
      }, svgText);
      assert.equal(parsed.error, null, "the SVG parses as XML");
      assert.equal(parsed.root, "svg");
      assert.equal(parsed.ns, "http://www.w3.org/2000/svg");
      for (const id of onScreen.ids) assert.ok(parsed.curves[id] > 0, `the export holds ${id}'s curve paths`);
      assert.ok(parsed.texts.includes(CAUTION), "the SVG carries the caution sentence");
      assert.ok(!svgText.includes("class="), "styles are inlined, no class left");

      const pngDl = await download(page, () => host.getByRole("button", { name: "Export PNG" }).click());
      assert.match(pngDl.suggestedFilename(), /\.png$/);
      const pngPath = join(t.artifacts, "30-tcc-export.png");
      await pngDl.saveAs(pngPath);
      const png = pngSize(await readFile(pngPath));
      assert.equal(png.width, 2 * parsed.width, `the PNG is twice the SVG's width (${png.width} vs ${parsed.width})`);
      assert.equal(png.height, 2 * parsed.height, `the PNG is twice the SVG's height (${png.height} vs ${parsed.height})`);
      // the caution is drawn into the PNG too: the same SVG is rasterised; check its text is inked by
      // comparing the footer strip of the PNG against a blank one
      const inked = await page.evaluate(async (b64) => {
        const img = new Image();
        img.src = `data:image/png;base64,${b64}`;
        await img.decode();
        const c = document.createElement("canvas");
        c.width = img.naturalWidth;
        c.height = img.naturalHeight;
        const ctx = c.getContext("2d");
        ctx.drawImage(img, 0, 0);
        const strip = ctx.getImageData(0, c.height - 40, c.width, 40).data;
        const [r0, g0, b0] = strip;
        let differ = 0;
        for (let i = 0; i < strip.length; i += 4) if (Math.abs(strip[i] - r0) + Math.abs(strip[i + 1] - g0) + Math.abs(strip[i + 2] - b0) > 60) differ++;
        return differ;
      }, (await readFile(pngPath)).toString("base64"));
      assert.ok(inked > 200, `the PNG's footer (where the caution is drawn) has ink (${inked} pixels)`);
    },
  },
  {
    name: "box-selects two buses, aligns their top edges and undoes it",
    async run(t) {
      const page = t.state.page;
      await page.getByRole("button", { name: "New" }).click(); // the confirm to discard the edit is accepted
      await page.waitForFunction(() => document.querySelectorAll(".react-flow__node").length === 0);
      assert.equal(await zoom(page), 1, "an empty project opens at 1:1");
      await placePart(page, "bus", 200, 120);
      await placePart(page, "bus", 420, 260);
      const top = async (id) => (await page.locator(`[data-element="${id}"] .bus-bar`).boundingBox()).y;
      const apart = Math.abs((await top("B1")) - (await top("B2")));
      assert.ok(apart > 50, "the buses start at different heights");
      const pane = await page.locator(".canvas-wrap").boundingBox();
      await page.locator(".canvas-wrap").click({ position: { x: 5, y: 5 } }); // nothing selected
      await page.keyboard.down("Shift");
      await page.mouse.move(pane.x + 20, pane.y + 20);
      await page.mouse.down();
      await page.mouse.move(pane.x + 300, pane.y + 200, { steps: 5 });
      await page.mouse.move(pane.x + 620, pane.y + 380, { steps: 5 });
      await page.mouse.up();
      await page.keyboard.up("Shift");
      await page.waitForFunction(() => document.querySelector('[data-testid="inspector-head"]')?.textContent?.startsWith("2 elements"), null, { timeout: 5000 });
      assert.equal(await page.evaluate(() => window.getSelection()?.toString() ?? ""), "", "the Shift-drag selects elements, not the page's text");
      await page.screenshot({ path: join(t.artifacts, "30-05-box-selected.png") });
      await page.getByText("Align", { exact: true }).click();
      await page.getByRole("button", { name: "Top edges" }).click();
      await page.waitForFunction(() => {
        const a = document.querySelector('[data-element="B1"] .bus-bar')?.getBoundingClientRect().y;
        const b = document.querySelector('[data-element="B2"] .bus-bar')?.getBoundingClientRect().y;
        return a !== undefined && b !== undefined && Math.abs(a - b) < 0.5;
      });
      assert.ok(Math.abs((await top("B1")) - (await top("B2"))) < 0.5, "top edges line up");
      assert.equal(await page.locator("details.menu[open]").count(), 0, "the chosen item closes the Align menu");
      await page.screenshot({ path: join(t.artifacts, "30-06-aligned.png") });
      await page.keyboard.press("Control+z");
      await page.waitForFunction((d) => {
        const a = document.querySelector('[data-element="B1"] .bus-bar')?.getBoundingClientRect().y;
        const b = document.querySelector('[data-element="B2"] .bus-bar')?.getBoundingClientRect().y;
        return Math.abs(Math.abs(a - b) - d) < 0.5;
      }, apart);
    },
  },
  {
    name: "snaps a dragged bus to the grid in the saved layout, and not when Snap is off",
    async run(t) {
      const page = t.state.page;
      const snap = page.getByLabel("Snap");
      assert.ok(await snap.isChecked(), "Snap is on by default");
      await page.locator(".canvas-wrap").click({ position: { x: 5, y: 5 } });
      t.state.saveName = "grid-check";
      const start = (await saveAndRead(t, page, "30-grid-0.islet")).layout.B1;
      await dragBus(page, "B1", 37, 23);
      const snapped = (await saveAndRead(t, page, "30-grid-1.islet")).layout.B1;
      assert.ok(snapped.x !== start.x || snapped.y !== start.y, "the bus moved");
      // the grid step is 10 flow units, at 1:1 zoom 10 px
      assert.equal(snapped.x % GRID_STEP, 0, `x ${snapped.x} is on the grid`);
      assert.equal(snapped.y % GRID_STEP, 0, `y ${snapped.y} is on the grid`);
      await snap.uncheck();
      await dragBus(page, "B1", 37, 23);
      const free = (await saveAndRead(t, page, "30-grid-2.islet")).layout.B1;
      // without snapping the bus follows the pointer: moved by the drag itself (zoom 1:1)
      assert.ok(Math.abs(free.x - snapped.x - 37) <= 2 && Math.abs(free.y - snapped.y - 23) <= 2, `moved by the drag (${free.x - snapped.x}, ${free.y - snapped.y})`);
      assert.notEqual(free.x % GRID_STEP, 0, "so off the grid here");
      await snap.check();
      await page.screenshot({ path: join(t.artifacts, "30-07-snap.png") });
    },
  },
  {
    name: "a failed save shows why, keeps the work and its unsaved marker; the next save works",
    async run(t) {
      const page = t.state.page;
      await select(page, "B2");
      await setField(page, "Name", "Pump house board");
      await page.getByTestId("dirty-mark").waitFor();
      const count = await elementCount(page);
      // the browser refuses the file (as when storage or memory runs out): the download's Blob URL fails
      await page.evaluate(() => {
        window.__isletKeptCreateObjectURL = URL.createObjectURL;
        URL.createObjectURL = () => {
          throw new Error("the browser refused the file");
        };
      });
      let downloads = 0;
      const count_ = () => downloads++;
      page.on("download", count_);
      await page.keyboard.press("Control+s");
      const notice = page.getByTestId("notice-error");
      await notice.waitFor();
      const text = await notice.textContent();
      assert.match(text, /grid-check\.islet/, "the message names the file");
      assert.match(text, /refused/, "and says why");
      assert.match(text, /still open and unsaved/, "and that the work is kept");
      assert.equal(await page.getByTestId("dirty-mark").count(), 1, "the unsaved marker stays");
      assert.equal(await elementCount(page), count, "the document is kept");
      assert.match(await page.locator('[data-element="B2"]').textContent(), /Pump house board/, "with the edit");
      await page.screenshot({ path: join(t.artifacts, "30-08-save-failed.png") });
      page.off("download", count_);
      assert.equal(downloads, 0, "nothing was downloaded");
      await page.evaluate(() => {
        URL.createObjectURL = window.__isletKeptCreateObjectURL;
      });
      await notice.getByRole("button", { name: "Dismiss" }).click();
      const saved = await saveAndRead(t, page, "30-after-failure.islet");
      assert.equal(saved.elements.find((e) => e.id === "B2")?.name, "Pump house board", "the later save writes the kept work");
    },
  },
  {
    name: "reopens a file from the Recent list",
    async run(t) {
      const page = t.state.page;
      const original = JSON.parse(await readFile(join(t.artifacts, "30-after-failure.islet"), "utf8"));
      const picked = join(t.artifacts, "30-recent-check.islet");
      await writeFile(picked, JSON.stringify({ ...original, meta: { ...original.meta, name: "Recent check" } }, null, 2));
      const [chooser] = await Promise.all([page.waitForEvent("filechooser"), page.getByRole("button", { name: "Open…" }).click()]);
      await chooser.setFiles(picked);
      await page.waitForFunction(() => document.querySelector('[data-testid="doc-state"]')?.textContent?.includes("30-recent-check.islet"));
      await page.getByRole("button", { name: "New" }).click();
      await page.waitForFunction(() => document.querySelectorAll(".react-flow__node").length === 0);
      await page.locator(".menu > summary", { hasText: "Recent" }).click();
      const list = page.getByTestId("recent-list");
      await list.locator(".menu-item").first().waitFor(); // the list is read from the browser's store when the menu opens
      const names = await list.locator(".menu-item").allTextContents();
      assert.deepEqual(names.slice(0, 2), ["30-recent-check.islet", "grid-check.islet"], "the last opened file first, then the last saved");
      await page.screenshot({ path: join(t.artifacts, "30-09-recent.png") });
      await list.getByRole("button", { name: "30-recent-check.islet" }).click();
      await page.waitForFunction(() => document.querySelector('[data-testid="doc-state"]')?.textContent?.includes("30-recent-check.islet"));
      assert.equal(await page.locator("details.menu[open]").count(), 0, "the chosen file closes the Recent menu");
      assert.equal(await elementCount(page), original.elements.length, "the file's elements are back");
      assert.match(await page.locator('[data-element="B2"]').textContent(), /Pump house board/);
      assert.equal(await page.getByTestId("dirty-mark").count(), 0, "a reopened file is clean");
      assert.deepEqual(t.state.problems, [], "no page errors");
    },
  },
];
