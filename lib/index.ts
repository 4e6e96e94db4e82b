// The public API of Sagitta: re-exports only (STYLE.md §1). Rooms are listed in data-flow order.
export * from './errors.js';
export * from './warnings.js';
export * from './constants.js';
export * from './particles.js';
export * from './units.js';
export * from './provenance.js';
export * from './display.js';
export * from './io/index.js';
export * from './find/index.js';
export * from './fit/index.js';
export * from './track/index.js';
export * from './analysis/index.js';
export * from './plot/index.js';
export * from './matter/index.js';
export * from './simulate/index.js';
export * from './fitlab/index.js';
