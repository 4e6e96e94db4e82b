import { describe, expect, it } from 'vitest';
import { formatCsv, formatCsvBytes, rowObjects } from '../../lib/io/columnTable.js';

const table = {
  rows: 3,
  columns: [
    { name: 'event', values: Float64Array.of(1, 2, 3), digits: 0 },
    { name: 'p_GeV', values: Float64Array.of(0.899377374123, NaN, -1.5e-9) },
    { name: 'label', values: ['plain', 'μ⁻ "stopping", here', 'a\nb'] },
  ],
};

describe('result tables', () => {
  it('formatCsv writes NaN as an empty cell, numbers to 10 significant digits and quotes text that needs it', () => {
    expect(formatCsv(table)).toBe('event,p_GeV,label\n1,0.8993773741,plain\n2,,"μ⁻ ""stopping"", here"\n3,-1.500000000e-9,"a\nb"\n');
  });
  it('formatCsvBytes is the UTF-8 encoding of the same text', () => {
    expect(Buffer.from(formatCsvBytes(table)).toString('utf8')).toBe(formatCsv(table));
  });
  it('rowObjects gives null for NaN', () => {
    expect(rowObjects(table)[1]).toEqual({ event: 2, p_GeV: null, label: 'μ⁻ "stopping", here' });
  });
});
