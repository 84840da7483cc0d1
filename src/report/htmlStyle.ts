/** The report's one stylesheet: quiet on screen, A4/Letter-safe in print. */
import { PALETTE } from './chartStyle.js';

export const REPORT_CSS = `
:root { --ink: ${PALETTE.ink}; --muted: ${PALETTE.muted}; --rule: #d1d5db; --ok: #2e7d4f; --warn: #b3261e; --info: ${PALETTE.resistance}; }
* { box-sizing: border-box; }
html { font-size: 15px; }
body { margin: 0; color: var(--ink); background: #f6f7f9; font-family: "DejaVu Sans", "Bitstream Vera Sans", Verdana, "Segoe UI", Arial, sans-serif; line-height: 1.5; }
main { max-width: 60rem; margin: 0 auto; padding: 2rem 2.5rem 3rem; background: white; }
header h1 { font-size: 1.6rem; margin: 0 0 .25rem; line-height: 1.25; }
header p.subtitle { margin: 0 0 1rem; color: var(--muted); }
nav.toc { border-top: 1px solid var(--rule); border-bottom: 1px solid var(--rule); padding: .5rem 0; margin-bottom: 1.5rem; font-size: .9rem; }
nav.toc ol { margin: 0; padding-left: 1.4rem; columns: 2; }
nav.toc a { color: var(--info); text-decoration: none; }
h2 { font-size: 1.2rem; margin: 2rem 0 .6rem; padding-bottom: .2rem; border-bottom: 2px solid var(--ink); }
p { margin: .5rem 0 .8rem; }
ul { margin: .4rem 0 .9rem; padding-left: 1.3rem; }
li { margin: .2rem 0; }
table { border-collapse: collapse; width: 100%; margin: .6rem 0 1rem; font-size: .87rem; }
caption { caption-side: top; text-align: left; color: var(--muted); font-size: .85rem; padding-bottom: .3rem; }
th, td { border-bottom: 1px solid var(--rule); padding: .3rem .5rem; text-align: left; vertical-align: top; }
th { border-bottom: 1.5px solid var(--ink); font-weight: bold; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
td code, p code { font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: .85em; }
pre { background: #f3f4f6; padding: .6rem .8rem; overflow-x: auto; white-space: pre-wrap; word-break: break-all; font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: .85rem; }
.callout { border-left: 4px solid var(--info); background: #f1f5f9; padding: .6rem .9rem; margin: .8rem 0 1rem; }
.callout.ok { border-color: var(--ok); background: #eef7f1; }
.callout.warn { border-color: var(--warn); background: #fbefee; }
.result-box { border: 2px solid var(--info); border-radius: 4px; padding: .7rem 1rem; margin: .4rem 0 1rem; }
.result-box.ok { border-color: var(--ok); background: #eef7f1; }
.result-box.warn { border-color: var(--warn); background: #fbefee; }
.result-box .headline { font-size: 1.25rem; font-weight: 700; margin: 0 0 .5rem; }
.result-box dl { display: grid; grid-template-columns: max-content 1fr; gap: .25rem 1rem; margin: 0; }
.result-box dt { font-weight: 600; }
.result-box dd { margin: 0; }
figure { margin: 1rem 0 1.4rem; }
figure svg { display: block; max-width: 100%; height: auto; }
figure svg text { font-family: "DejaVu Sans", "Bitstream Vera Sans", Verdana, Arial, sans-serif; }
figure.sketch svg { max-width: 30rem; width: 100%; }
figcaption { color: var(--muted); font-size: .85rem; margin-top: .2rem; }
footer { margin-top: 2rem; color: var(--muted); font-size: .8rem; border-top: 1px solid var(--rule); padding-top: .5rem; }
@page { margin: 15mm 14mm 16mm; }
@media print {
  html { font-size: 10pt; }
  body { background: white; }
  main { max-width: none; margin: 0; padding: 0; }
  nav.toc { display: none; }
  h2 { break-after: avoid; page-break-after: avoid; }
  figure, table, .callout, .result-box, pre { break-inside: avoid; page-break-inside: avoid; }
  thead { display: table-header-group; }
  figure svg { max-height: 120mm; width: auto; max-width: 100%; }
  a { color: inherit; text-decoration: none; }
}
`;
