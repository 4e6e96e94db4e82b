import type { SpeciesRange } from './speciesRange.js';

/**
 * Momentum [GeV/c] at the first hit of a stopping track from its length alone: the CSDA
 * momentum whose range is the path from the first hit to the stop, p = p_h(L + spacing/2)
 * (the stop lies uniformly within one hit spacing beyond the last hit), with
 * σ_p = (dp/dR)·√(σ_R² + spacing²/12), σ_R the range straggling of `speciesRange`. Valid for a
 * particle that stops in the medium without interacting; same sources as `speciesRange`.
 * @example initialMomentumFromRange(speciesRange(PROTON, material('liquid-propane')), 0.3, 0.005)
 */
export function initialMomentumFromRange(range: SpeciesRange, pathToLastHitM: number, spacingM: number): { pGeV: number; sigmaPGeV: number } {
  const r = pathToLastHitM + 0.5 * spacingM;
  const p = range.momentumGeV(r);
  const h = 1e-3 * r;
  const dpdr = (range.momentumGeV(r + h) - range.momentumGeV(r - h)) / (2 * h);
  const sr = Math.hypot(range.rangeSigmaM(r), spacingM / Math.sqrt(12));
  return { pGeV: p, sigmaPGeV: dpdr * sr };
}
