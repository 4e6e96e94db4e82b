import { asMime } from '../../lib/display.js';
import { eventDisplay, histogramFigure } from '../../lib/plot/index.js';
import type { Notebook } from '../../kernel/notebook/types.js';
import type { ReportInput } from '../../kernel/report/types.js';

/** A hostile string as it could arrive in a CSV label or a markdown cell. */
export const XSS = '<script>window.__sgXss = (window.__sgXss || 0) + 1</script><img src=x onerror="window.__sgXss = 99">';

/** An executed notebook with every output kind, a failure, a skipped cell and XSS payloads. */
export function executedFixture(): ReportInput {
  const fig = histogramFigure([0.41, 0.52, 0.55, 0.61, 0.62, 0.66, 0.7, 0.74, 0.81, 0.93], { title: `Momenta ${XSS}`, xTitle: 'p_T [GeV/c]', bins: 6 });
  const ev = eventDisplay({ xM: [0, 0.1, 0.2, 0.3], yM: [0, 0.005, 0.02, 0.045], track: [0, 0, 0, 0] }, [{ centerXM: 0, centerYM: 1, radiusM: 1, charge: 1, label: XSS }], { fieldT: 0.5 });
  const t0 = '2026-12-02T01:00:00.000Z';
  const nb: Notebook = {
    nbformat: 4,
    nbformat_minor: 5,
    metadata: {},
    cells: [
      { id: 'md1', cell_type: 'markdown', metadata: {}, source: `# Chamber check\n\nRadius from sagitta: $R = \\frac{L^2}{8s} + \\frac{s}{2}$.\n\n$$p_T = 0.3\\,B\\,R$$\n\n${XSS}\n\n<a href="javascript:window.__sgXss=5">bad link</a>` },
      { id: 'c1', cell_type: 'code', metadata: { sagitta: { outcome: 'done', wallMs: 12, startedAt: t0 } }, execution_count: 1, source: 'console.log("hello <b>"); // ' + 'a long comment that must wrap when printed, '.repeat(6), outputs: [{ output_type: 'stream', name: 'stdout', text: 'hello <b>\n' }] },
      { id: 'c2', cell_type: 'code', metadata: { sagitta: { outcome: 'done', wallMs: 40, startedAt: t0 } }, execution_count: 2, source: 'present(fig)', outputs: [{ output_type: 'display_data', data: fig[asMime](), metadata: {} }] },
      { id: 'c3', cell_type: 'code', metadata: { sagitta: { outcome: 'done', wallMs: 8, startedAt: t0 } }, execution_count: 3, source: 'table', outputs: [{ output_type: 'execute_result', execution_count: 3, metadata: {}, data: { 'text/html': `<table><tr><th>label</th></tr><tr><td>${XSS}</td></tr></table><iframe src="https://example.org"></iframe>`, 'text/plain': 'label' } }] },
      { id: 'c4', cell_type: 'code', metadata: { sagitta: { outcome: 'done', wallMs: 9, startedAt: t0 } }, execution_count: 4, source: 'present(ev)', outputs: [{ output_type: 'display_data', data: ev[asMime](), metadata: {} }] },
      { id: 'c5', cell_type: 'code', metadata: { sagitta: { outcome: 'failed', wallMs: 3, startedAt: t0 } }, execution_count: 5, source: 'throw new RangeError("bad <field>")', outputs: [{ output_type: 'error', ename: 'RangeError', evalue: 'bad <field>', traceback: ['\u001b[31mRangeError: bad <field>\u001b[0m', '    at step 5, line 1, column 7'] }] },
      { id: 'c6', cell_type: 'code', metadata: { sagitta: { outcome: 'not-run' } }, execution_count: null, source: 'later()', outputs: [] },
    ],
  };
  return {
    notebook: nb,
    run: {
      source: { path: 'check.ipynb', sha256: 'a'.repeat(64), sizeBytes: 2048 },
      startedAt: t0,
      wallMs: 72,
      status: 'errors',
      reason: 'step 5 failed: RangeError: bad <field>',
      knobs: [
        { name: 'field', kind: 'quantity', defaultText: '1.5 T', valueText: '0.5 T', supplied: true, dimension: 'field', internalUnit: 'T' },
        { name: 'label', kind: 'text', defaultText: 'none', valueText: XSS, supplied: true },
      ],
      inputs: [
        { path: `data/hits${XSS}.csv`, sizeBytes: 1234, sha256: 'b'.repeat(64), simulated: { runRecord: 'data/hits.run.json', seed: 20260401, scenario: 'check' } },
        { path: 'data/field-map.csv', sizeBytes: 99, sha256: 'c'.repeat(64) },
      ],
      seeds: [{ seed: 7, label: 'simulate' }],
      usesStoppingPower: true,
      modules: [{ path: 'helpers.ts', sha256: 'd'.repeat(64), sizeBytes: 321 }],
      library: { version: '0.1.0', commit: 'e'.repeat(40), lockfileSha256: 'f'.repeat(64) },
      versions: { node: '20.19.0', cellCompiler: '5.0.4' },
    },
  };
}
