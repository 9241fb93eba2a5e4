#include "report/html_style.h"

namespace planner {

const char* HtmlReportStyle() {
  // Fonts are ones a system already has: the page must open without network.
  return R"css(
:root { --ink: #1a1a1a; --muted: #555; --rule: #c9c9c9; --blue: #1f4e86; --orange: #b35a00; }
* { box-sizing: border-box; -webkit-print-color-adjust: exact; print-color-adjust: exact; }
body { font-family: "DejaVu Sans", "Liberation Sans", Arial, Helvetica, sans-serif;
  color: var(--ink); background: #fff; max-width: 980px; margin: 0 auto;
  padding: 24px 28px 48px; line-height: 1.45; font-size: 15px; }
header.report { border-bottom: 3px solid var(--blue); padding-bottom: 6px; }
h1 { font-size: 24px; margin: 0 0 4px; }
h2 { font-size: 19px; margin: 30px 0 8px; border-bottom: 1px solid var(--rule);
  padding-bottom: 3px; }
h3 { font-size: 16px; margin: 18px 0 6px; }
p { margin: 6px 0; max-width: 52em; }
.meta { color: var(--muted); margin: 2px 0; }
.keys { display: flex; gap: 12px; flex-wrap: wrap; margin: 12px 0 14px; }
.key { flex: 1 1 0; min-width: 180px; border: 1px solid var(--rule);
  border-top: 4px solid var(--blue); padding: 8px 12px; background: #f4f7fb; }
.key p { margin: 0; }
.key-name { font-size: 13px; color: var(--muted); }
.key-date { font-size: 26px; font-weight: bold; font-variant-numeric: tabular-nums; }
.key-detail, .key-cost { font-size: 13.5px; }
ul.facts { padding-left: 20px; max-width: 52em; }
ul.facts li { margin: 5px 0; }
figure { margin: 12px 0 18px; }
figure svg { width: 100%; height: auto; max-width: 760px; display: block; }
figcaption { font-size: 13px; color: var(--muted); margin-top: 4px; max-width: 760px; }
table { border-collapse: collapse; margin: 8px 0 16px; font-size: 13.5px;
  font-variant-numeric: tabular-nums; }
th, td { border-bottom: 1px solid var(--rule); padding: 4px 10px; text-align: left;
  vertical-align: top; }
th { background: #eef2f7; font-weight: 600; }
th.num { text-align: right; }
td.num { text-align: right; white-space: nowrap; }
td.label { white-space: nowrap; }
td.scenario { min-width: 14em; }
tr.bottleneck-row td { font-weight: bold; }
table.dates td { white-space: nowrap; }
table.inputs th { background: none; white-space: nowrap; }
th.nowrap { white-space: nowrap; }
code { font-family: "DejaVu Sans Mono", "Liberation Mono", monospace; font-size: 13px;
  overflow-wrap: anywhere; }
.note { color: var(--muted); font-size: 13.5px; }
footer { margin-top: 28px; border-top: 1px solid var(--rule); color: var(--muted);
  font-size: 13px; padding-top: 6px; }
svg text { font-family: inherit; font-size: 12px; fill: #222; }
svg .axis-title { font-size: 12.5px; font-weight: 600; }
svg .axis, svg .tick { stroke: #222; stroke-width: 1; }
svg .grid { stroke: #dedede; stroke-width: 1; }
svg .curve { fill: none; stroke: var(--blue); stroke-width: 2.2; }
svg .band { fill: #9dbddf; fill-opacity: 0.6; stroke: none; }
svg .quantile { stroke: #444; stroke-width: 1.2; stroke-dasharray: 5 3; }
svg .deadline { stroke: var(--orange); stroke-width: 2; }
svg .deadline-label { fill: var(--orange); font-weight: 600; }
svg .dot { fill: #fff; stroke: var(--blue); stroke-width: 2; }
svg .strong { font-weight: 600; }
svg .legend-box { fill: #fff; fill-opacity: 0.92; stroke: #c9c9c9; }
svg .series { fill: none; stroke-width: 1.8; }
svg .s0 { stroke: var(--blue); }
svg .s1 { stroke: var(--orange); stroke-dasharray: 7 3; }
svg .s2 { stroke: #444; stroke-dasharray: 2 3; }
svg .pt { stroke-dasharray: none; stroke-width: 1; }
svg .pt.s0 { fill: var(--blue); }
svg .pt.s1 { fill: var(--orange); }
svg .pt.s2 { fill: #444; }
svg .range { stroke: #9a9a9a; stroke-width: 3; }
svg .cell-text { fill: #111; }
svg .cell-text.light { fill: #fff; }
svg .small { font-size: 11px; }
svg .muted { fill: #888; }
svg .no-cell { fill: #fff; stroke: #c9c9c9; stroke-dasharray: 2 2; }
svg .optional-mark { fill: none; stroke: #111; stroke-width: 1.3; stroke-dasharray: 4 3; }
svg .optional-mark.light { stroke: #fff; }
svg .bottleneck { fill: none; stroke: #000; stroke-width: 3.5; }
@page { size: A4; margin: 14mm; }
@media print {
  body { max-width: none; padding: 0; font-size: 10.5pt; }
  section.page { break-before: page; }
  figure, table, .keys, tr { break-inside: avoid; }
  table { font-size: 9pt; }
  th, td { padding: 3px 6px; }
  td.label { white-space: normal; }
  h2, h3 { break-after: avoid; }
}
)css";
}

}  // namespace planner
