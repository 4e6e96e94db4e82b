import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../lib/simulate/index.js';
import { jsonPointerLines, withLines } from '../../lib/simulate/jsonPointerLines.js';
import { readFileSync } from 'node:fs';

describe('jsonPointerLines / withLines', () => {
  it('maps RFC 6901 pointers (with ~0 and ~1 escapes) to the line of each value', () => {
    const text = '{\n  "a": [1,\n    2],\n  "b/c": {"d~e":\n "x"},\n  "e": {}\n}';
    const lines = jsonPointerLines(text);
    expect(lines.get('')).toBe(1);
    expect(lines.get('/a')).toBe(2);
    expect(lines.get('/a/1')).toBe(3);
    expect(lines.get('/b~1c/d~0e')).toBe(5);
    expect(lines.get('/e')).toBe(6);
    expect(withLines('f.json: /a/1: bad; /zz: also', lines)).toBe('f.json: /a/1 (line 3): bad; /zz: also');
  });

  it('scenario errors carry the line of the bad field', () => {
    const text = readFileSync(new URL('../../notebooks/data/brindlemoor.scenario.json', import.meta.url), 'utf8')
      .replace('"momentum": "700 MeV/c"', '"momentum": "700 MeV/s"');
    const line = text.split('\n').findIndex((l) => l.includes('700 MeV/s')) + 1;
    expect(() => parseScenario(text, 'b.json')).toThrow(new RegExp(`^b\\.json: /sources/1/momentum \\(line ${line}\\): `));
  });
});
