import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BUILTIN_FITTERS, compareFitters, fitLabSample, meritFigure, pullFigure, pValueFigure } from '../../lib/fitlab/index';

/**
 * Golden files for the fit-lab figures (STYLE.md §10): plotly JSON with numbers rounded to 4
 * significant digits, from a fixed seed. Set SAGITTA_UPDATE_GOLDEN=1 to rewrite them after a
 * deliberate change, then review the diff before committing.
 */
function round(value: unknown): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? Number(value.toPrecision(4)) : String(value);
  if (Array.isArray(value)) return value.map(round);
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, round(v)]));
  return value;
}

function expectGolden(name: string, figure: unknown): void {
  const text = JSON.stringify(round(figure), null, 1) + '\n';
  const file = join(import.meta.dirname, 'golden', name);
  if (process.env.SAGITTA_UPDATE_GOLDEN === '1' || !existsSync(file)) {
    writeFileSync(file, text);
    if (process.env.SAGITTA_UPDATE_GOLDEN !== '1') throw new Error(`golden file ${name} was missing and has been written; review and commit it`);
    return;
  }
  expect(text).toBe(readFileSync(file, 'utf8'));
}

describe('fit-lab figures match their golden files', () => {
  const sample = fitLabSample({ tracks: 400, momentumGeV: [0.3, 5], lengthsM: [0.5, 1], hitsPerTrack: 25, sigmaM: 3e-4, fieldT: 1.5, seed: 2026 });
  const report = compareFitters(BUILTIN_FITTERS, sample, { momentumEdgesGeV: [0.3, 1, 2, 5] });
  it('pullFigure', () => expectGolden('pull-figure.json', pullFigure(report, 20, 5)));
  it('pValueFigure', () => expectGolden('p-value-figure.json', pValueFigure(report, 10)));
  it('meritFigure (σ(p)/p vs momentum)', () => expectGolden('resolution-vs-momentum.json', meritFigure(report, 'momentum', 'momentumResolution')));
});
