import { describe, expect, it } from 'vitest';
import { BUILT_IN_FIT_METHODS } from '../../lib/fit/index.js';
import { compareFitters, fitLabSample, fitLabTables } from '../../lib/fitlab/index.js';

describe('fitLabTables(report)', () => {
  it('gives danfojs DataFrames: one summary row per fitter, one row per fitter and bin', () => {
    const s = fitLabSample({ tracks: 200, momentumGeV: [0.5, 5], lengthsM: [0.5, 1], hitsPerTrack: 20, sigmaM: 3e-4, fieldT: 1.5, seed: 9 });
    const r = compareFitters(BUILT_IN_FIT_METHODS, s, { momentumEdgesGeV: [0.5, 1, 2, 5] });
    const t = fitLabTables(r);
    expect(t.summary.shape).toEqual([3, 15]);
    expect(t.summary.column('fitter').values).toEqual(['geometric', 'taubin', 'kasa']);
    expect(t.byMomentum.shape[0]).toBe(9);
    expect(t.byLength.shape[0]).toBe(6);
  });
});
