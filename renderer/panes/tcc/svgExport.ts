// Export of the time-current plot: a standalone SVG with the computed styles written inline (so it
// looks the same outside the studio, CSS variables resolved), and a PNG drawn from it at 2x.
import type { TccExportFile } from "./tccTypes.ts";

/** Presentation properties copied from the computed style onto every exported node. */
export const INLINED_PROPERTIES = [
  "fill",
  "fill-opacity",
  "stroke",
  "stroke-width",
  "stroke-dasharray",
  "stroke-opacity",
  "stroke-linecap",
  "stroke-linejoin",
  "opacity",
  "font-family",
  "font-size",
  "font-weight",
  "font-style",
  "text-anchor",
  "dominant-baseline",
  "visibility",
  "paint-order",
  "font-variant-numeric",
  "text-transform",
] as const;

/** Attribute that marks on-screen-only parts (pointer cross-hair, read-out, drag ghost, buttons). */
export const NO_EXPORT_ATTR = "data-no-export";

/** Height in px of the title band added above the plot in an export. */
const TITLE_BAND_PX = 26;

/** A standalone SVG document of `svg`, styles inlined, on-screen-only parts dropped, with an opaque
 * background and, when given, a title band above the plot (what the file shows, since the pane's header is not in it). */
export function serializeSvg(svg: SVGSVGElement, title?: string): string {
  const clone = svg.cloneNode(true) as SVGSVGElement;
  const srcNodes = [svg, ...Array.from(svg.querySelectorAll("*"))];
  const dstNodes = [clone, ...Array.from(clone.querySelectorAll("*"))];
  const view = svg.ownerDocument.defaultView;
  if (view) {
    srcNodes.forEach((src, k) => {
      const dst = dstNodes[k] as SVGElement;
      const cs = view.getComputedStyle(src);
      const parts: string[] = [];
      for (const p of INLINED_PROPERTIES) {
        const v = cs.getPropertyValue(p);
        if (v) parts.push(`${p}:${v}`);
      }
      dst.setAttribute("style", parts.join(";"));
      dst.removeAttribute("class");
    });
  }
  clone.querySelectorAll(`[${NO_EXPORT_ATTR}]`).forEach((n) => n.remove());
  const { width, height: plotHeight } = svg.getBoundingClientRect();
  const ns = "http://www.w3.org/2000/svg";
  const band = title ? TITLE_BAND_PX : 0;
  const height = plotHeight + band;
  if (title) {
    const body = svg.ownerDocument.createElementNS(ns, "g");
    body.setAttribute("transform", `translate(0 ${band})`);
    while (clone.firstChild) body.appendChild(clone.firstChild);
    clone.appendChild(body);
    const text = svg.ownerDocument.createElementNS(ns, "text");
    const fg = view ? view.getComputedStyle(svg).color : "";
    const font = view ? view.getComputedStyle(svg).fontFamily : "";
    text.setAttribute("x", "12");
    text.setAttribute("y", String(band - 8));
    text.setAttribute("style", `fill:${fg || "#1d2430"};font-family:${font || "sans-serif"};font-size:13px;font-weight:600`);
    text.textContent = title;
    clone.appendChild(text);
  }
  clone.setAttribute("xmlns", ns);
  clone.setAttribute("width", String(Math.round(width)));
  clone.setAttribute("height", String(Math.round(height)));
  clone.setAttribute("viewBox", `0 0 ${Math.round(width)} ${Math.round(height)}`);
  const bgColor = view ? view.getComputedStyle(svg).getPropertyValue("--tcc-export-bg") || view.getComputedStyle(svg.parentElement ?? svg).backgroundColor : "";
  const bg = svg.ownerDocument.createElementNS(ns, "rect");
  bg.setAttribute("width", "100%");
  bg.setAttribute("height", "100%");
  bg.setAttribute("style", `fill:${bgColor.trim() || "#ffffff"}`);
  clone.insertBefore(bg, clone.firstChild);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(clone)}`;
}

/** PNG bytes of an SVG document drawn into a canvas at `scale` times its size. */
export async function svgToPng(svgText: string, width_px: number, height_px: number, scale = 2): Promise<Uint8Array> {
  const url = URL.createObjectURL(new Blob([svgText], { type: "image/svg+xml" }));
  try {
    const img = new Image();
    img.decoding = "sync";
    await new Promise<void>((resolve, reject) => {
      img.onload = () => resolve();
      img.onerror = () => reject(new Error("the plot could not be rendered to an image"));
      img.src = url;
    });
    const canvas = document.createElement("canvas");
    canvas.width = Math.round(width_px * scale);
    canvas.height = Math.round(height_px * scale);
    const ctx = canvas.getContext("2d");
    if (!ctx) throw new Error("no 2D canvas available for the PNG export");
    ctx.setTransform(scale, 0, 0, scale, 0, 0);
    ctx.drawImage(img, 0, 0, width_px, height_px);
    const blob = await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error("PNG encoding failed"))), "image/png"),
    );
    return new Uint8Array(await blob.arrayBuffer());
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** One export file of the plot, named after `baseName` ("tcc-F3-dock" -> "tcc-F3-dock.svg" or ".png"), titled `title`. */
export async function exportPlot(svg: SVGSVGElement, kind: "svg" | "png", baseName: string, title?: string): Promise<TccExportFile> {
  const text = serializeSvg(svg, title);
  const safe = exportBaseName(baseName);
  if (kind === "svg") return { suggestedName: `${safe}.svg`, mime: "image/svg+xml", data: text };
  // the SVG's own size is rounded to whole pixels; the PNG is exactly twice that
  const { width, height } = svg.getBoundingClientRect();
  return { suggestedName: `${safe}.png`, mime: "image/png", data: await svgToPng(text, Math.round(width), Math.round(height + (title ? TITLE_BAND_PX : 0)), 2) };
}

/** A file-system-safe base name: letters, digits, dot, dash and underscore; other runs become "-". */
export function exportBaseName(name: string): string {
  const s = name.trim().replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "");
  return s || "time-current";
}
