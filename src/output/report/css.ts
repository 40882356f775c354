/**
 * The report's stylesheet, inline in the page (no network). Screen: a centred column with a dark header band.
 * Print: the content fits both A4 (210 × 297 mm) and US Letter (8.5 × 11 in) within the margins below, so one
 * file prints on either; `paper` fixes the page size when the user wants one. Figures, summary cards, table
 * rows and the short sensitivity table are never split across pages; table headers repeat on each page; the station tables start a new page.
 */
import { palette } from '../charts/style.js';

export type Paper = 'A4' | 'Letter' | 'auto';

export function reportCss(paper: Paper = 'auto'): string {
  const pageSize = paper === 'A4' ? 'size: A4 portrait;' : paper === 'Letter' ? 'size: letter portrait;' : '';
  return `
:root {
  --ink: ${palette.text};
  --muted: ${palette.axis};
  --rule: #d5dbe1;
  --band: #14324d;
  --accent: ${palette.water[0]};
  --wash: #eef4fa;
  --warn: #8f2a20;
  --warn-wash: #fbeeec;
  --pass: #285e2b;
}
* { box-sizing: border-box; }
html { background: #f3f5f7; }
body {
  margin: 0 auto; max-width: 1040px; background: #fff; color: var(--ink);
  font: 14px/1.45 "DejaVu Sans", Verdana, Helvetica, Arial, sans-serif;
}
header.band { background: var(--band); color: #fff; padding: 22px 32px 18px; }
header.band .kicker { font-size: 12px; letter-spacing: .08em; text-transform: uppercase; opacity: .8; margin: 0 0 4px; }
header.band h1 { font-size: 26px; line-height: 1.2; margin: 0 0 12px; overflow-wrap: anywhere; }
dl.meta { display: grid; grid-template-columns: repeat(auto-fit, minmax(150px, 1fr)); gap: 6px 18px; margin: 0; }
dl.meta div { border-left: 3px solid #6fa8d8; padding-left: 8px; }
dl.meta dt { font-size: 11px; text-transform: uppercase; letter-spacing: .05em; opacity: .75; }
dl.meta dd { margin: 0; font-weight: bold; overflow-wrap: anywhere; }
main { padding: 8px 32px 32px; }
section.part { margin-top: 28px; }
h2 { font-size: 19px; border-bottom: 2px solid var(--accent); padding-bottom: 3px; margin: 0 0 12px; }
h2 .num { color: var(--accent); margin-right: 8px; }
h3 { font-size: 15px; margin: 18px 0 8px; }
h4 { font-size: 13px; margin: 12px 0 6px; color: var(--muted); text-transform: uppercase; letter-spacing: .04em; }
h5.item { font-size: 13px; margin: 10px 0 4px; }
p { margin: 6px 0; }
.caution-strip { margin: 16px 0 0; padding: 10px 14px; border: 1px solid #e3b5ad; border-left: 5px solid var(--warn);
  background: var(--warn-wash); font-size: 13px; }
nav.toc ol { columns: 2; margin: 8px 0 0; padding-left: 20px; }
nav.toc a { color: var(--accent); text-decoration: none; }
.cards { display: grid; grid-template-columns: repeat(auto-fit, minmax(180px, 1fr)); gap: 10px; margin: 10px 0; }
.card { border: 1px solid var(--rule); border-top: 4px solid var(--accent); padding: 8px 10px; background: var(--wash); }
.card .k { font-size: 11px; color: var(--muted); text-transform: uppercase; letter-spacing: .04em; }
.card .v { font-size: 17px; font-weight: bold; font-variant-numeric: tabular-nums; }
.card.bad { border-top-color: var(--warn); background: var(--warn-wash); }
.flow { border: 1px solid var(--rule); padding: 4px 16px 12px; margin: 14px 0; }
table { border-collapse: collapse; width: 100%; margin: 6px 0 10px; font-size: 12.5px; }
th, td { padding: 3px 7px; border-bottom: 1px solid var(--rule); text-align: left; vertical-align: top; overflow-wrap: break-word; }
thead th { vertical-align: bottom; }
thead th { background: #e6edf3; border-bottom: 2px solid #9fb2c4; font-weight: bold; }
td.n, th.n { text-align: right; font-variant-numeric: tabular-nums; }
td.n { white-space: nowrap; }
tbody tr:nth-child(even) td { background: #f7f9fb; }
td.fail, .fail { color: var(--warn); font-weight: bold; }
td.pass { color: var(--pass); }
table.stations { font-size: 11px; }
table.sensitivity td:nth-child(8), table.sensitivity td:nth-child(9) { font-size: 11.5px; }
table.stations td, table.stations th { padding: 2px 5px; }
figure.chart { margin: 14px 0 22px; }
figure.chart svg { display: block; max-width: 100%; height: auto; margin: 0 auto; }
figure.chart figcaption { font-size: 12.5px; color: var(--muted); margin-top: 4px; }
figure.chart figcaption b { color: var(--ink); }
ul.warnings li { color: var(--warn); margin: 3px 0; }
ul.plain { margin: 4px 0; padding-left: 20px; }
.empty { color: var(--muted); font-style: italic; }
.cautions { border: 2px solid var(--warn); padding: 10px 16px; background: var(--warn-wash); }
footer { padding: 12px 32px 24px; font-size: 12px; color: var(--muted); border-top: 1px solid var(--rule); }
@page { ${pageSize} margin: 14mm 13mm 16mm; }
@media print {
  html, body { background: #fff; }
  body { max-width: none; font-size: 10pt; }
  header.band { -webkit-print-color-adjust: exact; print-color-adjust: exact; padding: 12px 14px; }
  main, footer { padding-left: 0; padding-right: 0; }
  nav.toc { display: none; }
  h2, h3, h4, h5 { break-after: avoid; page-break-after: avoid; }
  figure.chart, .card, .cautions, .caution-strip, tr, table.sensitivity { break-inside: avoid; page-break-inside: avoid; }
  thead { display: table-header-group; }
  section.part.stations { break-before: page; page-break-before: always; }
  .flow { border: none; padding: 0; }
  table { font-size: 8.5pt; }
  table.stations { font-size: 7.5pt; }
  table.stations td, table.stations th { padding: 1px 3px; }
  thead th, .card, tbody tr:nth-child(even) td { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  a { color: inherit; text-decoration: none; }
}
`;
}
