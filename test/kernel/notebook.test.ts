import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { joinSource, parseNotebook, readNotebook, serializeNotebook, splitLines, upgradeNotebook, writeNotebook } from '../../kernel/notebook/index.js';
import { nbformatValidator } from './nbSchema.js';

const FIXTURE = join(import.meta.dirname, '..', 'fixtures', 'nbformat', 'minor2-no-ids.ipynb');

describe('nbformat reading and upgrading', () => {
  const validate = nbformatValidator();

  it('readNotebook(4.2 file) gives its SHA-256 and cells; the file itself does not pass 4.5 (no ids)', () => {
    const loaded = readNotebook(FIXTURE);
    expect(loaded.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(loaded.notebook.cells).toHaveLength(3);
    expect(validate(loaded.notebook).valid).toBe(false);
  });

  it('upgradeNotebook(4.2) gives a notebook valid against the official v4.5 schema, with stable ids', () => {
    const nb = readNotebook(FIXTURE).notebook;
    const up = upgradeNotebook(nb);
    const result = validate(up);
    expect(result.errors).toEqual([]);
    expect(up.nbformat_minor).toBe(5);
    expect(up.cells.every((c) => typeof c.id === 'string')).toBe(true);
    expect(upgradeNotebook(nb).cells.map((c) => c.id)).toEqual(up.cells.map((c) => c.id));
    expect(nb.cells[0].id).toBeUndefined(); // input untouched
  });

  it('parseNotebook(truncated text) names the file and says it is not valid JSON', () => {
    const text = readFileSync(FIXTURE, 'utf8');
    expect(() => parseNotebook(text.slice(0, 200), 'cut.ipynb')).toThrow(/^cut\.ipynb: is not valid JSON/);
  });

  it('parseNotebook rejects nbformat 3 and a bad cell type with the cell number', () => {
    expect(() => parseNotebook('{"nbformat":3,"nbformat_minor":0,"metadata":{},"worksheets":[]}', 'a.ipynb')).toThrow(/nbformat 3 is not supported/);
    expect(() => parseNotebook('{"nbformat":4,"nbformat_minor":4,"metadata":{},"cells":[{"cell_type":"code","source":"","metadata":{},"outputs":[]},{"cell_type":"widget","source":"","metadata":{}}]}', 'b.ipynb')).toThrow(/cell 2 has cell_type "widget"/);
  });

  it('writeNotebook writes atomically (no temp file left) and round-trips', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-nb-'));
    const out = join(dir, 'out.ipynb');
    const up = upgradeNotebook(readNotebook(FIXTURE).notebook);
    writeNotebook(out, up);
    expect(readdirSync(dir)).toEqual(['out.ipynb']);
    expect(readFileSync(out, 'utf8')).toBe(serializeNotebook(up));
    expect(parseNotebook(readFileSync(out, 'utf8'), out)).toEqual(up);
    writeFileSync(out, 'x');
    writeNotebook(out, up);
    expect(readFileSync(out, 'utf8')).toBe(serializeNotebook(up));
  });

  it('joinSource and splitLines are inverse on text with newlines', () => {
    expect(joinSource(['a\n', 'b'])).toBe('a\nb');
    expect(splitLines('a\nb\n')).toEqual(['a\n', 'b\n']);
    expect(splitLines('')).toEqual([]);
  });
});
