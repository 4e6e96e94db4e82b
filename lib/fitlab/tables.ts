import type { DataFrame } from 'danfojs-node';
import { loadDanfo } from '../io/hitsToDataFrame.js';
import type { FitLabReport } from './compare.js';

/**
 * The report's tables as danfojs DataFrames for notebooks (danfojs is loaded on first use):
 * `summary` (one row per fitter, with tracks per second), `byMomentum` and `byLength`
 * (one row per fitter and bin). Column names as in `FitMerit`; NaN stays NaN.
 */
export function fitLabTables(report: FitLabReport): { summary: DataFrame; byMomentum: DataFrame; byLength: DataFrame } {
  const { DataFrame: Frame } = loadDanfo();
  const frame = (rows: readonly object[]) => new Frame(rows.map((r) => ({ ...r })));
  return { summary: frame(report.summary), byMomentum: frame(report.byMomentum), byLength: frame(report.byLength) };
}
