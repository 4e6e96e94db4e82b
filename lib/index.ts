// The public API of Sagitta: re-exports only (STYLE.md §1). Rooms are listed in data-flow order.
export * from './errors';
export * from './warnings';
export * from './constants';
export * from './particles';
export * from './units';
export * from './provenance';
export * from './io/index';
export * from './fit/index';
export * from './track/index';
export * from './plot/index';
export * from './matter/index';
export * from './simulate/index';
export * from './fitlab/index';
