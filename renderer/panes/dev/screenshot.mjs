/* global process, console, window, document, Buffer */
// Screenshots and a smoke check of the panes preview in Debian's Chromium (playwright-core, no downloaded browser).
// Start the preview first:  node_modules/.bin/vite --config renderer/panes/dev/vite.config.ts &
// then:                     node renderer/panes/dev/screenshot.mjs [outDir]
import { chromium } from "playwright-core";

const base = process.env.PANES_URL ?? "http://127.0.0.1:5191/panesPreview.html";
const out = process.argv[2] ?? "/tmp/panes-shots";
const args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args });
const problems = [];
try {
  const shot = async (name, query, viewport, act) => {
    const page = await browser.newPage({ viewport, deviceScaleFactor: viewport.scale ?? 1 });
    page.on("pageerror", (e) => problems.push(`${name}: page error ${e.message}`));
    page.on("console", (m) => m.type() === "error" && !m.location().url.includes("favicon") && problems.push(`${name}: console ${m.text()}`));
    await page.goto(`${base}${query}`);
    await page.waitForSelector(".tcc-svg, .chain-table, .verdict-scroll", { timeout: 20000 });
    await page.waitForTimeout(300);
    if (act) await act(page);
    await page.screenshot({ path: `${out}/${name}.png` });
    const log = await page.evaluate(() => window.__panes);
    await page.close();
    return log;
  };

  await shot("all-1366", "", { width: 1366, height: 768 }, async (page) => {
    const box = await page.locator(".tcc-svg").boundingBox();
    await page.mouse.move(box.x + box.width * 0.42, box.y + box.height * 0.45);
  });
  await shot("all-1366-dark", "?theme=dark", { width: 1366, height: 768 });
  await shot("tcc-4k", "?pane=tcc", { width: 1920, height: 1080, scale: 2 });
  await shot("tcc-uhd-dpr1", "?pane=tcc", { width: 3840, height: 2160 });

  // Drag the pump fuse curve to the right: a pickup change, several moves then one final.
  const dragLog = await shot("tcc-drag", "?pane=tcc", { width: 1366, height: 768 }, async (page) => {
    const target = await page.evaluate(() => {
      const svg = document.querySelector(".tcc-svg");
      const path = document.querySelector('[data-device-id="F-PMP"] .tcc-nominal');
      const r = svg.getBoundingClientRect();
      const len = path.getTotalLength();
      const p = path.getPointAtLength(len * 0.35);
      return { x: r.left + p.x, y: r.top + p.y };
    });
    await page.mouse.move(target.x, target.y);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(target.x + k * 6, target.y + 1);
    await page.waitForTimeout(100);
    await page.screenshot({ path: `${out}/tcc-dragging.png` });
    await page.mouse.up();
  });
  const finals = dragLog.settings.filter((s) => s.final);
  console.log("drag:", dragLog.settings.length, "changes,", finals.length, "final:", JSON.stringify(finals[0] ?? null));
  if (finals.length !== 1 || finals[0].deviceId !== "F-PMP" || !(finals[0].patch.pickup_A > 160)) problems.push("drag did not raise the fuse rating in one final change");

  // Chain: focus, then Down, Right, Down -> steps reported.
  const chainLog = await shot("chain-keys", "?pane=chain", { width: 900, height: 420 }, async (page) => {
    await page.locator(".chain-body").focus();
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("ArrowRight");
    await page.keyboard.press("ArrowDown");
  });
  console.log("chain steps:", chainLog.steps.join(" -> "));
  if (chainLog.steps.join(",") !== "Q-INC,Q-GEN") problems.push(`chain steps unexpected: ${chainLog.steps.join(",")}`);

  // Verdicts: a big matrix, scroll, filter to failures of selectivity, click a cell.
  const vLog = await shot("verdicts-3000", "?pane=verdicts&buses=375", { width: 1366, height: 768 }, async (page) => {
    const rendered = await page.locator(".verdict-scroll .verdict-row").count();
    console.log("verdict rows in the DOM for 3000 cases:", rendered);
    if (rendered > 120) problems.push(`virtualisation: ${rendered} rows rendered`);
    await page.locator(".verdict-scroll").evaluate((el) => (el.scrollTop = 2400));
    await page.waitForTimeout(100);
    await page.getByRole("button", { name: "Pass", exact: true }).click();
    await page.getByRole("button", { name: "Warning", exact: true }).click();
    await page.locator(".verdict-scroll button.verdict-cell.is-fail").first().click();
  });
  console.log("verdict selection:", JSON.stringify(vLog.selections));
  if (vLog.selections.length !== 1) problems.push("cell click did not select a case");

  // Export: SVG carries the caution, PNG is twice the size of the plot.
  const eLog = await shot("tcc-export", "?pane=tcc", { width: 1366, height: 768 }, async (page) => {
    await page.getByRole("button", { name: "Export SVG" }).click();
    await page.getByRole("button", { name: "Export PNG" }).click();
    await page.waitForFunction(() => window.__panes.exports.length >= 2, null, { timeout: 10000 });
    const svgText = await page.evaluate(() => window.__panes.exports[0].text);
    const png = await page.evaluate(() => window.__panes.exports[1]);
    console.log("exports:", JSON.stringify(await page.evaluate(() => window.__panes.exports.map((e) => ({ n: e.suggestedName, m: e.mime, size: e.size })))));
    // Render the exported SVG alone to look at it.
    const p2 = await browser.newPage({ viewport: { width: 1366, height: 768 } });
    await p2.setContent(`<body style="margin:0">${svgText.replace(/^<\?xml[^>]*>/, "")}</body>`);
    await p2.screenshot({ path: `${out}/tcc-exported-svg.png` });
    await p2.close();
    if (!svgText.includes("review by a licensed engineer")) problems.push("SVG export lacks the caution");
    if (svgText.includes("tcc-readout")) problems.push("SVG export contains the pointer read-out");
    if (!(png.size > 10000)) problems.push("PNG export too small");
    const { writeFile } = await import("node:fs/promises");
    const bytes = Buffer.from(png.base64, "base64");
    await writeFile(`${out}/tcc-exported.png`, bytes);
    // PNG header: width and height are big-endian at bytes 16 and 20 (PNG specification, IHDR chunk)
    const w = bytes.readUInt32BE(16);
    const h = bytes.readUInt32BE(20);
    const plot = await page.locator(".tcc-svg").boundingBox();
    console.log("PNG size:", w, "x", h, "for a plot of", Math.round(plot.width), "x", Math.round(plot.height));
    // 26 px title band above the plot (svgExport.ts)
    if (w !== Math.round(plot.width * 2) || h !== Math.round((plot.height + 26) * 2)) problems.push("PNG is not drawn at 2x");
  });
  void eLog;

  // A click on a legend entry selects that device.
  const legendLog = await shot("tcc-legend-click", "?pane=tcc", { width: 1366, height: 768 }, async (page) => {
    await page.locator(".tcc-legend-row.is-device", { hasText: "LV incomer" }).click();
  });
  console.log("legend click selects:", legendLog.selects.join(","));
  if (legendLog.selects.join(",") !== "Q-INC") problems.push("legend click did not select the device");

  // Arrow keys on the focused plot change the highlighted device's setting, one final edit per press.
  const keyLog = await shot("tcc-keys", "?pane=tcc", { width: 1366, height: 768 }, async (page) => {
    await page.locator(".tcc-svg").focus();
    await page.keyboard.press("ArrowRight");
  });
  console.log("arrow key:", JSON.stringify(keyLog.settings));
  // the workshop feeder's Ir is 0.8 x 400 A = 320 A; one press raises it 5 % to 336 A
  if (keyLog.settings.length !== 1 || keyLog.settings[0].patch.pickup_A !== 336 || !keyLog.settings[0].final) problems.push("arrow key did not raise the highlighted pickup by 5 %");

  // Empty states and a notice.
  await shot("empty", "?empty=1", { width: 1366, height: 768 });

  // A case selected elsewhere scrolls the matrix to it.
  await shot("verdicts-follow", "?pane=verdicts&buses=375&case=island|bus:B-300|LG|min", { width: 1366, height: 768 }, async (page) => {
    await page.waitForTimeout(300);
    const n = await page.locator(".verdict-cell.is-selected").count();
    console.log("selected cell rendered after an outside selection:", n);
    if (n !== 1) problems.push("the matrix did not scroll to a case selected elsewhere");
  });
} finally {
  await browser.close();
}
if (problems.length) {
  console.log("PROBLEMS:\n" + problems.join("\n"));
  process.exitCode = 1;
} else console.log("preview checks passed; screenshots in", out);
