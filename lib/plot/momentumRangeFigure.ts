import type { Particle } from '../particles.js';
import { speciesRange, type SpeciesRange } from '../track/speciesRange.js';
import type { Figure } from './figure.js';
import { xyFigure, type XYSeries } from './xyFigure.js';

/** A lib/matter material (the type as lib/track carries it, so lib/plot imports no matter). */
type Material = SpeciesRange['material'];

/** Measured points of one group (e.g. one true or chosen species). */
export interface MomentumRangePoints {
  readonly name: string;
  /** Residual range [m] and momentum [GeV/c] (e.g. from `momentumAgainstResidualRange`). */
  readonly residualRangeM: ArrayLike<number>;
  readonly pGeV: ArrayLike<number>;
  readonly sigmaPGeV?: ArrayLike<number>;
}

/**
 * Momentum against residual range: measured points (segment momenta of stopping tracks) and,
 * for each species, the CSDA range–momentum curve of lib/matter in `material` (research values;
 * not for treatment planning). Log–log axes, residual range in metres, momentum in MeV/c.
 * @example momentumRangeFigure([{ name: 'track 3', ...momentumAgainstResidualRange(seg, { fieldT: 2 }) }], [PROTON, MUON_PLUS], material('liquid-propane'))
 */
export function momentumRangeFigure(points: readonly MomentumRangePoints[], species: readonly Particle[], material: Material, options: { maxRangeM?: number; title?: string } = {}): Figure {
  let maxR = options.maxRangeM ?? 0;
  if (!(maxR > 0)) for (const p of points) for (let i = 0; i < p.residualRangeM.length; i++) maxR = Math.max(maxR, p.residualRangeM[i]);
  if (!(maxR > 0)) maxR = 1;
  const series: XYSeries[] = points.map((p) => ({
    x: p.residualRangeM,
    y: Array.from(p.pGeV, (v) => v * 1000),
    yError: p.sigmaPGeV ? Array.from(p.sigmaPGeV, (v) => v * 1000) : undefined,
    name: p.name,
  }));
  const grid = Float64Array.from({ length: 50 }, (_, i) => maxR * 1.2 * 10 ** (-2.5 + (2.5 * i) / 49));
  for (const s of species) {
    const r = speciesRange(s, material);
    series.push({ x: grid, y: Array.from(grid, (g) => r.momentumGeV(g) * 1000), name: `${s.name} (CSDA, ${material.name})`, style: 'line' });
  }
  return xyFigure(series, {
    title: options.title ?? `Momentum against residual range in ${material.name}`,
    xTitle: 'residual range [m]',
    yTitle: 'p [MeV/c]',
    xScale: 'log',
    yScale: 'log',
  });
}
