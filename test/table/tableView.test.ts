import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { asMime, mimeBundleOf } from '../../lib/display.js';
import { provenanceSnapshot, resetProvenance } from '../../lib/provenance.js';
import { columnHeading, formatMeasured, tableView, TABLE_CAUTION } from '../../lib/table/index.js';
import type { ColumnTable } from '../../lib/io/columnTable.js';

const tracks: ColumnTable = {
  rows: 4,
  columns: [
    { name: 'event', values: Float64Array.from([7, 7, 8, 9]), digits: 0 },
    { name: 'track', values: Float64Array.from([1, 2, 1, 1]), digits: 0 },
    { name: 'pt_GeV_c', values: Float64Array.from([0.51234, 1.2, 0.0871, NaN]) },
    { name: 'sigma_pt_GeV_c', values: Float64Array.from([0.01347, 0.061, 0.00042, NaN]), digits: 4 },
    { name: 'status', values: ['ok', 'ok', 'ok', 'too-few-hits'] },
  ],
};

describe('formatMeasured (error to two significant digits, value to the same place; common practice)', () => {
  it('0.51234 ± 0.01347 → 0.512 ± 0.013', () => expect(formatMeasured(0.51234, 0.01347)).toBe('0.512 ± 0.013'));
  it('938.272 ± 0.0000058 keeps the value\'s digits to the error\'s place', () => expect(formatMeasured(938.27208816, 0.00000029)).toBe('938.27208816 ± 0.00000029'));
  it('a negative value uses the minus sign', () => expect(formatMeasured(-0.0123, 0.0011)).toBe('−0.0123 ± 0.0011'));
  it('no finite error: the value alone, four significant digits', () => expect(formatMeasured(0.000751227, NaN)).toBe('0.0007512'));
});

describe('columnHeading (units from the snake_case suffix)', () => {
  it('pt_GeV_c → p_T in GeV/c', () => expect(columnHeading('pt_GeV_c')).toEqual({ html: 'p<sub>T</sub>', text: 'pT', unit: 'GeV/c' }));
  it('csda_range_g_cm2 → g/cm²', () => expect(columnHeading('csda_range_g_cm2').unit).toBe('g/cm²'));
  it('a name without a unit suffix has none', () => expect(columnHeading('status').unit).toBe(''));
});

describe('tableView', () => {
  it('rows are headed by event and track; σ folds into value ± error; units under the heading', () => {
    const html = String(tableView(tracks, { noun: 'track' })[asMime]()['text/html']);
    expect(html).toContain('<tr><th scope="row">7</th><th scope="row">1</th><td class="sg-num">0.512 ± 0.013</td><td>ok</td></tr>');
    expect(html).toContain('p<sub>T</sub><br><span class="sg-unit">[GeV/c]</span>');
    expect(html).not.toContain('sigma');
    expect(html).toContain('<caption>4 tracks</caption>');
  });
  it('where / sortBy / first / columns select rows and columns, and the caption says how many of how many', () => {
    const v = tableView(tracks, { noun: 'track' }).where((t) => t.status === 'ok').sortBy('pt_GeV_c', 'descending').first(2).columns('status');
    expect(Array.from(v.rows)).toEqual([1, 0]);
    expect(v.names).toEqual(['status']);
    expect(String(v[asMime]()['text/plain']).split('\n')[0]).toBe('2 of 4 tracks');
  });
  it('sortBy puts NaN last in either order', () => {
    expect(Array.from(tableView(tracks).sortBy('pt_GeV_c').rows)).toEqual([2, 0, 1, 3]);
    expect(Array.from(tableView(tracks).sortBy('pt_GeV_c', 'descending').rows)).toEqual([1, 0, 2, 3]);
  });
  it('an unknown column is a SagittaError naming the columns there are', () => {
    expect(() => tableView(tracks).columns('momentum')).toThrow(/pt_GeV_c/);
  });
  it('a long table shows its first rows and says so', () => {
    const long = tableView({ rows: 50, columns: [{ name: 'event', values: Float64Array.from({ length: 50 }, (_, i) => i), digits: 0 }] }, { noun: 'event', shown: 5 });
    const text = String(long[asMime]()['text/plain']);
    expect(text.split('\n')[0]).toBe('50 events — the first 5 shown (.first(n), .where(…) pick others)');
    expect(text.split('\n')).toHaveLength(1 + 1 + 5);
  });
  it('plain arrays of objects display as the same table (no DataFrame library loaded)', () => {
    const b = mimeBundleOf([{ peak: 1, m_over_q_u: 3.98921, sigma_m_over_q_u: 0.00213 }, { peak: 2, m_over_q_u: 6.0151, sigma_m_over_q_u: 0.0031 }]);
    expect(String(b['text/html'])).toContain('<th scope="row">1</th><td class="sg-num">3.9892 ± 0.0021</td>');
    // danfojs is CommonJS, loaded through createRequire wherever it is used: it would sit in this cache.
    expect(Object.keys(createRequire(import.meta.url).cache).some((k) => k.includes('danfojs'))).toBe(false);
  });
  it('a table of ranges carries the clinical caution and records it for the report', () => {
    resetProvenance();
    const b = mimeBundleOf([{ kinetic_energy_MeV: 100, csda_range_g_cm2: 7.718 }]);
    expect(String(b['text/plain'])).toContain(TABLE_CAUTION);
    expect(String(b['text/html'])).toContain('<tfoot>');
    expect(provenanceSnapshot().cautions).toEqual(['stopping-power']);
    resetProvenance();
    mimeBundleOf([{ event: 1, pt_GeV_c: 0.5 }]);
    expect(provenanceSnapshot().cautions).toEqual([]);
  });
  it('text cells are escaped in HTML', () => {
    expect(String(mimeBundleOf([{ label: '<script>x</script>' }])['text/html'])).toContain('&lt;script&gt;x&lt;/script&gt;');
  });
});
