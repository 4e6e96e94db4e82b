import { particle as lookupParticle } from '../particles.js';
import type { TrackIdentity } from '../track/identifyTrack.js';
import { predictedCurvature } from '../track/profileAlongTrack.js';
import { speciesRange, type SpeciesRange } from '../track/speciesRange.js';
import type { Figure } from './figure.js';
import { xyFigure, type XYSeries } from './xyFigure.js';

/** A lib/matter material (the type as lib/track carries it, so lib/plot imports no matter). */
type Material = SpeciesRange['material'];

/**
 * Curvature along one track: each segment's |κ| [1/m] with its measurement error at its
 * mid-path, and for each hypothesis of `identity` the curvature its fitted CSDA profile predicts
 * (κ = 0.2998·B/(p_h(R_end − s)·cos λ), mean dip of the segments). The species are the
 * identity's (measured charge sign); the figure's title names the choice and its −2 ln L margin.
 * @example curvatureAlongTrackFigure(ids.identities[0], material('liquid-propane'), 2)
 */
export function curvatureAlongTrackFigure(identity: TrackIdentity, material: Material, fieldT: number, options: { title?: string } = {}): Figure {
  const seg = identity.segments;
  const kappa = Float64Array.from(seg.kappa, Math.abs);
  let cos = 0;
  for (let j = 0; j < seg.count; j++) cos += seg.cosLambda[j] / seg.count;
  const sEnd = seg.pathM[seg.pathM.length - 1];
  const series: XYSeries[] = [{ x: seg.pathMidM, y: kappa, yError: seg.sigmaKappa, name: 'segments (hit errors)' }];
  const grid = Float64Array.from({ length: 60 }, (_, i) => (sEnd * i) / 59);
  for (const h of identity.hypotheses) {
    if (!Number.isFinite(h.rangeEndM)) continue;
    const k = predictedCurvature(speciesRange(lookupParticle(h.species), material), h.rangeEndM, grid, { fieldT, cosLambda: cos || 1 });
    series.push({ x: grid, y: k, name: Number.isFinite(h.m2lnL) ? `${h.species} (−2 ln L ${h.m2lnL.toFixed(1)})` : `${h.species} (ruled out${h.fitStatus === 'cannot-reach' || h.fitStatus === 'diverged' ? `: fit with material ${h.fitStatus}` : ''})`, style: 'line' });
  }
  const margin = Number.isFinite(identity.deltaM2lnL) ? `, Δ(−2 ln L) = ${identity.deltaM2lnL.toFixed(1)}` : '';
  return xyFigure(series, {
    title: options.title ?? `Curvature along the track: ${identity.pid}${margin}`,
    xTitle: 'path from the first hit [m]',
    yTitle: '|κ| [1/m]',
  });
}
