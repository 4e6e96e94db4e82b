/**
 * The report's stylesheet: Sagitta's own "analysis record" look — a single reading column on warm
 * paper, cells as numbered entries with their run time in a side note, code on a dark ink panel
 * that folds away, a copper rule for failures and a closing provenance card.
 */
export const REPORT_CSS = `
:root {
  --ink: #1d2433; --muted: #6b7280; --paper: #fbfaf7; --card: #ffffff; --rule: #e6e1d6;
  --copper: #c2571a; --teal: #2f6f73; --code-bg: #1f2636; --code-ink: #e8e4da; --fail: #a3321a; --fail-bg: #fbeee8;
  --mono: "JetBrains Mono", "DejaVu Sans Mono", Menlo, Consolas, monospace;
  --sans: "Source Sans 3", "Segoe UI", "Helvetica Neue", Arial, sans-serif;
  --serif: "Source Serif 4", Georgia, "DejaVu Serif", serif;
}
* { box-sizing: border-box; }
html { background: var(--paper); color: var(--ink); }
body { margin: 0; font: 16px/1.55 var(--serif); }
.sg-sheet { max-width: 58rem; margin: 0 auto; padding: 0 1.5rem 4rem; }
.sg-masthead { border-bottom: 3px double var(--ink); padding: 2.2rem 0 1rem; margin-bottom: 1.5rem; }
.sg-kicker { font: 600 0.78rem/1 var(--sans); letter-spacing: 0.14em; text-transform: uppercase; color: var(--copper); }
.sg-masthead h1 { font: 600 2.1rem/1.2 var(--serif); margin: 0.4rem 0 0.8rem; }
.sg-runline { display: flex; flex-wrap: wrap; gap: 0.4rem 1.4rem; margin: 0; font: 0.9rem/1.4 var(--sans); color: var(--muted); }
.sg-runline div { display: flex; gap: 0.35rem; }
.sg-runline dt { font-weight: 600; color: var(--ink); }
.sg-runline dd { margin: 0; }
.sg-state { font: 600 0.78rem/1 var(--sans); padding: 0.25rem 0.55rem; border-radius: 0.2rem; color: #fff; background: var(--teal); }
.sg-state.sg-bad { background: var(--fail); }
.sg-reason { margin: 0.7rem 0 0; font: 0.95rem/1.4 var(--sans); color: var(--fail); }
.sg-tools { margin-top: 0.9rem; }
.sg-tools button { font: 600 0.8rem/1 var(--sans); color: var(--ink); background: transparent; border: 1px solid var(--ink); border-radius: 0.2rem; padding: 0.4rem 0.7rem; cursor: pointer; }
.sg-entry { position: relative; margin: 0 0 1.4rem; }
.sg-note { position: absolute; left: 100%; top: 0.2rem; width: 7rem; margin-left: 1rem; font: 0.75rem/1.3 var(--sans); color: var(--muted); }
.sg-note b { display: block; color: var(--ink); font-size: 0.85rem; }
@media (max-width: 75rem) { .sg-note { position: static; width: auto; margin: 0 0 0.3rem; display: flex; gap: 0.6rem; } .sg-note b { display: inline; } }
.sg-prose h1, .sg-prose h2, .sg-prose h3 { font-family: var(--serif); line-height: 1.25; margin: 1.6rem 0 0.6rem; }
.sg-prose h1 { font-size: 1.6rem; } .sg-prose h2 { font-size: 1.3rem; border-bottom: 1px solid var(--rule); padding-bottom: 0.2rem; }
.sg-prose code { font: 0.88em var(--mono); background: #f1ede4; padding: 0.05em 0.3em; border-radius: 0.2em; }
.sg-prose table, .sg-html table { border-collapse: collapse; font: 0.88rem/1.35 var(--sans); margin: 0.6rem 0; }
.sg-prose th, .sg-prose td, .sg-html th, .sg-html td { border-bottom: 1px solid var(--rule); padding: 0.3rem 0.7rem; text-align: right; }
.sg-prose th, .sg-html th { font-weight: 600; border-bottom: 1.5px solid var(--ink); }
.sg-html tbody th { border-bottom: 1px solid var(--rule); color: var(--muted); font-weight: 400; }
.sg-html caption { caption-side: bottom; text-align: left; color: var(--muted); font-size: 0.8rem; padding-top: 0.3rem; }
.sg-html table.sagitta-table caption { caption-side: top; padding: 0 0 0.3rem; }
.sg-html .sg-unit { color: var(--muted); font-weight: 400; font-size: 0.8em; }
.sg-html td.sg-num { font-variant-numeric: tabular-nums; white-space: nowrap; }
.sg-html td:not(.sg-num) { text-align: left; }
.sg-html tfoot td { color: var(--muted); font-size: 0.8rem; text-align: left; border-bottom: none; }
.sg-html { overflow-x: auto; }
.sg-prose blockquote { margin: 0.8rem 0; padding: 0.4rem 1rem; border-left: 3px solid var(--copper); background: #f6efe6; }
.sg-math { overflow-x: auto; overflow-y: hidden; margin: 0.6rem 0; padding: 0.15rem 0; }
.sg-math math[display="block"] { margin: 0; }
math { font-size: 1.08em; }
.sg-code > details { background: var(--code-bg); color: var(--code-ink); border-radius: 0.3rem; }
.sg-code > details > summary { font: 0.75rem/1 var(--sans); letter-spacing: 0.06em; text-transform: uppercase; color: #a9b1c3; padding: 0.55rem 0.8rem; cursor: pointer; user-select: none; }
.sg-code > details > pre { margin: 0; padding: 0 0.9rem 0.8rem; overflow-x: auto; font: 0.84rem/1.5 var(--mono); white-space: pre; }
body.sg-hide-code .sg-code > details { display: none; }
.sg-code .sg-c { color: #8d96a8; font-style: italic; }
.sg-code .sg-s { color: #e0b27a; }
.sg-code .sg-n { color: #9fd3c7; }
.sg-code .sg-k { color: #f0a07a; }
.sg-injected > details { border-left: 4px solid var(--copper); }
.sg-outputs { margin-top: 0.5rem; }
.sg-out { margin: 0.4rem 0; }
pre.sg-out { font: 0.84rem/1.45 var(--mono); white-space: pre-wrap; word-break: break-word; padding: 0.3rem 0 0.3rem 0.8rem; border-left: 2px solid var(--rule); }
pre.sg-stderr { border-left-color: var(--copper); color: #7a3a12; }
.sg-error { background: var(--fail-bg); border-left: 4px solid var(--fail); padding: 0.5rem 0.8rem; font: 0.9rem/1.4 var(--sans); }
.sg-error pre { font: 0.8rem/1.45 var(--mono); white-space: pre-wrap; margin: 0.4rem 0 0; color: #5a2412; }
.sg-image { max-width: 100%; height: auto; display: block; }
.sg-figure { background: var(--card); border: 1px solid var(--rule); min-height: 2rem; }
.sg-figure-text { position: absolute; width: 1px; height: 1px; overflow: hidden; clip-path: inset(50%); white-space: pre; margin: 0; }
.sg-figure { position: relative; }
.sg-figure-fallback { margin: 0; padding: 0.6rem; font: 0.8rem var(--mono); color: var(--muted); }
.sg-skipped { opacity: 0.55; }
.sg-failed { color: var(--fail); font-weight: 600; }
.sg-missing-image { font: 0.85rem var(--sans); color: var(--muted); border: 1px dashed var(--rule); padding: 0.1rem 0.4rem; }
.sg-skipped .sg-note b::after { content: " · not run"; color: var(--fail); }
.sg-card { margin-top: 3rem; border: 1px solid var(--ink); background: var(--card); padding: 1.2rem 1.4rem; font: 0.88rem/1.45 var(--sans); }
.sg-card h2 { font: 600 0.8rem/1 var(--sans); letter-spacing: 0.14em; text-transform: uppercase; color: var(--copper); margin: 0 0 0.9rem; }
.sg-card h3 { font: 600 0.9rem/1.2 var(--sans); margin: 1.1rem 0 0.4rem; }
.sg-card table { border-collapse: collapse; width: 100%; }
.sg-card th, .sg-card td { text-align: left; padding: 0.2rem 0.6rem 0.2rem 0; border-bottom: 1px solid var(--rule); vertical-align: top; }
.sg-banner { font: 0.92rem/1.45 var(--sans); padding: 0.6rem 0.9rem; margin: 0 0 1.2rem; border-left: 4px solid var(--teal); background: #eef4f3; }
.sg-caution { border-left-color: var(--copper); background: #f6efe6; }
.sg-sim { color: var(--teal); }
.sg-muted { color: var(--muted); }
.js-plotly-plot .modebar { opacity: 0.6; }
.sg-card td.sg-num { text-align: right; font-variant-numeric: tabular-nums; }
.sg-hash { font: 0.78rem var(--mono); word-break: break-all; }
.sg-foot { margin-top: 1.4rem; font: 0.78rem/1.4 var(--sans); color: var(--muted); }
@media print {
  html, body { background: #fff; }
  .sg-tools { display: none; }
  .sg-note { position: static; width: auto; margin: 0 0 0.3rem; display: flex; gap: 0.6rem; }
  .sg-note b { display: inline; }
  .sg-entry, .sg-figure, .sg-image { break-inside: avoid; }
  .sg-code > details > pre { white-space: pre-wrap; overflow-wrap: anywhere; overflow: visible; }
  pre.sg-out, .sg-error pre { overflow-wrap: anywhere; }
  .js-plotly-plot .modebar { display: none !important; }
}
`;
