// lib/analysis: statistics and spectra (re-exports only).
export { binCounts, type BinnedCounts } from './binCounts.js';
export { chi2Survival } from './chi2Survival.js';
export { lnGamma } from './lnGamma.js';
