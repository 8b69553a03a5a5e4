// An HTML table from already-escaped cell markup. Headers are plain text (escaped here).
import { escapeHtml } from "./escapeHtml.ts";

export interface HtmlTableOptions {
  className?: string;
  /** Per-column class (e.g. "num" for right-aligned numbers). */
  columnClasses?: readonly string[];
  /** Per-row attributes, e.g. `class="fail" data-verdict="..."`. */
  rowAttributes?: (index: number) => string;
  caption?: string;
}

export function htmlTable(headers: readonly string[], rows: readonly (readonly string[])[], opts: HtmlTableOptions = {}): string {
  const cls = (k: number) => (opts.columnClasses?.[k] ? ` class="${opts.columnClasses[k]}"` : "");
  const head = `<thead><tr>${headers.map((h, k) => `<th${cls(k)}>${escapeHtml(h)}</th>`).join("")}</tr></thead>`;
  const body = rows
    .map((r, i) => {
      const attrs = opts.rowAttributes?.(i);
      return `<tr${attrs ? " " + attrs : ""}>${r.map((c, k) => `<td${cls(k)}>${c}</td>`).join("")}</tr>`;
    })
    .join("\n");
  const caption = opts.caption ? `<caption>${escapeHtml(opts.caption)}</caption>` : "";
  return `<table${opts.className ? ` class="${opts.className}"` : ""}>${caption}${head}<tbody>\n${body}\n</tbody></table>`;
}
