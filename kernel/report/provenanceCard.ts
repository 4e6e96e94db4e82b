import { escapeHtml } from '../../lib/internal.js';
import type { Cell, SagittaCellMeta } from '../notebook/types.js';
import type { RunRecord } from '../runner/runRecord.js';
import { formatBytes, formatMs } from './formatNumbers.js';

const rows = (r: string[][]) => r.map((cols) => `<tr>${cols.join('')}</tr>`).join('');
const td = (v: string, cls = '') => `<td${cls ? ` class="${cls}"` : ''}>${v}</td>`;
const table = (head: string[], body: string[][]) => `<table><thead><tr>${head.map((h) => `<th>${h}</th>`).join('')}</tr></thead><tbody>${rows(body)}</tbody></table>`;

/**
 * The closing card: everything that shaped the result — the notebook's bytes, the library
 * (version, commit, lockfile), the compiler that compiled the cells, the knobs and their values,
 * the data files (simulated ones marked, with their seeds), local modules, seeds and each step's
 * timing. Paths are relative to the notebook; no absolute path appears.
 */
export function provenanceCard(run: RunRecord, cells: readonly Cell[]): string {
  const steps = cells
    .filter((c) => c.cell_type === 'code')
    .map((c, k) => ({ step: k + 1, m: (c.metadata.sagitta ?? {}) as SagittaCellMeta }));
  const lib = run.library;
  const seeds = [
    ...run.seeds.map((s) => [td(escapeHtml(s.label)), td(escapeHtml(String(s.seed)), 'sg-hash')]),
    ...run.inputs.filter((f) => f.simulated?.seed !== undefined).map((f) => [td(`${escapeHtml(f.path)} (simulated; run record ${escapeHtml(f.simulated!.runRecord)})`), td(escapeHtml(String(f.simulated!.seed)), 'sg-hash')]),
  ];
  return `<section class="sg-card" aria-label="Provenance">
<h2>Provenance</h2>
<table><tbody>${rows([
    [td('Notebook'), td(`${escapeHtml(run.source.path)} (${formatBytes(run.source.sizeBytes)})`)],
    [td('Notebook SHA-256'), td(escapeHtml(run.source.sha256), 'sg-hash')],
    [td('Started'), td(escapeHtml(run.startedAt))],
    [td('Wall time'), td(formatMs(run.wallMs))],
    [td('Library'), td(`Sagitta ${escapeHtml(lib.version)}${lib.commit ? ` · commit <span class="sg-hash">${escapeHtml(lib.commit)}</span>` : ' · not a git checkout'}`)],
    [td('Lockfile SHA-256'), td(lib.lockfileSha256 ? escapeHtml(lib.lockfileSha256) : '—', 'sg-hash')],
    [td('Cells compiled by'), td(`TypeScript ${escapeHtml(run.versions.cellCompiler)} · run on Node.js ${escapeHtml(run.versions.node)}`)],
  ])}</tbody></table>
<h3>Knobs</h3>
${run.knobs.length === 0 ? '<p>The notebook declares no knobs.</p>' : table(['knob', 'value used', 'default', 'set by'], run.knobs.map((k) => [
    td(escapeHtml(k.name)),
    td(escapeHtml(k.valueText) + (k.internalUnit ? ` <span class="sg-muted">(used in ${escapeHtml(k.internalUnit)})</span>` : ''), 'sg-hash'),
    td(escapeHtml(k.defaultText), 'sg-hash'),
    td(k.supplied ? 'this run (--set)' : 'the notebook'),
  ]))}
<h3>Data files read</h3>
${run.inputs.length === 0 ? '<p>None recorded.</p>' : table(['file', 'size', 'origin', 'SHA-256'], run.inputs.map((f) => [
    td(escapeHtml(f.path)), td(formatBytes(f.sizeBytes), 'sg-num'),
    td(f.simulated ? `<b class="sg-sim">simulated</b>${f.simulated.scenario ? ` (${escapeHtml(f.simulated.scenario)})` : ''}` : 'as given'),
    td(escapeHtml(f.sha256), 'sg-hash'),
  ]))}
<h3>Local modules imported</h3>
${run.modules.length === 0 ? '<p>None.</p>' : table(['module', 'size', 'SHA-256'], run.modules.map((f) => [td(escapeHtml(f.path)), td(formatBytes(f.sizeBytes), 'sg-num'), td(escapeHtml(f.sha256), 'sg-hash')]))}
<h3>Seeds</h3>
${seeds.length === 0 ? '<p>None recorded.</p>' : table(['used by', 'seed'], seeds)}
<h3>Steps</h3>
${table(['step', 'started', 'wall time', 'outcome'], steps.map(({ step, m }) => [
    td(String(step), 'sg-num'),
    td(escapeHtml(m.startedAt ?? '—')),
    td(m.wallMs !== undefined ? formatMs(m.wallMs) : '—', 'sg-num'),
    td(escapeHtml(m.outcome ?? '—')),
  ]))}
<p class="sg-foot">Written by Sagitta ${escapeHtml(lib.version)}. Hashes let a reader check that the same notebook, modules and data files give this record.</p>
</section>`;
}
