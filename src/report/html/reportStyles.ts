/** The report's stylesheet: system fonts only, tabular figures, and print rules for A4 and Letter. */
export const REPORT_STYLES = `
:root { --ink: #1d2430; --muted: #5a6372; --rule: #d5d9e0; --panel: #f3f5f8; --accent: #0072B2; --warn: #D55E00; }
* { box-sizing: border-box; }
body { margin: 0; color: var(--ink); background: #fff; font: 15px/1.45 system-ui, -apple-system, "Segoe UI", "Helvetica Neue", Arial, sans-serif; }
main { max-width: 1060px; margin: 0 auto; padding: 28px 28px 60px; }
header.report-head { border-bottom: 3px solid var(--ink); padding-bottom: 10px; margin-bottom: 18px; }
header.report-head h1 { font-size: 26px; margin: 0 0 4px; }
header.report-head p { margin: 0; color: var(--muted); }
h2 { font-size: 20px; margin: 34px 0 10px; padding-bottom: 4px; border-bottom: 1px solid var(--rule); }
h3 { font-size: 16px; margin: 20px 0 8px; }
p.lead { font-size: 16px; }
.note, .source, .figure-note, .hint, caption { color: var(--muted); font-size: 13px; }
.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.figures { display: grid; grid-template-columns: repeat(3, 1fr); gap: 10px; }
.figure { background: var(--panel); border-left: 4px solid var(--accent); padding: 10px 12px; }
.figure-label { font-size: 13px; color: var(--muted); text-transform: uppercase; letter-spacing: 0.04em; }
.figure-value { font-size: 24px; font-weight: 650; font-variant-numeric: tabular-nums; }
.unit { font-size: 13px; font-weight: 400; color: var(--muted); }
.gain { background: var(--panel); padding: 4px 12px; margin: 12px 0; }
.gain p { margin: 6px 0; }
.cautions { border: 2px solid var(--warn); background: #fff7f0; padding: 4px 16px 8px; margin: 18px 0; }
.cautions h2 { border: 0; margin: 8px 0 4px; color: var(--warn); font-size: 18px; }
.cautions ul { margin: 4px 0; padding-left: 20px; }
table.list { width: 100%; border-collapse: collapse; font-size: 14px; margin: 8px 0; }
table.list th { text-align: left; font-size: 12px; text-transform: uppercase; letter-spacing: 0.03em; color: var(--muted); border-bottom: 2px solid var(--ink); padding: 6px 6px; vertical-align: bottom; }
table.list td { padding: 5px 6px; vertical-align: top; }
table.list tbody.project { border-bottom: 1px solid var(--rule); }
table.list tr.reason td { padding-top: 0; color: var(--muted); font-size: 13px; font-style: italic; }
table.list tfoot td { border-top: 2px solid var(--ink); font-weight: 650; padding-top: 6px; }
table.compact { font-size: 13px; }
table.compact td, table.compact th { padding: 3px 6px; }
table.levels { max-width: 620px; }
table.levels tbody tr:nth-child(even), table.costs tr:nth-child(even) { background: var(--panel); }
table.costs { max-width: 460px; }
tr.chosen-row td { font-weight: 650; }
caption { text-align: left; padding-bottom: 4px; }
td.treatments { width: 30%; }
#capital-list td:first-child, #not-funded td:first-child { min-width: 11em; }
table.list th.num { white-space: normal; }
table.ranking tbody th { text-transform: none; letter-spacing: normal; font-size: inherit; color: inherit; font-weight: normal; vertical-align: top; }
table.ranking tbody th, table.ranking tbody td { border-bottom: 1px solid var(--rule); }
.site-id { font-weight: 650; font-variant-numeric: tabular-nums; white-space: nowrap; }
.tag { font-size: 11px; border: 1px solid var(--ink); padding: 0 4px; border-radius: 3px; white-space: nowrap; }
.tag.flag { border-color: var(--warn); color: var(--warn); }
td.selection .class-label { font-size: 11px; color: var(--muted); }
td.selection.core .class-label { color: var(--ink); font-weight: 650; }
td.selection.rare .class-label { color: var(--warn); }
figure.tornado svg { width: 100%; height: auto; display: block; }
figure { margin: 8px 0; }
svg.chart, svg.map { width: 100%; height: auto; display: block; }
svg text { font-family: inherit; fill: var(--ink); }
svg .tick { font-size: 11px; fill: var(--muted); }
svg .axis-label { font-size: 12px; }
svg .axis { stroke: var(--ink); }
svg .grid { stroke: var(--rule); }
svg .chosen { stroke-dasharray: 5 4; stroke-width: 1.5; }
svg .chosen-label { font-size: 12px; font-weight: 650; }
svg .district { font-size: 17px; font-weight: 650; letter-spacing: 0.12em; text-transform: uppercase; fill: #9aa2ae; }
svg .legend { font-size: 12px; }
.slider-panel { background: var(--panel); padding: 12px 14px; margin: 10px 0 14px; }
.slider-panel label { font-weight: 650; }
#budget-slider { width: 100%; margin: 8px 0; }
.slider-list { max-height: 380px; overflow: auto; background: #fff; }
.change { font-size: 12px; font-weight: 650; }
#slider-budget { font-size: 20px; font-weight: 650; font-variant-numeric: tabular-nums; }
.slider-totals { display: grid; grid-template-columns: repeat(4, 1fr); gap: 6px 12px; margin: 8px 0; }
.slider-totals dt { font-size: 12px; color: var(--muted); }
.slider-totals dd { margin: 0; font-weight: 650; font-variant-numeric: tabular-nums; }
dl.assumptions { display: grid; grid-template-columns: 190px 1fr; gap: 4px 14px; }
dl.assumptions dt { font-weight: 650; }
dl.assumptions dd { margin: 0; }
ul.sources li, ul.warnings li { margin-bottom: 4px; font-size: 14px; }
.where { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; font-size: 12px; }
a { color: var(--accent); }
@media (max-width: 760px) { .figures { grid-template-columns: repeat(2, 1fr); } .slider-totals { grid-template-columns: repeat(2, 1fr); } }
@page { margin: 14mm 12mm; }
@media print {
  body { font-size: 10pt; }
  main { max-width: none; padding: 0; }
  .screen-only { display: none !important; }
  h2 { font-size: 14pt; }
  table.list, table.compact { font-size: 8.5pt; }
  table.list th { font-size: 7.5pt; }
  table.list tr.reason td { font-size: 8pt; }
  .figure-value { font-size: 15pt; }
  h2 { break-after: avoid; page-break-after: avoid; }
  figure, .figures, .cautions, tbody.project, tr { break-inside: avoid; page-break-inside: avoid; }
  thead { display: table-header-group; }
  .figure, .slider-panel, .cautions { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  a { color: inherit; text-decoration: none; }
}
`;
