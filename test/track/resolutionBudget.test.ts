import { describe, expect, it } from 'vitest';
import type { HitTable } from '../../lib/io/hitTable.js';
import { measureTracks } from '../../lib/track/measureTracks.js';
import { resolutionBudget } from '../../lib/track/resolutionBudget.js';
import { curvatureSigmaLeastSquares, momentumResolution } from '../../lib/track/resolution.js';
import { material } from '../../lib/matter/materials.js';
import { PION_PLUS } from '../../lib/particles.js';

/** Two exact arcs (R = 2 m, 20 hits over ≈ 1.2 m of arc) with 100 µm hit errors, plus a noise hit. */
function hits(): HitTable {
  const n = 20, R = 2, span = 0.6;
  const ev: number[] = [], tr: number[] = [], x: number[] = [], y: number[] = [], s: number[] = [];
  for (const [event, sign] of [[1, -1], [2, 1]] as const) {
    for (let i = 0; i < n; i++) {
      const a = Math.PI / 2 + (sign * span * i) / (n - 1);
      ev.push(event); tr.push(1); x.push(R * Math.cos(a)); y.push(-R + R * Math.sin(a)); s.push(1e-4);
    }
  }
  ev.push(3); tr.push(-1); x.push(0.1); y.push(0.1); s.push(1e-4);
  const f = (a: number[]) => Float64Array.from(a);
  return { length: ev.length, event: f(ev), track: f(tr), x: f(x), y: f(y), sigmaX: f(s), sigmaY: f(s), source: { file: '(memory)', units: {}, ignoredColumns: [] } };
}

describe('resolutionBudget (per-track error budget for sagitta fit --material)', () => {
  const h = hits();
  const tracks = measureTracks(h, { fieldT: 1.5 });
  const b = resolutionBudget(tracks, { material: material('argon-gas'), particle: PION_PLUS });

  it('has one row per track with the chord extent as length (2R sin(span/2) = 1.129 m)', () => {
    expect(b.count).toBe(2);
    expect(b.lengthM[0]).toBeCloseTo(2 * 2 * Math.sin(0.3), 9);
  });
  it('measurement term = exact least squares for the track’s hits, and agrees with the fit covariance within 5 %', () => {
    const p = tracks.momentum.ptGeV[0];
    const k = (0.299792458 * 1.5) / p;
    // Hit positions along the chord, as resolutionBudget projects them.
    const x = h.x.subarray(0, 20), y = h.y.subarray(0, 20);
    const dx = x[19] - x[0], dy = y[19] - y[0], c = Math.hypot(dx, dy);
    const s = Float64Array.from(x, (_, i) => ((x[i] - x[0]) * dx + (y[i] - y[0]) * dy) / c);
    expect(b.sigmaPMeasGeV[0]).toBeCloseTo((p * curvatureSigmaLeastSquares(s, 1e-4)) / k, 12);
    expect(Math.abs(b.sigmaPMeasGeV[0] / tracks.momentum.sigmaPtGeV[0] - 1)).toBeLessThan(0.05);
  });
  it('multiple-scattering term equals momentumResolution for the same p, β, B, L and argon gas', () => {
    const p = tracks.momentum.ptGeV[0];
    const beta = p / Math.hypot(p, PION_PLUS.massMeV / 1000);
    const r = momentumResolution({ momentumGeV: p, beta, fieldT: 1.5, lengthM: b.lengthM[0], sigmaM: 1e-4, nPoints: 20, material: material('argon-gas') });
    expect(b.sigmaPMsGeV[0] / p).toBeCloseTo(r.multipleScattering, 12);
    expect(b.sigmaPTotalGeV[0]).toBeCloseTo(Math.hypot(b.sigmaPMeasGeV[0], b.sigmaPMsGeV[0]), 15);
  });
});

describe('resolutionBudgetColumns', () => {
  it('names the columns sigma_p_meas, sigma_p_ms, sigma_p_total (issue 3)', async () => {
    const { resolutionBudgetColumns } = await import('../../lib/track/resolutionBudget.js');
    const h = hits();
    const b = resolutionBudget(measureTracks(h, { fieldT: 1.5 }), { material: material('liquid-hydrogen') });
    expect(resolutionBudgetColumns(b).map((c) => c.name)).toEqual(['sigma_p_meas_GeV_c', 'sigma_p_ms_GeV_c', 'sigma_p_total_GeV_c']);
  });
});
