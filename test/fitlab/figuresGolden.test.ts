import { join } from 'node:path';
import { describe, it } from 'vitest';
import { expectGolden } from '../expectGolden.js';
import { BUILTIN_FITTERS, compareFitters, fitLabSample, meritFigure, pullFigure, pValueFigure } from '../../lib/fitlab/index.js';

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

function expectFigure(name: string, figure: unknown): void {
  expectGolden(join(import.meta.dirname, 'golden', name), JSON.stringify(round(figure), null, 1) + '\n');
}

describe('fit-lab figures match their golden files', () => {
  const sample = fitLabSample({ tracks: 400, momentumGeV: [0.3, 5], lengthsM: [0.5, 1], hitsPerTrack: 25, sigmaM: 3e-4, fieldT: 1.5, seed: 2026 });
  const report = compareFitters(BUILTIN_FITTERS, sample, { momentumEdgesGeV: [0.3, 1, 2, 5] });
  it('pullFigure', () => expectFigure('pull-figure.json', pullFigure(report, 20, 5)));
  it('pValueFigure', () => expectFigure('p-value-figure.json', pValueFigure(report, 10)));
  it('meritFigure (σ(p)/p vs momentum)', () => expectFigure('resolution-vs-momentum.json', meritFigure(report, 'momentum', 'momentumResolution')));
});
