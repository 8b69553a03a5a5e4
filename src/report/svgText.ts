// Small helpers for building SVG markup as strings: escaped text and numbers rounded for short output.
import { escapeHtml } from "./escapeHtml.ts";

/** A coordinate rounded to 0.1 unit (keeps the markup short and the output stable). */
export function n(x: number): string {
  const r = Math.round(x * 10) / 10;
  return Object.is(r, -0) ? "0" : String(r);
}

export function svgText(x: number, y: number, text: string, attrs = ""): string {
  return `<text x="${n(x)}" y="${n(y)}"${attrs ? " " + attrs : ""}>${escapeHtml(text)}</text>`;
}
