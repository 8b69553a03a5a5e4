// The one-line diagram as a self-contained SVG, drawn from the project's elements and layout (positions are
// element centres, bus widths in `w`). Our own simple IEC 60617-style marks: buses as bars, transformers as
// two circles, lines as an impedance box, switches as a square with a cross, sources and loads as circles
// and triangles, protective devices as small marks beside the element they look into.
import { elementBuses, isProtectiveDevice, type Bus, type Element, type Project, type ProtectiveDevice } from "../model/schema.ts";
import { ownValue } from "../model/ownValue.ts";
import { REPORT_COLORS, voltageColor } from "./reportColors.ts";
import { n, svgText } from "./svgText.ts";

const DEFAULT_BUS_W = 240;
const ROW_PX = 30;
const MARGIN = 70;
const DEVICE_GAP = 12;

interface Place {
  x: number;
  y: number;
  w?: number;
}

/** Half height of an element's symbol: where its terminals sit above and below its centre. */
function halfHeight(e: Element): number {
  switch (e.kind) {
    case "transformer":
      return 22;
    case "line":
      return 13;
    case "switch":
      return 8;
    default:
      return 13;
  }
}

const sig = (x: number) => String(Number(x.toPrecision(4)));

function caption(e: Element, closed: boolean): string {
  switch (e.kind) {
    case "transformer":
      return `${sig(e.sr_MVA * 1000)} kVA ${e.vectorGroup} uk ${sig(e.uk_pct)} %`;
    case "line":
      return `${sig(e.length_km * 1000)} m ${e.parallel > 1 ? `${e.parallel} x ` : ""}${sig(e.csa_mm2)} mm² ${e.material}`;
    case "switch":
      return `${e.device}${closed ? "" : ", open"}`;
    case "grid":
      return `S"k ${sig(e.skMax_MVA)}/${sig(e.skMin_MVA)} MVA`;
    case "generator":
      return `${sig(e.sr_MVA * 1000)} kVA x"d ${sig(e.xdss_pu)}`;
    case "inverter":
      return `${e.source} ${sig(e.sr_MVA * 1000)} kVA, ${e.control === "grid-forming" ? "forming" : "following"}`;
    case "motor":
      return `${sig(e.pr_kW)} kW`;
    case "load":
      return `${sig(e.p_kW)} kW`;
    default:
      return "";
  }
}

/** Terminal buses of a drawable element, in order (branches: from/HV first); a bus has none of its own. */
function terminals(e: Element): string[] {
  return e.kind === "bus" ? [] : elementBuses(e);
}

/** The symbol of an element centred at (x, y); `horizontal` turns branch symbols across. */
function symbol(e: Element, x: number, y: number, stroke: string, strokeB: string, horizontal: boolean, closed: boolean): string {
  const s = `fill="none" stroke="${stroke}" stroke-width="1.6"`;
  switch (e.kind) {
    case "transformer":
      return `<circle cx="${n(x)}" cy="${n(y - 8)}" r="12" ${s}/><circle cx="${n(x)}" cy="${n(y + 8)}" r="12" fill="none" stroke="${strokeB}" stroke-width="1.6"/>`;
    case "line":
      return horizontal
        ? `<rect x="${n(x - 13)}" y="${n(y - 4)}" width="26" height="8" fill="${REPORT_COLORS.paper}" stroke="${stroke}" stroke-width="1.4"/>`
        : `<rect x="${n(x - 4)}" y="${n(y - 13)}" width="8" height="26" fill="${REPORT_COLORS.paper}" stroke="${stroke}" stroke-width="1.4"/>`;
    case "switch": {
      const box = `<rect x="${n(x - 8)}" y="${n(y - 8)}" width="16" height="16" fill="${REPORT_COLORS.paper}" stroke="${stroke}" stroke-width="1.6"/>`;
      const cross = closed ? `<path d="M${n(x - 5)} ${n(y - 5)}L${n(x + 5)} ${n(y + 5)}M${n(x + 5)} ${n(y - 5)}L${n(x - 5)} ${n(y + 5)}" stroke="${stroke}" stroke-width="1.4"/>` : "";
      return box + cross;
    }
    case "grid":
      return `<rect x="${n(x - 13)}" y="${n(y - 13)}" width="26" height="26" ${s}/><path d="M${n(x - 13)} ${n(y)}L${n(x)} ${n(y - 13)}M${n(x - 13)} ${n(y + 13)}L${n(x + 13)} ${n(y - 13)}M${n(x)} ${n(y + 13)}L${n(x + 13)} ${n(y)}" stroke="${stroke}" stroke-width="1"/>`;
    case "generator":
      return `<circle cx="${n(x)}" cy="${n(y)}" r="13" ${s}/>${svgText(x, y + 4.5, "G", `text-anchor="middle" font-size="13" font-weight="600" fill="${stroke}"`)}`;
    case "motor":
      return `<circle cx="${n(x)}" cy="${n(y)}" r="13" ${s}/>${svgText(x, y + 4.5, "M", `text-anchor="middle" font-size="13" font-weight="600" fill="${stroke}"`)}`;
    case "inverter":
      return `<rect x="${n(x - 13)}" y="${n(y - 13)}" width="26" height="26" ${s}/><path d="M${n(x - 13)} ${n(y + 13)}L${n(x + 13)} ${n(y - 13)}" stroke="${stroke}" stroke-width="1"/>${svgText(x - 6, y - 2, "=", `text-anchor="middle" font-size="10" fill="${stroke}"`)}${svgText(x + 6, y + 9, "~", `text-anchor="middle" font-size="11" fill="${stroke}"`)}`;
    case "load":
      return `<path d="M${n(x - 10)} ${n(y - 8)}L${n(x + 10)} ${n(y - 8)}L${n(x)} ${n(y + 10)}Z" fill="${stroke}" fill-opacity="0.15" stroke="${stroke}" stroke-width="1.4"/>`;
    default:
      return "";
  }
}

/** A protective device's mark: relay a rectangle with its IEEE C37.2 numbers, LV breaker a square with a cross, fuse a box with a line. */
function deviceMark(d: ProtectiveDevice, x: number, y: number, horizontal: boolean): string {
  const c = REPORT_COLORS.device;
  if (d.kind === "relay") {
    const numbers = [...new Set(d.functions.filter((f) => f.enabled).map((f) => f.ansi))].join(" ");
    return `<rect x="${n(x - 5)}" y="${n(y - 5)}" width="10" height="10" fill="${REPORT_COLORS.paper}" stroke="${c}" stroke-width="1.4"/><path d="M${n(x + 5)} ${n(y)}H${n(x + 14)}" stroke="${c}" stroke-width="0.8" stroke-dasharray="2 1.5"/>${svgText(x + 16, y + 3.5, numbers, `font-size="9" fill="${c}"`)}`;
  }
  if (d.kind === "lvbreaker")
    return `<rect x="${n(x - 5.5)}" y="${n(y - 5.5)}" width="11" height="11" fill="${REPORT_COLORS.paper}" stroke="${c}" stroke-width="1.4"/><path d="M${n(x - 3.5)} ${n(y - 3.5)}L${n(x + 3.5)} ${n(y + 3.5)}M${n(x + 3.5)} ${n(y - 3.5)}L${n(x - 3.5)} ${n(y + 3.5)}" stroke="${c}" stroke-width="1.2"/>`;
  return horizontal
    ? `<rect x="${n(x - 8)}" y="${n(y - 4)}" width="16" height="8" fill="${REPORT_COLORS.paper}" stroke="${c}" stroke-width="1.4"/><path d="M${n(x - 8)} ${n(y)}H${n(x + 8)}" stroke="${c}" stroke-width="1.2"/>`
    : `<rect x="${n(x - 4)}" y="${n(y - 8)}" width="8" height="16" fill="${REPORT_COLORS.paper}" stroke="${c}" stroke-width="1.4"/><path d="M${n(x)} ${n(y - 8)}V${n(y + 8)}" stroke="${c}" stroke-width="1.2"/>`;
}

export interface OneLineOptions {
  /** Title read by assistive technology and shown as the SVG's <title>. */
  title?: string;
}

/** The one-line of the project as it is drawn (all elements, switches in their own state). */
export function oneLineSvg(project: Project, options: OneLineOptions = {}): string {
  const byId = new Map(project.elements.map((e) => [e.id, e] as const));
  const place = new Map<string, Place>();
  let unplaced = 0;
  for (const e of project.elements) {
    if (isProtectiveDevice(e)) continue;
    const p = ownValue(project.layout, e.id);
    // elements the layout does not place go on a grid below everything else, as the studio does
    place.set(e.id, p ? { x: p.x, y: p.y, w: p.w } : { x: 40 + (unplaced % 8) * 140, y: 100000 + Math.floor(unplaced++ / 8) * 160 });
  }
  const placed = [...place.values()].filter((p) => p.y < 100000);
  const bottom = placed.length ? Math.max(...placed.map((p) => p.y)) + 160 : 0;
  for (const p of place.values()) if (p.y >= 100000) p.y = p.y - 100000 + bottom;

  const busPlace = (id: string) => {
    const b = byId.get(id);
    const p = place.get(id);
    return b?.kind === "bus" && p ? { x: p.x, y: p.y, half: (p.w ?? DEFAULT_BUS_W) / 2, bus: b as Bus } : null;
  };
  const devicesAt = new Map<string, ProtectiveDevice[]>();
  for (const e of project.elements)
    if (isProtectiveDevice(e)) {
      const key = `${e.at.element}:${e.at.end}`;
      devicesAt.set(key, [...(devicesAt.get(key) ?? []), e]);
    }

  const wires: string[] = [];
  const marks: string[] = [];
  const labels: string[] = [];
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  const grow = (x0: number, y0: number, x1: number, y1: number) => {
    minX = Math.min(minX, x0);
    maxX = Math.max(maxX, x1);
    minY = Math.min(minY, y0);
    maxY = Math.max(maxY, y1);
  };

  for (const e of project.elements) {
    if (e.kind !== "bus") continue;
    const b = busPlace(e.id)!;
    const color = voltageColor(e.un_kV);
    marks.push(`<rect x="${n(b.x - b.half)}" y="${n(b.y - 3)}" width="${n(2 * b.half)}" height="6" rx="1.5" fill="${color}"/>`);
    labels.push(svgText(b.x - b.half, b.y - 8, `${e.id}  ${sig(e.un_kV)} kV`, `font-size="12" font-weight="600" fill="${color}"`));
    grow(b.x - b.half, b.y - 20, b.x + b.half, b.y + 6);
  }

  for (const e of project.elements) {
    if (e.kind === "bus" || isProtectiveDevice(e)) continue;
    const p = place.get(e.id)!;
    const ends = terminals(e);
    const buses = ends.map(busPlace);
    const closed = e.kind === "switch" ? e.closed : true;
    const colors = buses.map((b) => voltageColor(b?.bus.un_kV));
    const horizontal = ends.length === 2 && buses.every((b) => b && Math.abs(b.y - p.y) < ROW_PX);
    const h = halfHeight(e);
    const endNames: ("from" | "to" | "terminal")[] = ends.length === 2 ? ["from", "to"] : ["terminal"];
    buses.forEach((b, k) => {
      if (!b) return;
      const color = colors[k];
      let tx: number;
      let ty: number;
      let devX: (j: number) => number;
      let devY: (j: number) => number;
      if (horizontal) {
        const side = b.x < p.x ? -1 : 1;
        tx = p.x + side * h;
        ty = p.y;
        const edgeX = b.x + -side * b.half;
        wires.push(`<path d="M${n(tx)} ${n(ty)}H${n(edgeX)}" fill="none" stroke="${color}" stroke-width="1.6"/>`);
        devX = (j) => tx + side * (DEVICE_GAP + 4 + 16 * j);
        devY = () => ty;
      } else {
        const side = b.y < p.y ? -1 : 1;
        tx = p.x;
        ty = p.y + side * h;
        const ax = Math.min(b.x + b.half - 4, Math.max(b.x - b.half + 4, p.x));
        const my = (ty + b.y) / 2;
        wires.push(
          ax === p.x
            ? `<path d="M${n(tx)} ${n(ty)}V${n(b.y)}" fill="none" stroke="${color}" stroke-width="1.6"/>`
            : `<path d="M${n(tx)} ${n(ty)}V${n(my)}H${n(ax)}V${n(b.y)}" fill="none" stroke="${color}" stroke-width="1.6"/>`,
        );
        devX = (j) => tx - 16 * j;
        devY = () => ty + side * DEVICE_GAP;
      }
      const devs = devicesAt.get(`${e.id}:${endNames[k]}`) ?? [];
      devs.forEach((d, j) => {
        const dx = devX(j);
        const dy = devY(j);
        marks.push(deviceMark(d, dx, dy, horizontal));
        labels.push(svgText(dx - 9, dy + 3.5, d.id, `font-size="10" text-anchor="end" fill="${REPORT_COLORS.device}"`));
      });
    });
    marks.push(symbol(e, p.x, p.y, colors[0] ?? REPORT_COLORS.ink, colors[1] ?? colors[0] ?? REPORT_COLORS.ink, horizontal, closed));
    const lx = horizontal ? p.x - 12 : p.x + (e.kind === "line" ? 10 : 18);
    const ly = horizontal ? p.y + 24 : p.y - 2;
    labels.push(svgText(lx, ly, e.id, `font-size="12" font-weight="600" fill="${REPORT_COLORS.ink}"`));
    labels.push(svgText(lx, ly + 12, caption(e, closed), `font-size="10" fill="${REPORT_COLORS.muted}"`));
    grow(p.x - 90, p.y - 40, p.x + 170, p.y + 40);
  }
  if (!Number.isFinite(minX)) {
    minX = 0;
    maxX = 200;
    minY = 0;
    maxY = 100;
  }
  const vx = minX - MARGIN / 2;
  const vy = minY - MARGIN / 2;
  const vw = maxX - minX + MARGIN;
  const vh = maxY - minY + MARGIN;
  const title = options.title ?? `One-line diagram of ${project.meta.name}`;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" class="oneline" viewBox="${n(vx)} ${n(vy)} ${n(vw)} ${n(vh)}" width="${n(vw)}" height="${n(vh)}" role="img" font-family="'Segoe UI', 'Helvetica Neue', Arial, sans-serif">`,
    `<title>${svgText(0, 0, title).replace(/^<text[^>]*>|<\/text>$/g, "")}</title>`,
    `<rect x="${n(vx)}" y="${n(vy)}" width="${n(vw)}" height="${n(vh)}" fill="${REPORT_COLORS.paper}"/>`,
    `<g class="wires">${wires.join("")}</g>`,
    `<g class="marks">${marks.join("")}</g>`,
    `<g class="labels">${labels.join("")}</g>`,
    `</svg>`,
  ].join("\n");
}
