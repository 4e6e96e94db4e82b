import { expect } from 'vitest';

/**
 * Checks of an example notebook's own results, keyed by notebook file name. A notebook with a
 * check prints one line `sagitta-check {json}` (its last cell); the example-notebook test runs
 * the notebook once and hands the parsed object here. Each check names its published source.
 */
export const EXAMPLE_CHECKS: Readonly<Record<string, (r: Record<string, number>) => void>> = {
  // PDG RPP 2022: m(K⁰) = 497.611(13) MeV, m(Λ) = 1115.683(6) MeV, cτ(K⁰_S) = 2.6844 cm. The
  // fitted values must agree within two of their fitted errors (the data are one fixed seed).
  '02-cinderfell-neutral-decays.ipynb': (r) => {
    expect(Math.abs(r.kMassMeV - 497.611)).toBeLessThan(2 * r.sigmaKMassMeV);
    expect(Math.abs(r.lambdaMassMeV - 1115.683)).toBeLessThan(2 * r.sigmaLambdaMassMeV);
    expect(Math.abs(r.kCtauCm - 2.6844)).toBeLessThan(2 * r.sigmaKCtauCm);
    // The errors themselves are what a sample of ~150 decays gives: not inflated to pass.
    expect(r.sigmaKMassMeV).toBeLessThan(0.5);
    expect(r.sigmaLambdaMassMeV).toBeLessThan(0.3);
    expect(r.sigmaKCtauCm / r.kCtauCm).toBeLessThan(0.12);
  },
  // CODATA 2018: e/m_e = 1.75882001076e11 C/kg; AME 2020 isotope masses (the truth file names the ions).
  '03-larkspur-beam-tube.ipynb': (r) => {
    expect(Math.abs(r.eOverMCPerKg - 1.75882001076e11)).toBeLessThan(2 * Math.hypot(r.sigmaStatCPerKg, r.sigmaSystCPerKg));
    expect(r.sigmaStatCPerKg / r.eOverMCPerKg).toBeLessThan(0.02);
    expect(r.isotopesRight).toBe(r.isotopesTotal);
    expect(r.isotopesTotal).toBeGreaterThan(5);
  },
  // The simulator's truth (notebooks/data/fenwick.scenario.json and the truth file): a 600 MeV/c
  // beam with a 3 % spread, seen through the tracker's resolution and the helix fit's bias (both
  // measured on the beam tracks against their true momenta), on cosmic rays with γ = 2.7. The
  // fitted values must agree within two of their fitted errors (the data are one fixed seed).
  '06-fenwick-spectrum.ipynb': (r) => {
    expect(r.fitOk).toBe(1);
    expect(Math.abs(r.peakMeanMeV - r.truthMeanMeV * (1 + r.biasRelative))).toBeLessThan(2 * r.sigmaPeakMeanMeV);
    expect(Math.abs(r.peakSigmaMeV - r.truthSigmaMeV)).toBeLessThan(2 * r.sigmaPeakSigmaMeV);
    expect(Math.abs(r.peakArea - r.beamTracksInRange)).toBeLessThan(2 * r.sigmaPeakArea);
    expect(Math.abs(r.backgroundIndex - r.truthIndex)).toBeLessThan(2 * r.sigmaBackgroundIndex);
    // The bias the notebook leaves uncorrected is small beside the statistical error and the width.
    expect(Math.abs(r.biasRelative * r.truthMeanMeV)).toBeLessThan(0.5 * r.sigmaPeakMeanMeV);
    // The errors are what ~600 beam tracks of 18 MeV/c spread give (σ/√N ≈ 0.75 MeV/c): not inflated
    // to pass; the likelihood-ratio interval of the mean is within 10 % of the curvature error.
    expect(r.sigmaPeakMeanMeV).toBeLessThan(1.0);
    expect(Math.abs(r.meanScanMinus / r.sigmaPeakMeanMeV - 1)).toBeLessThan(0.1);
    expect(Math.abs(r.meanScanPlus / r.sigmaPeakMeanMeV - 1)).toBeLessThan(0.1);
    // The Baker–Cousins goodness of fit does not reject the model.
    expect(r.ndf).toBeGreaterThan(30);
    expect(r.pValue).toBeGreaterThan(0.01);
  },
};

/** The object printed on the notebook's `sagitta-check` line, or undefined. */
export function checkLine(cells: readonly { cell_type: string; outputs?: readonly { output_type: string; text?: string | string[] }[] }[]): Record<string, number> | undefined {
  for (const c of cells) {
    for (const o of c.outputs ?? []) {
      if (o.output_type !== 'stream') continue;
      const text = Array.isArray(o.text) ? o.text.join('') : o.text ?? '';
      const line = text.split('\n').find((l) => l.startsWith('sagitta-check '));
      if (line) return JSON.parse(line.slice('sagitta-check '.length)) as Record<string, number>;
    }
  }
  return undefined;
}
