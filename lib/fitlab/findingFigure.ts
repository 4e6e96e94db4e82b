import { xyFigure } from '../plot/xyFigure.js';
import type { Figure } from '../plot/figure.js';
import type { FindingBin, FindingLabReport } from './findingLab.js';

/**
 * Finding efficiency against transverse momentum, dip or tracks per event, one series per
 * noise level, with binomial error bars.
 * @example findingFigure(findingLab({ scenario, seed: 1 }), 'pt')
 */
export function findingFigure(report: FindingLabReport, by: 'pt' | 'tanLambda' | 'multiplicity'): Figure {
  const rows: readonly FindingBin[] = by === 'pt' ? report.byPt : by === 'tanLambda' ? report.byTanLambda : report.byMultiplicity;
  const levels = [...new Set(rows.map((r) => r.noiseFraction))];
  const series = levels.map((f) => {
    const r = rows.filter((b) => b.noiseFraction === f && b.trueTracks > 0);
    return { x: r.map((b) => b.centre), y: r.map((b) => b.efficiency), yError: r.map((b) => b.efficiencyError), name: `${(100 * f).toFixed(0)} % noise hits`, style: 'both' as const };
  });
  const xTitle = by === 'pt' ? 'true p_T [GeV/c]' : by === 'tanLambda' ? 'true tan λ' : 'true tracks per event';
  return xyFigure(series, { title: 'Track-finding efficiency', xTitle, yTitle: 'found fraction', xScale: by === 'pt' ? 'log' : 'linear' });
}
