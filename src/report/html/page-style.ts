/** Styles of the HTML report: our own palette (slate ink, teal accents, amber/brick for severities). */
export const PAGE_STYLE = `
:root { --ink:#1f2a33; --muted:#5b6770; --line:#d5dde2; --accent:#1d7874; --err:#a4362b; --warn:#b7791f; --note:#3d6a8c; --bg:#fbfcfc; }
* { box-sizing: border-box; }
[hidden] { display: none !important; }
body { font: 15px/1.45 system-ui, sans-serif; color: var(--ink); background: var(--bg); margin: 0 auto; max-width: 1200px; padding: 1.5rem; }
h1 { font-size: 1.6rem; margin: 0 0 .25rem; color: var(--accent); }
h2 { font-size: 1.15rem; border-bottom: 2px solid var(--line); padding-bottom: .2rem; }
.meta { color: var(--muted); margin: 0; }
.caution { border-left: 4px solid var(--warn); background: #fff8ec; padding: .5rem .75rem; }
.summary { display: flex; gap: .75rem; flex-wrap: wrap; margin: 1rem 0; }
.tile { border: 1px solid var(--line); border-radius: 6px; padding: .5rem 1rem; background: #fff; min-width: 8rem; }
.tile .big { display: block; font-size: 1.5rem; font-weight: 600; }
.tile.err .big { color: var(--err); } .tile.warn .big { color: var(--warn); } .tile.note .big { color: var(--note); }
table.counts { border-collapse: collapse; }
table.counts td, table.counts th { border-bottom: 1px solid var(--line); padding: .25rem .75rem; text-align: left; }
td.n { text-align: right; font-variant-numeric: tabular-nums; }
#filters { display: flex; gap: 1rem; flex-wrap: wrap; margin-bottom: 1rem; }
#filters label { display: flex; flex-direction: column; font-size: .85rem; color: var(--muted); }
#filters input, #filters select { font: inherit; padding: .25rem .4rem; border: 1px solid var(--line); border-radius: 4px; }
.scroll { overflow-x: auto; }
#filters label.check { flex-direction: row; align-items: center; gap: .35rem; align-self: end; }
#empty { font-weight: 600; color: var(--err); }
#pager { display: flex; gap: .75rem; align-items: center; flex-wrap: wrap; margin: .5rem 0 1rem; }
#pager button { font: inherit; padding: .25rem .75rem; border: 1px solid var(--line); border-radius: 4px; background: #fff; }
.legend { color: var(--muted); font-size: .85rem; }
.rec { border: 1px solid var(--line); border-radius: 6px; background: #fff; margin-bottom: .75rem; padding: .75rem; display: grid; grid-template-columns: minmax(0, 320px) minmax(0, 1fr); gap: 1rem; overflow-wrap: anywhere; }
.pic { margin: 0; }
.pic figcaption { color: var(--muted); font-size: .75rem; margin-top: .2rem; }
.holder { min-height: 120px; color: var(--muted); }
svg.mol { width: 100%; height: auto; display: block; background: #fff; border: 1px solid var(--line); border-radius: 4px; }
svg.mol line, svg.mol path.wavy { stroke: var(--ink); stroke-width: 1.4; fill: none; stroke-linecap: round; }
svg.mol polygon.wedge { fill: var(--ink); }
svg.mol text { font: 13px system-ui, sans-serif; fill: var(--ink); paint-order: stroke; stroke: #fff; stroke-width: 3px; }
svg.mol text.el-O { fill: #b3261e; } svg.mol text.el-N { fill: #1f4fa3; } svg.mol text.el-S { fill: #8a6d00; }
svg.mol tspan.sub, svg.mol tspan.sup { font-size: 9px; }
svg.mol text.cip { font-size: 16px; font-weight: 700; fill: var(--accent); }
svg.mol circle.undef { fill: none; stroke: var(--warn); stroke-width: 2; stroke-dasharray: 3 2; }
svg.mol text.undef-q { font-size: 14px; font-weight: 700; fill: var(--warn); }
svg.mol text.num { font-size: 10px; fill: #6b5b95; }
b.cip { color: var(--accent); }
.undef-mark { border-bottom: 2px dashed var(--warn); }
.side .word { color: var(--muted); }
.side .undef { display: block; color: var(--warn); font-weight: 600; }
.line { color: var(--muted); }
.rec h3 { margin: 0 0 .25rem; font-size: 1rem; }
.rec .file { color: var(--muted); font-size: .85rem; }
.nodepict { max-width: 250px; padding: 2rem 0; text-align: center; color: var(--muted); border: 1px dashed var(--line); border-radius: 4px; }
.side { display: grid; grid-template-columns: minmax(0, 1fr) minmax(0, 1fr); gap: .5rem; margin: .5rem 0; }
.side div { background: #f3f6f7; border-radius: 4px; padding: .4rem .6rem; }
.side b { display: block; font-size: .8rem; color: var(--muted); font-weight: 600; }
ul.findings { margin: .25rem 0 0; padding-left: 1.1rem; }
.sev { font-weight: 600; text-transform: uppercase; font-size: .75rem; letter-spacing: .03em; margin-right: .35rem; }
.sev-error { color: var(--err); } .sev-warning { color: var(--warn); } .sev-note { color: var(--note); }
.sev-notrun { color: var(--muted); }
.waived { color: var(--muted); text-decoration: line-through; }
@media (max-width: 640px) {
  body { padding: .5rem; font-size: 14px; }
  .rec { grid-template-columns: minmax(0, 1fr); padding: .5rem; }
  .side { grid-template-columns: minmax(0, 1fr); }
  .tile { min-width: 6rem; padding: .4rem .6rem; }
  #filters { gap: .5rem; }
  #filters label { flex: 1 1 10rem; }
}
`;
