// The report's style sheet: our own layout on system font stacks, print rules with page size, margins,
// running header and footer (the caution and page numbers) and page breaks. The one-line gets a landscape page.
import { REPORT_COLORS as C } from "./reportColors.ts";
import { REPORT_CAUTION } from "./reportCaution.ts";
import type { PageSize } from "./reportTypes.ts";

/** Characters written as they are; every other code point becomes a hex escape. */
const PLAIN = /^[A-Za-z0-9 .,:;!?()'/@#%&+=_-]$/;

/**
 * A CSS string literal holding `text`, also safe inside an HTML <style> element: every character outside a short
 * allow-list (quotes, backslash, <, >, every control character, CR and form feed included, and all non-ASCII)
 * is a hex escape (backslash, hex digits, one space; CSS Syntax Level 3, 4.3.7), so no character of the text can end the string.
 */
export function cssString(text: string): string {
  let out = "";
  for (const ch of text) {
    if (PLAIN.test(ch)) out += ch;
    else {
      const cp = ch.codePointAt(0)!;
      // NUL and lone surrogates are not code points a CSS string can hold: U+FFFD, as a CSS parser would make them
      out += `\\${(cp === 0 || (cp >= 0xd800 && cp <= 0xdfff) ? 0xfffd : cp).toString(16)} `;
    }
  }
  return `"${out}"`;
}

export function reportCss(pageSize: PageSize, header: string, date: string): string {
  return `
:root { color-scheme: light; }
* { box-sizing: border-box; }
html { font-family: system-ui, "Segoe UI", Roboto, "Helvetica Neue", "Noto Sans", "Liberation Sans", Arial, sans-serif; font-size: 10pt; color: ${C.ink}; background: ${C.paper}; }
body { margin: 0 auto; max-width: 190mm; padding: 8mm 0 16mm; line-height: 1.38; }
h1 { font-size: 24pt; line-height: 1.15; margin: 4mm 0 3mm; color: ${C.accent}; font-weight: 650; }
h2 { font-size: 15pt; margin: 0 0 3mm; padding-bottom: 1.5mm; border-bottom: 2px solid ${C.accent}; color: ${C.accent}; font-weight: 650; }
h3 { font-size: 11.5pt; margin: 6mm 0 2mm; font-weight: 650; break-after: avoid; }
p { margin: 0 0 2.5mm; }
.id { color: ${C.muted}; font-weight: 400; }
.note { color: ${C.muted}; font-size: 9pt; }
span.small { font-size: 7.5pt; color: ${C.muted}; }
.off { color: ${C.muted}; font-style: italic; }
table { border-collapse: collapse; width: 100%; margin: 0 0 4mm; font-variant-numeric: tabular-nums; }
th, td { text-align: left; vertical-align: top; padding: 1.1mm 1.6mm; border-bottom: 0.6px solid ${C.rule}; }
thead th { background: ${C.wash}; border-bottom: 1.2px solid ${C.ink}; font-weight: 600; font-size: 8.5pt; }
thead { display: table-header-group; }
tr { break-inside: avoid; }
td.num, th.num { text-align: right; white-space: nowrap; }
td.small, td.refs { font-size: 7.5pt; color: ${C.muted}; }
td.refs a { color: ${C.muted}; text-decoration: none; white-space: nowrap; }
table.open td:nth-child(5) { width: 45%; }
table.open td:nth-child(6) { width: 30%; }
td.ref { white-space: nowrap; font-weight: 600; }
table.data { font-size: 8.5pt; }
table.verdicts td:nth-child(2) { white-space: nowrap; }
table.verdicts td:nth-child(3) { max-width: 38mm; }
table.verdicts:not(.pass-summary) td:nth-child(4) { width: 55%; }
table.verdicts:not(.pass-summary) td:nth-child(5) { width: 30%; font-size: 7pt; }
table.pass-summary td:nth-child(4) { width: 60%; }
table.verdicts { font-size: 7.5pt; }
table.verdicts td { padding: 0.8mm 1.4mm; }
table.narrow { width: auto; min-width: 70mm; }
table.kv td:first-child { width: 60%; }
tr.fail td.ref, .status-fail { color: ${C.fail}; }
tr.warn td.ref, .status-warn { color: ${C.warn}; }
tr.pass td.ref, .status-pass { color: ${C.pass}; }
.badge { display: inline-block; padding: 0 1.5mm; border-radius: 1mm; font-size: 7.5pt; font-weight: 700; text-transform: uppercase; }
.badge.fail { background: ${C.failWash}; color: ${C.fail}; }
.badge.warn { background: ${C.warnWash}; color: ${C.warn}; }
.twocol { display: flex; gap: 8mm; align-items: flex-start; }
.cover { min-height: 240mm; display: flex; flex-direction: column; }
.cover .kicker { text-transform: uppercase; letter-spacing: 0.14em; font-size: 9pt; color: ${C.muted}; margin-top: 30mm; }
.cover .lede { font-size: 11pt; max-width: 150mm; }
.facts { display: grid; grid-template-columns: 40mm 1fr; gap: 1.5mm 4mm; margin: 8mm 0; padding: 4mm 0; border-top: 1px solid ${C.rule}; border-bottom: 1px solid ${C.rule}; }
.facts dt { color: ${C.muted}; }
.facts dd { margin: 0; font-weight: 500; }
.facts dd.hash { font-family: ui-monospace, "Cascadia Mono", "DejaVu Sans Mono", "Liberation Mono", monospace; font-size: 8.5pt; word-break: break-all; }
.caution { border-left: 4px solid ${C.fail}; background: ${C.failWash}; padding: 3mm 4mm; font-size: 10pt; }
.cover-caution { margin-top: auto; }
.contents ol { padding-left: 6mm; }
.contents a { color: ${C.ink}; text-decoration: none; }
figure { margin: 0 0 6mm; break-inside: avoid; }
figure svg { width: 100%; height: auto; display: block; border: 0.6px solid ${C.rule}; }
figcaption { font-size: 8.5pt; color: ${C.muted}; margin-top: 1.5mm; }
.timeline-block { break-inside: avoid; margin-bottom: 5mm; }
.screen-caution { position: sticky; bottom: 0; background: ${C.paper}; border-top: 1px solid ${C.rule}; padding: 2mm 0; font-size: 8.5pt; color: ${C.fail}; }
section.wide-page { page: wide; }
section.oneline-page figure svg { max-height: 150mm; }
@page { size: ${pageSize}; margin: 16mm 13mm 18mm 13mm;
  @top-left { content: ${cssString(header)}; font-size: 7.5pt; color: ${C.muted}; }
  @top-right { content: ${cssString(date)}; font-size: 7.5pt; color: ${C.muted}; }
  @bottom-left { content: ${cssString(REPORT_CAUTION)}; font-size: 7pt; color: ${C.fail}; width: 80%; }
  @bottom-right { content: "Page " counter(page) " of " counter(pages); font-size: 7.5pt; color: ${C.muted}; }
}
@page wide { size: ${pageSize} landscape; }
@media print {
  body { max-width: none; padding: 0; }
  section.break { break-before: page; }
  .cover { min-height: 245mm; }
  .screen-caution { display: none; }
  a { color: inherit; }
}
`;
}
