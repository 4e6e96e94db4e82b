import { beforeEach, describe, expect, it } from 'vitest';
import { consumeWarnings, formatWarning, warn, WARNING_CODES } from '../lib/warnings.js';

beforeEach(() => void consumeWarnings());

describe('warn / consumeWarnings', () => {
  it('counts a repeated (code, message) pair once with its count, and drains on consume', () => {
    warn('OUTSIDE_TABLE', 'rangeAt: T = 1e9 MeV is outside the table', 'rangeAt');
    warn('OUTSIDE_TABLE', 'rangeAt: T = 1e9 MeV is outside the table', 'rangeAt');
    warn('APPROXIMATION', 'another', 'test');
    const got = consumeWarnings();
    expect(got.map((w) => [w.code, w.count])).toEqual([['OUTSIDE_TABLE', 2], ['APPROXIMATION', 1]]);
    expect(formatWarning(got[0])).toBe('warning [OUTSIDE_TABLE]: rangeAt: T = 1e9 MeV is outside the table (×2)');
    expect(consumeWarnings()).toEqual([]);
  });

  it('every code in the catalogue has a description', () => {
    for (const [code, text] of Object.entries(WARNING_CODES)) expect([code, text.length > 20]).toEqual([code, true]);
  });
});
