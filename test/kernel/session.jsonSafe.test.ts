/** The one JSON rule for cell outputs (kernel/session/jsonSafeBundle.ts), used by the live kernel and `sagitta run` alike. */
import { describe, expect, it } from 'vitest';
import { jsonSafeBundle } from '../../kernel/session/jsonSafeBundle.js';

describe('jsonSafeBundle', () => {
  it('copies each representation through JSON: BigInt as text, NaN as null, undefined members dropped', () => {
    const spec = { data: [{ x: [1, NaN, Infinity], n: 12n, skip: undefined }] };
    const out = jsonSafeBundle({ 'application/vnd.plotly.v1+json': spec, 'text/plain': 'figure', 'text/html': undefined });
    expect(out).toEqual({ 'application/vnd.plotly.v1+json': { data: [{ x: [1, null, null], n: '12' }] }, 'text/plain': 'figure' });
    expect(out['application/vnd.plotly.v1+json']).not.toBe(spec);
  });

  it('a representation JSON cannot hold (a cycle) becomes its text form; the others are kept', () => {
    const cyclic: Record<string, unknown> = { label: 'loop' };
    cyclic.self = cyclic;
    const out = jsonSafeBundle({ 'application/json': cyclic, 'text/plain': 'loop' });
    expect(out).toEqual({ 'application/json': '[object Object]', 'text/plain': 'loop' });
  });
});
