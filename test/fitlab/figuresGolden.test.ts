import { join } from 'node:path';
import { describe, it } from 'vitest';
import { expectGolden } from '../expectGolden.js';
import { meritFigure, pullFigure, pValueFigure, type FitLabReport, type FitterTrackColumns } from '../../lib/fitlab/index.js';

/**
 * Golden files for the fit-lab figures (STYLE.md §10, §20): each figure is drawn from a small
 * hand-made report (two methods, eight tracks, fixed numbers), so a golden file tests the figure
 * code alone — not the simulator, the random numbers or the fits. Numbers rounded to 4 digits.
 */
function round(value: unknown): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? Number(value.toPrecision(4)) : String(value);
  if (Array.isArray(value)) return value.map(round);
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, round(v)]));
  return value;
}

function expectFigure(name: string, figure: unknown): void {
  // Arrays of plain values on one line each, so a golden file reads as the figure's structure.
  const text = JSON.stringify(round(figure), null, 1).replace(/\[\s+((?:-?[\d.e+-]+|"[^"]*"|null)(?:,\s+(?:-?[\d.e+-]+|"[^"]*"|null))*)\s+\]/g, (_, inner: string) => `[${inner.split(/,\s+/).join(', ')}]`);
  expectGolden(join(import.meta.dirname, 'golden', name), text + '\n');
}

function columns(pull: number[], pValue: number[]): FitterTrackColumns {
  const f = (a: number[]) => Float64Array.from(a);
  const nan = f(pull.map(() => NaN));
  return { kappa: nan, sigmaKappa: nan, chi2: nan, ndf: nan, pValue: f(pValue), pull: f(pull), tanLambda: nan, tanLambdaPull: nan, ok: Uint8Array.from(pull, () => 1) };
}

function merit(fitter: string, low: number, high: number, momentumResolution: number) {
  return {
    fitter, tracks: 4, failures: 0, failureRate: 0, kappaBias: 0, kappaResolution: 0, momentumBias: 0, momentumResolution,
    pullMean: 0, pullWidth: 1, chi2PerNdf: 1, pValueBelow5Percent: 0.05, tanLambdaResolution: NaN, tanLambdaPullWidth: NaN,
    low, high, centre: Math.sqrt(low * high),
  };
}

const REPORT = {
  fitters: ['alpha', 'beta'],
  summary: [
    { ...merit('alpha', 0.3, 5, 0.02), pullMean: 0.05, pullWidth: 0.98, tracksPerSecond: 1e6 },
    { ...merit('beta', 0.3, 5, 0.03), pullMean: -0.1, pullWidth: 1.2, tracksPerSecond: 2e6 },
  ],
  byMomentum: [merit('alpha', 0.3, 1, 0.01), merit('alpha', 1, 5, 0.03), merit('beta', 0.3, 1, 0.015), merit('beta', 1, 5, NaN)],
  byLength: [],
  perTrack: {
    alpha: columns([-1.5, -0.5, -0.2, 0, 0.1, 0.4, 0.9, 2.2], [0.05, 0.15, 0.3, 0.45, 0.5, 0.62, 0.8, 0.95]),
    beta: columns([-2.5, -1, -0.6, -0.1, 0.3, 0.7, 1.4, 7], [0.01, 0.02, 0.2, 0.4, 0.55, 0.7, 0.85, 0.99]),
  },
  sample: { count: 8 },
} as unknown as FitLabReport;

describe('fit-lab figures match their golden files (drawn from a fixed hand-made report)', () => {
  it('pullFigure: one step line per method (a pull outside ±range is left out) and the unit Gaussian', () => expectFigure('pull-figure.json', pullFigure(REPORT, 4, 3)));
  it('pValueFigure: one step line per method and the flat expectation', () => expectFigure('p-value-figure.json', pValueFigure(REPORT, 4)));
  it('meritFigure: σ(p)/p against momentum, a NaN bin drawn as a gap', () => expectFigure('resolution-vs-momentum.json', meritFigure(REPORT, 'momentum', 'momentumResolution')));
});
